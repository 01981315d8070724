ALTER TABLE `chassis` ADD `vehicle` text;--> statement-breakpoint
ALTER TABLE `cars` ADD `vehicle` text;