CREATE TABLE `guns` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`description` text,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `panel_readings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`panel_id` integer NOT NULL,
	`light` text NOT NULL,
	`illuminant` text NOT NULL,
	`lab_l` real NOT NULL,
	`lab_a` real NOT NULL,
	`lab_b` real NOT NULL,
	FOREIGN KEY (`panel_id`) REFERENCES `test_panels`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `panel_readings_panel_light_idx` ON `panel_readings` (`panel_id`,`light`);--> statement-breakpoint
ALTER TABLE `uploads` ADD `light` text;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `gun_id` integer REFERENCES guns(id);--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `tip_mm` real;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `inlet_pressure` real;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `pressure_unit` text;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `distance` real;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `fan_width` real;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `distance_unit` text;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `overlap_pct` real;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `gun_id` integer REFERENCES guns(id);--> statement-breakpoint
ALTER TABLE `test_panels` ADD `tip_mm` real;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `inlet_pressure` real;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `pressure_unit` text;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `distance` real;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `fan_width` real;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `distance_unit` text;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `overlap_pct` real;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `booth_temp` real;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `temp_unit` text;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `humidity_pct` real;