CREATE TABLE `email_sign_in_tokens` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`token_hash` text NOT NULL,
	`email` text NOT NULL,
	`return_to` text,
	`created_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`used_at` integer
);
--> statement-breakpoint
CREATE UNIQUE INDEX `email_sign_in_tokens_token_hash_unique` ON `email_sign_in_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `email_sign_in_tokens_email_idx` ON `email_sign_in_tokens` (`email`,`created_at`);--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `secret` integer DEFAULT false NOT NULL;