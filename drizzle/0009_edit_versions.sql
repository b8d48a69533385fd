ALTER TABLE `customers` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `customers` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `job_items` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `job_items` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `jobs` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `jobs` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `users` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `users` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `material_lots` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `material_lots` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `materials` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `materials` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `plans` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `plans` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `uploads` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `uploads` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `quotes` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `quotes` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `guns` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `guns` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `prep_records` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `prep_records` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `test_panels` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `booths` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `booths` ADD `updated_by` text;--> statement-breakpoint
ALTER TABLE `schedule_sessions` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `schedule_sessions` ADD `updated_by` text;