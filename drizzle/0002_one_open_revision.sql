-- Requests that raced past the old check could leave one member with several open revisions of a swap;
-- the newest stays open, the others are closed with a note, so the unique index below can be built.
UPDATE `revisions` SET `status` = 'declined', `review_note` = 'Closed when one open revision per member and swap became a rule: a newer open revision of this swap by the same member was kept.'
WHERE `status` IN ('draft', 'sent_back', 'in_review')
  AND `id` NOT IN (SELECT max(`id`) FROM `revisions` WHERE `status` IN ('draft', 'sent_back', 'in_review') GROUP BY `swap_id`, `author_id`);
--> statement-breakpoint
CREATE UNIQUE INDEX `revisions_one_open_per_author_uq` ON `revisions` (`swap_id`,`author_id`) WHERE status in ('draft', 'sent_back', 'in_review');
