CREATE TABLE `catalogue_changes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`subject` text NOT NULL,
	`subject_id` integer NOT NULL,
	`subject_label` text NOT NULL,
	`actor_id` integer,
	`action` text NOT NULL,
	`field` text,
	`from_value` text,
	`to_value` text,
	`at` integer NOT NULL,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `catalogue_changes_subject_idx` ON `catalogue_changes` (`subject`,`subject_id`);--> statement-breakpoint
CREATE INDEX `catalogue_changes_at_idx` ON `catalogue_changes` (`at`);--> statement-breakpoint
-- Parts kept as plain hardware before the catalogue had kinds for them take the kind their name says; nothing
-- else about them changes. Only unambiguous names move; the rest stay hardware for an admin to sort.
UPDATE `parts` SET `kind` = 'wheel_fastener'
WHERE `kind` = 'hardware' AND (lower(`name`) LIKE 'wheel bolt%' OR lower(`name`) LIKE 'wheel stud%' OR lower(`name`) LIKE 'wheel nut%');--> statement-breakpoint
UPDATE `parts` SET `kind` = 'anti_roll_bar'
WHERE `kind` = 'hardware' AND (lower(`name`) LIKE '%anti-roll bar%' OR lower(`name`) LIKE '%anti roll bar%');--> statement-breakpoint
UPDATE `parts` SET `kind` = 'thread_insert' WHERE `kind` = 'hardware' AND lower(`name`) LIKE '%thread insert%';--> statement-breakpoint
-- part lines of every revision that point at a catalogue part say the kind the catalogue now gives it
UPDATE `revisions` SET `data` = json_set(`data`, '$.parts', (
	SELECT json_group_array(CASE WHEN p.`id` IS NULL THEN json(l.`value`) ELSE json_set(l.`value`, '$.kind', p.`kind`) END ORDER BY l.`key`)
	FROM json_each(`revisions`.`data`, '$.parts') l
	LEFT JOIN `parts` p ON p.`id` = json_extract(l.`value`, '$.partId')
))
WHERE EXISTS (
	SELECT 1 FROM json_each(`revisions`.`data`, '$.parts') l
	JOIN `parts` p ON p.`id` = json_extract(l.`value`, '$.partId')
	WHERE json_extract(l.`value`, '$.kind') <> p.`kind`
);
