-- An older database may hold several open flags by one member on one swap (a flood); the oldest stays
-- open, the others are resolved as duplicates of it, so the unique index below can be built.
UPDATE `flags` SET `status` = 'resolved', `resolution_note` = 'Closed as a duplicate when one open flag per member and swap became a rule: the member''s earlier open flag on this swap was kept.', `resolved_at` = `updated_at`
WHERE `status` = 'open'
  AND `id` NOT IN (SELECT min(`id`) FROM `flags` WHERE `status` = 'open' GROUP BY `swap_id`, `reporter_id`);
--> statement-breakpoint
CREATE UNIQUE INDEX `flags_one_open_per_reporter_uq` ON `flags` (`swap_id`,`reporter_id`) WHERE status = 'open';
