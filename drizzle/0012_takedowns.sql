CREATE TABLE `takedowns` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`swap_id` integer NOT NULL,
	`revision_id` integer NOT NULL,
	`target` text NOT NULL,
	`photo_sha256` text DEFAULT '' NOT NULL,
	`photo_file_id` text,
	`reason` text NOT NULL,
	`created_by_id` integer NOT NULL,
	`created_at` integer NOT NULL,
	`reverted_at` integer,
	`reverted_by_id` integer,
	FOREIGN KEY (`swap_id`) REFERENCES `swaps`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reverted_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `takedowns_swap_idx` ON `takedowns` (`swap_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `takedowns_active_uq` ON `takedowns` (`swap_id`,`target`,`photo_sha256`,`revision_id`) WHERE reverted_at is null;