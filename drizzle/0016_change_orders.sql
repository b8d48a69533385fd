CREATE TABLE `change_orders` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`quote_id` integer NOT NULL,
	`kind` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`summary` text NOT NULL,
	`colour_changed` integer DEFAULT false NOT NULL,
	`from_version_id` integer,
	`to_version_id` integer,
	`lines` text NOT NULL,
	`tax_percent` real NOT NULL,
	`taxed_kinds` text NOT NULL,
	`tax_rounding` text DEFAULT 'invoice' NOT NULL,
	`deposit_percent` real NOT NULL,
	`total_cents` integer DEFAULT 0 NOT NULL,
	`deposit_cents` integer DEFAULT 0 NOT NULL,
	`sent_at` integer,
	`sent_to` text,
	`sent_by` text,
	`decided_at` integer,
	`decided_via` text,
	`decided_by` text,
	`decided_address` text,
	`decision_name` text,
	`decision_note` text,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`updated_by` text,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`from_version_id`) REFERENCES `plan_versions`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`to_version_id`) REFERENCES `plan_versions`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`sent_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `change_orders_job_idx` ON `change_orders` (`job_id`,`status`);--> statement-breakpoint
ALTER TABLE `mix_sheets` ADD `superseded_at` integer;--> statement-breakpoint
ALTER TABLE `checkout_sessions` ADD `change_order_id` integer REFERENCES change_orders(id);--> statement-breakpoint
ALTER TABLE `payments` ADD `change_order_id` integer REFERENCES change_orders(id);--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `change_override_reason` text;