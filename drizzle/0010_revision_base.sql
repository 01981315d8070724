ALTER TABLE `revisions` ADD `based_on_revision_id` integer REFERENCES revisions(id) ON DELETE set null;
