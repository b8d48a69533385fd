ALTER TABLE `materials` ADD `induction_minutes` integer;--> statement-breakpoint
ALTER TABLE `materials` ADD `recoat_min_minutes` integer;--> statement-breakpoint
ALTER TABLE `materials` ADD `recoat_max_minutes` integer;--> statement-breakpoint
ALTER TABLE `plan_layers` ADD `induction_minutes` real;--> statement-breakpoint
ALTER TABLE `plan_layers` ADD `recoat_min_minutes` real;--> statement-breakpoint
ALTER TABLE `plan_layers` ADD `recoat_max_minutes` real;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `timing_override_reason` text;--> statement-breakpoint
ALTER TABLE `coat_logs` ADD `timing_breaches` text;