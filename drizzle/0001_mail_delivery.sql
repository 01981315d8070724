ALTER TABLE `mail_outbox` ADD `user_id` integer REFERENCES users(id) ON DELETE set null;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `message_id` text;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `status` text DEFAULT 'kept' NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `attempts` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `last_error` text;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `next_attempt_at` integer;--> statement-breakpoint
UPDATE `mail_outbox` SET `message_id` = '<' || lower(hex(randomblob(16))) || '@swapyard.invalid>';--> statement-breakpoint
UPDATE `mail_outbox` SET `status` = 'sent' WHERE `sent_at` IS NOT NULL;--> statement-breakpoint
CREATE UNIQUE INDEX `mail_outbox_message_id_unique` ON `mail_outbox` (`message_id`);--> statement-breakpoint
CREATE INDEX `mail_outbox_due_idx` ON `mail_outbox` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `sessions_created_idx` ON `sessions` (`created_at`);