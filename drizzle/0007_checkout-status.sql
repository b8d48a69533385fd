DROP INDEX `checkout_sessions_quote_idx`;--> statement-breakpoint
ALTER TABLE `checkout_sessions` ADD `status` text DEFAULT 'open' NOT NULL;--> statement-breakpoint
ALTER TABLE `checkout_sessions` ADD `closed_at` integer;--> statement-breakpoint
CREATE INDEX `checkout_sessions_quote_idx` ON `checkout_sessions` (`quote_id`,`status`);