CREATE TABLE `booths` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`setup_minutes` integer DEFAULT 20 NOT NULL,
	`can_cure_outside` integer DEFAULT false NOT NULL,
	`opens_at_minute` integer DEFAULT 420 NOT NULL,
	`closes_at_minute` integer DEFAULT 1020 NOT NULL,
	`work_days` text NOT NULL,
	`time_zone` text NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `booths_name_idx` ON `booths` (`name`);--> statement-breakpoint
CREATE TABLE `prep_plans` (
	`job_id` integer PRIMARY KEY NOT NULL,
	`ready_at` integer NOT NULL,
	`updated_by` text,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE TABLE `schedule_sessions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`booth_id` integer NOT NULL,
	`job_id` integer NOT NULL,
	`layer_id` integer NOT NULL,
	`starts_at` integer NOT NULL,
	`ends_at` integer NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`booth_id`) REFERENCES `booths`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`layer_id`) REFERENCES `plan_layers`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `schedule_sessions_time_idx` ON `schedule_sessions` (`starts_at`);--> statement-breakpoint
CREATE INDEX `schedule_sessions_booth_idx` ON `schedule_sessions` (`booth_id`,`starts_at`);--> statement-breakpoint
CREATE UNIQUE INDEX `schedule_sessions_layer_idx` ON `schedule_sessions` (`layer_id`);