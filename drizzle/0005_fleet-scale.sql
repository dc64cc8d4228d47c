ALTER TABLE `unit_latest_evaluations` ADD `drift_rate_pct_per_year` double;--> statement-breakpoint
ALTER TABLE `unit_latest_evaluations` ADD `replace_by` date;--> statement-breakpoint
CREATE INDEX `unit_latest_evaluations_replace_by` ON `unit_latest_evaluations` (`replace_by`);--> statement-breakpoint
CREATE INDEX `work_orders_site_state_due` ON `work_orders` (`site_id`,`state`,`due_on`);