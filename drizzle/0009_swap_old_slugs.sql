CREATE TABLE `swap_old_slugs` (
	`slug` text PRIMARY KEY NOT NULL,
	`swap_id` integer NOT NULL,
	`retired_at` integer NOT NULL,
	FOREIGN KEY (`swap_id`) REFERENCES `swaps`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `swap_old_slugs_swap_idx` ON `swap_old_slugs` (`swap_id`);