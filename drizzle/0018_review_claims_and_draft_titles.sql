CREATE TABLE `review_claims` (
	`revision_id` integer PRIMARY KEY NOT NULL,
	`moderator_id` integer NOT NULL,
	`claimed_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`moderator_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `review_claims_moderator_idx` ON `review_claims` (`moderator_id`);--> statement-breakpoint
-- A member's open new swaps that already share a title keep the oldest as it is; the others get their id added
-- to the title (nothing else changes), so the unique index below can be built.
UPDATE `revisions`
SET `data` = json_set(`data`, '$.title', substr(json_extract(`data`, '$.title'), 1, 104) || ' (copy ' || `id` || ')')
WHERE `status` IN ('draft', 'sent_back', 'in_review') AND `number` = 1
  AND `id` NOT IN (
    SELECT min(`id`) FROM `revisions`
    WHERE `status` IN ('draft', 'sent_back', 'in_review') AND `number` = 1
    GROUP BY `author_id`, lower(json_extract(`data`, '$.title'))
  );--> statement-breakpoint
CREATE UNIQUE INDEX `revisions_one_title_per_author_uq` ON `revisions` (`author_id`, lower(json_extract(`data`, '$.title'))) WHERE status in ('draft', 'sent_back', 'in_review') and number = 1;
