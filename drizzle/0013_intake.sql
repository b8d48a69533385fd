CREATE TABLE `inspection_items` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`inspection_id` integer NOT NULL,
	`job_id` integer NOT NULL,
	`item_id` integer NOT NULL,
	`existing_finish` text NOT NULL,
	`dents` text DEFAULT 'none' NOT NULL,
	`cracks` text DEFAULT 'none' NOT NULL,
	`pinholes` text DEFAULT 'none' NOT NULL,
	`stress_cracks` text DEFAULT 'none' NOT NULL,
	`rust` text DEFAULT 'none' NOT NULL,
	`earlier_repairs` text DEFAULT 'none' NOT NULL,
	`hardware_to_remove` text,
	`measured_area` real,
	`area_unit` text,
	`solvent_test` text DEFAULT 'not_done' NOT NULL,
	`note` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`updated_by` text,
	FOREIGN KEY (`inspection_id`) REFERENCES `inspections`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`item_id`) REFERENCES `job_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `inspection_items_item_idx` ON `inspection_items` (`item_id`);--> statement-breakpoint
CREATE INDEX `inspection_items_job_idx` ON `inspection_items` (`job_id`);--> statement-breakpoint
CREATE TABLE `inspections` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`customer_summary` text,
	`notes` text,
	`inspected_by` text,
	`inspected_at` integer NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`updated_by` text,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`inspected_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `inspections_job_idx` ON `inspections` (`job_id`);--> statement-breakpoint
CREATE TABLE `panel_sign_offs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`panel_id` integer NOT NULL,
	`status` text DEFAULT 'waiting' NOT NULL,
	`label` text NOT NULL,
	`let_down_clear` real NOT NULL,
	`let_down_toner` real NOT NULL,
	`coats` integer NOT NULL,
	`photo_id` integer,
	`target_label` text,
	`delta_e` real,
	`message` text,
	`sent_to` text NOT NULL,
	`sent_by` text,
	`sent_at` integer NOT NULL,
	`decided_at` integer,
	`decided_via` text,
	`decided_by` text,
	`decided_address` text,
	`decision_name` text,
	`decision_note` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`updated_by` text,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`panel_id`) REFERENCES `test_panels`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`photo_id`) REFERENCES `uploads`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`sent_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `panel_sign_offs_job_idx` ON `panel_sign_offs` (`job_id`,`status`);--> statement-breakpoint
CREATE INDEX `panel_sign_offs_panel_idx` ON `panel_sign_offs` (`panel_id`);