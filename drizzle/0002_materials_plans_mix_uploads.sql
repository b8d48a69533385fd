CREATE TABLE `material_lots` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`material_id` integer NOT NULL,
	`lot_number` text NOT NULL,
	`quantity_on_hand` real NOT NULL,
	`received_on` text,
	`expires_on` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`material_id`) REFERENCES `materials`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `material_lots_material_idx` ON `material_lots` (`material_id`);--> statement-breakpoint
CREATE TABLE `materials` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`code` text NOT NULL,
	`name` text NOT NULL,
	`category` text NOT NULL,
	`purchase_unit` text NOT NULL,
	`cost_cents` integer NOT NULL,
	`volume_solids_pct` real,
	`voc_g_per_l` real,
	`water_exempt_pct` real DEFAULT 0 NOT NULL,
	`density_g_per_ml` real,
	`pot_life_minutes` integer,
	`contains_isocyanates` integer DEFAULT false NOT NULL,
	`flammable` integer DEFAULT false NOT NULL,
	`low_stock_threshold` real,
	`notes` text,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `materials_code_idx` ON `materials` (`code`);--> statement-breakpoint
CREATE INDEX `materials_category_idx` ON `materials` (`category`);--> statement-breakpoint
CREATE TABLE `layer_components` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`layer_id` integer NOT NULL,
	`position` integer NOT NULL,
	`material_id` integer NOT NULL,
	`label` text NOT NULL,
	`parts` real,
	`percent` real,
	`percent_of` text,
	FOREIGN KEY (`layer_id`) REFERENCES `plan_layers`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`material_id`) REFERENCES `materials`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `layer_components_layer_idx` ON `layer_components` (`layer_id`,`position`);--> statement-breakpoint
CREATE TABLE `plan_layers` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`position` integer NOT NULL,
	`kind` text NOT NULL,
	`name` text NOT NULL,
	`coats` real NOT NULL,
	`flash_minutes` real DEFAULT 0 NOT NULL,
	`minutes_per_coat` real DEFAULT 5 NOT NULL,
	`dry_minutes` real DEFAULT 0 NOT NULL,
	`gun_tip` text,
	`pressure_psi` real,
	`overlap_pct` real,
	`dry_film_per_coat` real,
	`dry_film_unit` text DEFAULT 'um' NOT NULL,
	`transfer_efficiency_pct` real DEFAULT 65 NOT NULL,
	`notes` text,
	FOREIGN KEY (`version_id`) REFERENCES `plan_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `plan_layers_version_idx` ON `plan_layers` (`version_id`,`position`);--> statement-breakpoint
CREATE TABLE `plan_versions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`plan_id` integer NOT NULL,
	`version` integer NOT NULL,
	`frozen_at` integer,
	`note` text,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`plan_id`) REFERENCES `plans`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `plan_versions_plan_version_idx` ON `plan_versions` (`plan_id`,`version`);--> statement-breakpoint
CREATE TABLE `plans` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`description` text,
	`job_id` integer,
	`is_template` integer DEFAULT false NOT NULL,
	`copied_from_plan_id` integer,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `plans_job_idx` ON `plans` (`job_id`);--> statement-breakpoint
CREATE INDEX `plans_template_idx` ON `plans` (`is_template`);--> statement-breakpoint
CREATE TABLE `mix_sheet_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`mix_sheet_id` integer NOT NULL,
	`position` integer NOT NULL,
	`material_id` integer NOT NULL,
	`label` text NOT NULL,
	`planned_ml` real NOT NULL,
	`actual_ml` real,
	`lot_id` integer,
	`lot_number` text,
	`voc_g_per_l` real,
	`water_exempt_pct` real,
	`density_g_per_ml` real,
	`cost_cents` integer,
	FOREIGN KEY (`mix_sheet_id`) REFERENCES `mix_sheets`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`material_id`) REFERENCES `materials`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`lot_id`) REFERENCES `material_lots`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `mix_sheet_lines_sheet_idx` ON `mix_sheet_lines` (`mix_sheet_id`);--> statement-breakpoint
CREATE INDEX `mix_sheet_lines_material_idx` ON `mix_sheet_lines` (`material_id`);--> statement-breakpoint
CREATE TABLE `mix_sheets` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`plan_version_id` integer NOT NULL,
	`layer_id` integer NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`mode` text NOT NULL,
	`amount` real NOT NULL,
	`unit` text NOT NULL,
	`known_label` text,
	`weigh` integer DEFAULT false NOT NULL,
	`rounding_step` real,
	`rounding_unit` text,
	`total_ml` real NOT NULL,
	`voc_g_per_l` real,
	`pot_life_minutes` integer,
	`mixed_at` integer,
	`mixed_by` text,
	`voided_at` integer,
	`voided_by` text,
	`void_reason` text,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`plan_version_id`) REFERENCES `plan_versions`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`layer_id`) REFERENCES `plan_layers`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`mixed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`voided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `mix_sheets_job_idx` ON `mix_sheets` (`job_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `mix_sheets_layer_idx` ON `mix_sheets` (`layer_id`);--> statement-breakpoint
CREATE INDEX `mix_sheets_status_mixed_idx` ON `mix_sheets` (`status`,`mixed_at`);--> statement-breakpoint
CREATE TABLE `uploads` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`owner_type` text NOT NULL,
	`owner_id` integer NOT NULL,
	`job_id` integer,
	`kind` text NOT NULL,
	`mime` text NOT NULL,
	`size` integer NOT NULL,
	`original_name` text NOT NULL,
	`stored_name` text NOT NULL,
	`thumb_name` text,
	`width` integer,
	`height` integer,
	`caption` text,
	`shareable` integer DEFAULT false NOT NULL,
	`uploaded_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `uploads_owner_idx` ON `uploads` (`owner_type`,`owner_id`);--> statement-breakpoint
CREATE INDEX `uploads_job_idx` ON `uploads` (`job_id`);--> statement-breakpoint
ALTER TABLE `jobs` ADD `sprayed_plan_version_id` integer;