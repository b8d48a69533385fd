CREATE TABLE `coat_logs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`plan_version_id` integer NOT NULL,
	`layer_id` integer NOT NULL,
	`coat_number` integer NOT NULL,
	`at` integer NOT NULL,
	`painter_id` text,
	`booth_temp` real,
	`temp_unit` text,
	`humidity_pct` real,
	`note` text,
	`mix_sheet_id` integer,
	`prep_override_reason` text,
	`corrects_id` integer,
	`correction_reason` text,
	`voids` integer DEFAULT false NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`plan_version_id`) REFERENCES `plan_versions`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`layer_id`) REFERENCES `plan_layers`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`painter_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`mix_sheet_id`) REFERENCES `mix_sheets`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`corrects_id`) REFERENCES `coat_logs`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `coat_logs_job_idx` ON `coat_logs` (`job_id`,`at`);--> statement-breakpoint
CREATE INDEX `coat_logs_layer_idx` ON `coat_logs` (`layer_id`);--> statement-breakpoint
CREATE INDEX `coat_logs_corrects_idx` ON `coat_logs` (`corrects_id`);--> statement-breakpoint
CREATE INDEX `coat_logs_created_idx` ON `coat_logs` (`created_at`);--> statement-breakpoint
CREATE TABLE `prep_records` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`item_id` integer NOT NULL,
	`substrate` text NOT NULL,
	`scuff_medium` text,
	`scuff_grit` integer,
	`cleaner` text,
	`tack_cloth` integer DEFAULT false NOT NULL,
	`adhesion_promoter` integer DEFAULT false NOT NULL,
	`adhesion_promoter_product` text,
	`notes` text,
	`prepared_by` text,
	`prepared_at` integer NOT NULL,
	`signed_off_by` text,
	`signed_off_at` integer,
	`reopened_note` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`item_id`) REFERENCES `job_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`prepared_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`signed_off_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `prep_records_item_idx` ON `prep_records` (`item_id`);--> statement-breakpoint
CREATE INDEX `prep_records_job_idx` ON `prep_records` (`job_id`);--> statement-breakpoint
CREATE TABLE `test_panels` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`ground_name` text NOT NULL,
	`ground_material_id` integer,
	`candy_name` text NOT NULL,
	`candy_material_id` integer,
	`let_down_clear` real NOT NULL,
	`let_down_toner` real NOT NULL,
	`coats` integer NOT NULL,
	`job_id` integer,
	`plan_layer_id` integer,
	`mix_sheet_id` integer,
	`lab_l` real,
	`lab_a` real,
	`lab_b` real,
	`sprayed_on` text,
	`notes` text,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`ground_material_id`) REFERENCES `materials`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`candy_material_id`) REFERENCES `materials`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`plan_layer_id`) REFERENCES `plan_layers`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`mix_sheet_id`) REFERENCES `mix_sheets`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `test_panels_ground_candy_idx` ON `test_panels` (`ground_name`,`candy_name`,`coats`);--> statement-breakpoint
CREATE INDEX `test_panels_candy_idx` ON `test_panels` (`candy_name`);--> statement-breakpoint
CREATE INDEX `test_panels_job_idx` ON `test_panels` (`job_id`);--> statement-breakpoint
ALTER TABLE `jobs` ADD `approved_panel_id` integer;