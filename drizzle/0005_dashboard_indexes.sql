CREATE INDEX `job_stage_events_to_stage_idx` ON `job_stage_events` (`to_stage`,`at`);--> statement-breakpoint
CREATE INDEX `payments_paid_at_idx` ON `payments` (`paid_at`);--> statement-breakpoint
CREATE INDEX `coat_logs_at_idx` ON `coat_logs` (`at`);