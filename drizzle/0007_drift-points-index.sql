DROP INDEX `readings_target` ON `readings`;--> statement-breakpoint
CREATE INDEX `readings_target` ON `readings` (`target`,`target_id`,`recorded_at`,`deviation_pct`);