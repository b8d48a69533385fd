CREATE TABLE `job_messages` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`quote_version_id` integer,
	`kind` text NOT NULL,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`status` text NOT NULL,
	`error` text,
	`attachments` text NOT NULL,
	`provider_message_id` text,
	`sent_by` text,
	`at` integer NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`quote_version_id`) REFERENCES `quote_versions`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`sent_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `job_messages_job_idx` ON `job_messages` (`job_id`,`at`);--> statement-breakpoint
CREATE TABLE `quote_versions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`quote_id` integer NOT NULL,
	`version` integer NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`lines` text NOT NULL,
	`tax_percent` real NOT NULL,
	`taxed_kinds` text NOT NULL,
	`tax_rounding` text DEFAULT 'invoice' NOT NULL,
	`deposit_percent` real NOT NULL,
	`valid_until` text NOT NULL,
	`intro` text,
	`terms` text,
	`finish_text` text,
	`subtotal_cents` integer DEFAULT 0 NOT NULL,
	`tax_cents` integer DEFAULT 0 NOT NULL,
	`total_cents` integer DEFAULT 0 NOT NULL,
	`deposit_cents` integer DEFAULT 0 NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`sent_at` integer,
	`sent_by` text,
	`sent_to` text,
	`viewed_at` integer,
	`decided_at` integer,
	`decided_via` text,
	`decided_by` text,
	`decided_address` text,
	`decision_name` text,
	`decision_note` text,
	`superseded_at` integer,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`sent_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `quote_versions_quote_version_idx` ON `quote_versions` (`quote_id`,`version`);--> statement-breakpoint
CREATE INDEX `quote_versions_status_idx` ON `quote_versions` (`status`);--> statement-breakpoint
CREATE TABLE `quotes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `quotes_job_idx` ON `quotes` (`job_id`);--> statement-breakpoint
CREATE INDEX `quotes_updated_idx` ON `quotes` (`updated_at`);--> statement-breakpoint
CREATE TABLE `checkout_sessions` (
	`id` text PRIMARY KEY NOT NULL,
	`quote_id` integer NOT NULL,
	`quote_version_id` integer NOT NULL,
	`job_id` integer NOT NULL,
	`amount_cents` integer NOT NULL,
	`currency` text NOT NULL,
	`url` text NOT NULL,
	`created_by` text,
	`via` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`quote_version_id`) REFERENCES `quote_versions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `checkout_sessions_quote_idx` ON `checkout_sessions` (`quote_id`);--> statement-breakpoint
CREATE TABLE `payments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`quote_id` integer NOT NULL,
	`quote_version_id` integer NOT NULL,
	`session_id` text NOT NULL,
	`payment_intent_id` text NOT NULL,
	`event_id` text NOT NULL,
	`amount_cents` integer NOT NULL,
	`expected_cents` integer NOT NULL,
	`currency` text NOT NULL,
	`refunded_cents` integer DEFAULT 0 NOT NULL,
	`flagged` integer DEFAULT false NOT NULL,
	`flag_reason` text,
	`reviewed_at` integer,
	`reviewed_by` text,
	`paid_at` integer NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`quote_version_id`) REFERENCES `quote_versions`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`reviewed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `payments_session_idx` ON `payments` (`session_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `payments_intent_idx` ON `payments` (`payment_intent_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `payments_event_idx` ON `payments` (`event_id`);--> statement-breakpoint
CREATE INDEX `payments_job_idx` ON `payments` (`job_id`);--> statement-breakpoint
CREATE INDEX `payments_quote_idx` ON `payments` (`quote_id`);--> statement-breakpoint
CREATE TABLE `refunds` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`payment_id` integer NOT NULL,
	`provider_refund_id` text NOT NULL,
	`event_id` text NOT NULL,
	`amount_cents` integer NOT NULL,
	`reason` text,
	`requested_by` text,
	`at` integer NOT NULL,
	FOREIGN KEY (`payment_id`) REFERENCES `payments`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`requested_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `refunds_provider_idx` ON `refunds` (`provider_refund_id`);--> statement-breakpoint
CREATE INDEX `refunds_payment_idx` ON `refunds` (`payment_id`);--> statement-breakpoint
CREATE TABLE `webhook_events` (
	`id` text PRIMARY KEY NOT NULL,
	`type` text NOT NULL,
	`outcome` text NOT NULL,
	`received_at` integer NOT NULL
);
