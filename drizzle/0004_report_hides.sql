CREATE TABLE `report_hides` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`swap_id` integer NOT NULL,
	`user_id` integer NOT NULL,
	`hidden_by_id` integer,
	`created_at` integer NOT NULL,
	`lifted_at` integer,
	`lifted_by_id` integer,
	FOREIGN KEY (`swap_id`) REFERENCES `swaps`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`hidden_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`lifted_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `report_hides_active_uq` ON `report_hides` (`swap_id`,`user_id`) WHERE lifted_at is null;--> statement-breakpoint
-- reports hidden before hiding became a record of its own keep their hide
INSERT INTO `report_hides` (`swap_id`, `user_id`, `hidden_by_id`, `created_at`)
SELECT `swap_id`, `user_id`, `hidden_by_id`, `hidden_at` FROM `fitted_reports` WHERE `hidden_at` IS NOT NULL;
