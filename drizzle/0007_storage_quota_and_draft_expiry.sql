ALTER TABLE `revisions` ADD `expiry_warned_at` integer;--> statement-breakpoint
ALTER TABLE `revisions` ADD `expires_at` integer;--> statement-breakpoint
ALTER TABLE `fitted_reports` ADD `photo_bytes` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
CREATE INDEX `revision_photos_sha256_idx` ON `revision_photos` (`sha256`);