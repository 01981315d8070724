CREATE TABLE `part_number_keys` (
	`part_id` integer NOT NULL,
	`source` text NOT NULL,
	`key` text NOT NULL,
	`number` text NOT NULL,
	PRIMARY KEY(`part_id`, `source`, `key`),
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `part_number_keys_key_idx` ON `part_number_keys` (`key`,`source`);--> statement-breakpoint
CREATE TABLE `revision_parts` (
	`revision_id` integer NOT NULL,
	`position` integer NOT NULL,
	`part_id` integer NOT NULL,
	PRIMARY KEY(`revision_id`, `position`),
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `revision_parts_part_idx` ON `revision_parts` (`part_id`,`revision_id`);--> statement-breakpoint
-- The lookup tables are written only here, from the rows they index (see server/db/schema/interchange.ts).
CREATE TRIGGER `revision_parts_on_insert` AFTER INSERT ON `revisions` BEGIN
	INSERT INTO `revision_parts` (`revision_id`, `position`, `part_id`)
	SELECT new.`id`, p.`key`, json_extract(p.`value`, '$.partId') FROM json_each(new.`data`, '$.parts') p
	WHERE json_type(p.`value`, '$.partId') = 'integer';
END;--> statement-breakpoint
CREATE TRIGGER `revision_parts_on_update` AFTER UPDATE OF `data` ON `revisions` BEGIN
	DELETE FROM `revision_parts` WHERE `revision_id` = old.`id`;
	INSERT INTO `revision_parts` (`revision_id`, `position`, `part_id`)
	SELECT new.`id`, p.`key`, json_extract(p.`value`, '$.partId') FROM json_each(new.`data`, '$.parts') p
	WHERE json_type(p.`value`, '$.partId') = 'integer';
END;--> statement-breakpoint
CREATE TRIGGER `part_number_keys_on_insert` AFTER INSERT ON `parts` BEGIN
	INSERT OR IGNORE INTO `part_number_keys` (`part_id`, `source`, `key`, `number`)
	SELECT new.`id`, 'number', part_number_key(j.`value`), j.`value` FROM json_each(new.`part_numbers`) j
	WHERE part_number_key(j.`value`) <> '';
	INSERT OR IGNORE INTO `part_number_keys` (`part_id`, `source`, `key`, `number`)
	SELECT new.`id`, 'stamp', part_number_key(j.`value`), j.`value` FROM json_each(part_numbers_in(new.`notes`)) j
	WHERE part_number_key(j.`value`) <> '';
END;--> statement-breakpoint
CREATE TRIGGER `part_number_keys_on_update` AFTER UPDATE OF `part_numbers`, `notes` ON `parts` BEGIN
	DELETE FROM `part_number_keys` WHERE `part_id` = old.`id`;
	INSERT OR IGNORE INTO `part_number_keys` (`part_id`, `source`, `key`, `number`)
	SELECT new.`id`, 'number', part_number_key(j.`value`), j.`value` FROM json_each(new.`part_numbers`) j
	WHERE part_number_key(j.`value`) <> '';
	INSERT OR IGNORE INTO `part_number_keys` (`part_id`, `source`, `key`, `number`)
	SELECT new.`id`, 'stamp', part_number_key(j.`value`), j.`value` FROM json_each(part_numbers_in(new.`notes`)) j
	WHERE part_number_key(j.`value`) <> '';
END;--> statement-breakpoint
INSERT INTO `revision_parts` (`revision_id`, `position`, `part_id`)
SELECT r.`id`, p.`key`, json_extract(p.`value`, '$.partId') FROM `revisions` r, json_each(r.`data`, '$.parts') p
WHERE json_type(p.`value`, '$.partId') = 'integer';--> statement-breakpoint
INSERT OR IGNORE INTO `part_number_keys` (`part_id`, `source`, `key`, `number`)
SELECT p.`id`, 'number', part_number_key(j.`value`), j.`value` FROM `parts` p, json_each(p.`part_numbers`) j
WHERE part_number_key(j.`value`) <> '';--> statement-breakpoint
INSERT OR IGNORE INTO `part_number_keys` (`part_id`, `source`, `key`, `number`)
SELECT p.`id`, 'stamp', part_number_key(j.`value`), j.`value` FROM `parts` p, json_each(part_numbers_in(p.`notes`)) j
WHERE part_number_key(j.`value`) <> '';
