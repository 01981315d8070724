ALTER TABLE `revisions` ADD `change_note` text;--> statement-breakpoint
ALTER TABLE `fitted_reports` ADD `clearance_mm` real;--> statement-breakpoint
ALTER TABLE `fitted_reports` ADD `state` text DEFAULT 'live' NOT NULL;--> statement-breakpoint
ALTER TABLE `fitted_reports` ADD `released_at` integer;--> statement-breakpoint
ALTER TABLE `fitted_reports` ADD `released_by_id` integer REFERENCES users(id) ON DELETE set null;--> statement-breakpoint
CREATE INDEX `fitted_reports_state_idx` ON `fitted_reports` (`state`,`created_at`);--> statement-breakpoint
CREATE INDEX `fitted_reports_user_idx` ON `fitted_reports` (`user_id`);--> statement-breakpoint
ALTER TABLE `flags` ADD `kind` text DEFAULT 'other' NOT NULL;--> statement-breakpoint
ALTER TABLE `flags` ADD `correction_revision_id` integer REFERENCES revisions(id) ON DELETE set null;--> statement-breakpoint
ALTER TABLE `flags` ADD `outcome` text;--> statement-breakpoint
ALTER TABLE `flags` ADD `reporter_notified_at` integer;--> statement-breakpoint
CREATE INDEX `flags_swap_status_idx` ON `flags` (`swap_id`,`status`);--> statement-breakpoint
CREATE INDEX `flags_reporter_notified_idx` ON `flags` (`reporter_id`,`reporter_notified_at`);--> statement-breakpoint
-- flags resolved before outcomes were recorded were mailed to their reporter at the time
UPDATE `flags` SET `reporter_notified_at` = `resolved_at` WHERE `status` = 'resolved';