ALTER TABLE `chassis` ADD `wheel_fastening` text;--> statement-breakpoint
ALTER TABLE `cars` ADD `wheel_inside_profile` text;