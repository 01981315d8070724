CREATE TABLE `sessions` (
	`sid` text PRIMARY KEY NOT NULL,
	`user_id` integer,
	`data` text NOT NULL,
	`expires_at` integer NOT NULL,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `sessions_expires_idx` ON `sessions` (`expires_at`);--> statement-breakpoint
CREATE INDEX `sessions_user_idx` ON `sessions` (`user_id`);--> statement-breakpoint
CREATE TABLE `shops` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`slug` text NOT NULL,
	`name` text NOT NULL,
	`town` text DEFAULT '' NOT NULL,
	`website` text DEFAULT '' NOT NULL,
	`about` text DEFAULT '' NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `shops_slug_unique` ON `shops` (`slug`);--> statement-breakpoint
CREATE TABLE `user_changes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`actor_id` integer,
	`field` text NOT NULL,
	`from_value` text,
	`to_value` text,
	`at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `user_changes_user_idx` ON `user_changes` (`user_id`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`provider` text NOT NULL,
	`provider_id` text NOT NULL,
	`login` text NOT NULL,
	`name` text DEFAULT '' NOT NULL,
	`email` text,
	`avatar_url` text,
	`role` text DEFAULT 'member' NOT NULL,
	`shop_id` integer,
	`units` text DEFAULT 'metric' NOT NULL,
	`suspended_at` integer,
	`last_sign_in_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_provider_id_uq` ON `users` (`provider`,`provider_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `users_login_uq` ON `users` (`login`);--> statement-breakpoint
CREATE TABLE `chassis` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`slug` text NOT NULL,
	`make` text NOT NULL,
	`model` text NOT NULL,
	`code` text NOT NULL,
	`year_from` integer NOT NULL,
	`year_to` integer,
	`body` text DEFAULT '' NOT NULL,
	`lug_count` integer NOT NULL,
	`pcd_mm` real NOT NULL,
	`centre_bore_mm` real NOT NULL,
	`wheel_bolt_thread` text NOT NULL,
	`stock_wheel` text NOT NULL,
	`stock_brakes` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`proposed` integer DEFAULT false NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `chassis_slug_unique` ON `chassis` (`slug`);--> statement-breakpoint
CREATE TABLE `parts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`slug` text NOT NULL,
	`kind` text NOT NULL,
	`name` text NOT NULL,
	`maker` text DEFAULT '' NOT NULL,
	`part_numbers` text NOT NULL,
	`specs` text NOT NULL,
	`came_on` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `parts_slug_unique` ON `parts` (`slug`);--> statement-breakpoint
CREATE INDEX `parts_kind_idx` ON `parts` (`kind`);--> statement-breakpoint
CREATE TABLE `review_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` integer NOT NULL,
	`actor_id` integer NOT NULL,
	`action` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`at` integer NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `review_events_revision_idx` ON `review_events` (`revision_id`);--> statement-breakpoint
CREATE TABLE `review_reason_templates` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`label` text NOT NULL,
	`text` text NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `revision_photos` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` integer NOT NULL,
	`file_id` text NOT NULL,
	`caption` text DEFAULT '' NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`width` integer NOT NULL,
	`height` integer NOT NULL,
	`bytes` integer NOT NULL,
	`sha256` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `revision_photos_file_id_unique` ON `revision_photos` (`file_id`);--> statement-breakpoint
CREATE INDEX `revision_photos_revision_idx` ON `revision_photos` (`revision_id`);--> statement-breakpoint
CREATE TABLE `revisions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`swap_id` integer NOT NULL,
	`number` integer NOT NULL,
	`author_id` integer NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`data` text NOT NULL,
	`body` text DEFAULT '' NOT NULL,
	`submitted_at` integer,
	`reviewed_at` integer,
	`reviewed_by_id` integer,
	`review_note` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`swap_id`) REFERENCES `swaps`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reviewed_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `revisions_swap_number_uq` ON `revisions` (`swap_id`,`number`);--> statement-breakpoint
CREATE INDEX `revisions_status_idx` ON `revisions` (`status`);--> statement-breakpoint
CREATE INDEX `revisions_author_idx` ON `revisions` (`author_id`);--> statement-breakpoint
CREATE TABLE `swaps` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`slug` text NOT NULL,
	`chassis_id` integer NOT NULL,
	`axle` text NOT NULL,
	`category` text NOT NULL,
	`current_revision_id` integer,
	`author_id` integer NOT NULL,
	`fitted_count` integer DEFAULT 0 NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`chassis_id`) REFERENCES `chassis`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`current_revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `swaps_slug_unique` ON `swaps` (`slug`);--> statement-breakpoint
CREATE INDEX `swaps_chassis_idx` ON `swaps` (`chassis_id`);--> statement-breakpoint
CREATE TABLE `cars` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`chassis_id` integer NOT NULL,
	`nickname` text NOT NULL,
	`wheel_diameter_in` real NOT NULL,
	`wheel_width_in` real NOT NULL,
	`wheel_offset_mm` real NOT NULL,
	`tyre` text DEFAULT '' NOT NULL,
	`spacer_mm` real DEFAULT 0 NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`chassis_id`) REFERENCES `chassis`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `cars_user_idx` ON `cars` (`user_id`);--> statement-breakpoint
CREATE TABLE `fitted_reports` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`swap_id` integer NOT NULL,
	`user_id` integer NOT NULL,
	`revision_id` integer NOT NULL,
	`wheel` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`photo_file_id` text,
	`hidden_at` integer,
	`hidden_by_id` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`swap_id`) REFERENCES `swaps`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`hidden_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `fitted_reports_swap_user_uq` ON `fitted_reports` (`swap_id`,`user_id`);--> statement-breakpoint
CREATE TABLE `flags` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`swap_id` integer NOT NULL,
	`reporter_id` integer NOT NULL,
	`reason` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`resolution_note` text,
	`resolved_by_id` integer,
	`resolved_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`swap_id`) REFERENCES `swaps`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`reporter_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`resolved_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `flags_status_idx` ON `flags` (`status`);--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`created_at` integer NOT NULL,
	`sent_at` integer
);
--> statement-breakpoint
CREATE TABLE `shop_links` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`code` text NOT NULL,
	`shop_id` integer NOT NULL,
	`swap_id` integer NOT NULL,
	`revision_id` integer NOT NULL,
	`created_by_id` integer NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`visits` integer DEFAULT 0 NOT NULL,
	`retired_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`swap_id`) REFERENCES `swaps`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `shop_links_code_unique` ON `shop_links` (`code`);--> statement-breakpoint
CREATE INDEX `shop_links_shop_idx` ON `shop_links` (`shop_id`);