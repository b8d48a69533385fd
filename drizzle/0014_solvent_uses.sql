CREATE TABLE `solvent_uses` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`material_id` integer NOT NULL,
	`job_id` integer,
	`purpose` text NOT NULL,
	`amount` real NOT NULL,
	`unit` text NOT NULL,
	`volume_ml` real NOT NULL,
	`voc_g_per_l` real,
	`water_exempt_pct` real DEFAULT 0 NOT NULL,
	`note` text,
	`used_at` integer NOT NULL,
	`logged_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`material_id`) REFERENCES `materials`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`logged_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `solvent_uses_used_idx` ON `solvent_uses` (`used_at`);--> statement-breakpoint
CREATE INDEX `solvent_uses_job_idx` ON `solvent_uses` (`job_id`);