CREATE TABLE `follows` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`chassis_id` integer,
	`car_id` integer,
	`frequency` text NOT NULL,
	`since` integer NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`chassis_id`) REFERENCES `chassis`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`car_id`) REFERENCES `cars`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "follows_one_target" CHECK(("follows"."chassis_id" is null) <> ("follows"."car_id" is null))
);
--> statement-breakpoint
CREATE UNIQUE INDEX `follows_user_chassis_uq` ON `follows` (`user_id`,`chassis_id`) WHERE chassis_id is not null;--> statement-breakpoint
CREATE UNIQUE INDEX `follows_car_uq` ON `follows` (`car_id`) WHERE car_id is not null;--> statement-breakpoint
CREATE INDEX `follows_frequency_idx` ON `follows` (`frequency`,`since`);--> statement-breakpoint
ALTER TABLE `shops` ADD `phone` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `email` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `address` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `opening_hours` text DEFAULT '[]' NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `hours_note` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `headers` text;--> statement-breakpoint
ALTER TABLE `shop_links` ADD `public_note` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_links` ADD `customer_ref` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_links` ADD `quoted_price_minor` integer;--> statement-breakpoint
ALTER TABLE `shop_links` ADD `quoted_currency` text;--> statement-breakpoint
ALTER TABLE `shop_links` ADD `expires_at` integer;