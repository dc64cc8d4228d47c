CREATE TABLE `flags` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` enum('replace','watch','unbalance','remeasure','tuning-drift','contactor-endurance','case-temperature','blown-fuse') NOT NULL,
	`severity` enum('advisory','action') NOT NULL,
	`site_id` bigint unsigned NOT NULL,
	`bank_id` bigint unsigned NOT NULL,
	`target` enum('capacitor-unit','contactor','reactor','fuse-set','bank') NOT NULL,
	`target_id` bigint unsigned NOT NULL,
	`reading_id` bigint unsigned,
	`message` varchar(500) NOT NULL,
	`state` enum('open','in-hand','cleared') NOT NULL DEFAULT 'open',
	`corrective_order_id` bigint unsigned,
	`raised_at` datetime(3) NOT NULL,
	`cleared_at` datetime(3),
	CONSTRAINT `flags_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `inspection_plans` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`bank_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`interval_months` smallint NOT NULL,
	`lead_days` smallint NOT NULL DEFAULT 14,
	`checklist` json NOT NULL,
	`next_due_on` date NOT NULL,
	`active` boolean NOT NULL DEFAULT true,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `inspection_plans_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `photos` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`work_order_id` bigint unsigned NOT NULL,
	`reading_id` bigint unsigned,
	`target` enum('capacitor-unit','contactor','reactor','fuse-set','bank'),
	`target_id` bigint unsigned,
	`idempotency_key` varchar(64) NOT NULL,
	`caption` varchar(300) NOT NULL DEFAULT '',
	`display_key` varchar(200) NOT NULL,
	`thumbnail_key` varchar(200) NOT NULL,
	`width_px` int NOT NULL,
	`height_px` int NOT NULL,
	`bytes` int NOT NULL,
	`taken_by_id` bigint unsigned NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `photos_id` PRIMARY KEY(`id`),
	CONSTRAINT `photos_idempotency` UNIQUE(`idempotency_key`)
);
--> statement-breakpoint
CREATE TABLE `readings` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`work_order_id` bigint unsigned NOT NULL,
	`idempotency_key` varchar(64) NOT NULL,
	`target` enum('capacitor-unit','contactor','reactor','fuse-set','bank') NOT NULL,
	`target_id` bigint unsigned NOT NULL,
	`input` json NOT NULL,
	`evaluation` json NOT NULL,
	`engineering_version` varchar(20) NOT NULL,
	`band` enum('healthy','watch','replace','remeasure'),
	`deviation_pct` double,
	`recorded_by_id` bigint unsigned NOT NULL,
	`recorded_at` datetime(3) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `readings_id` PRIMARY KEY(`id`),
	CONSTRAINT `readings_idempotency` UNIQUE(`idempotency_key`)
);
--> statement-breakpoint
CREATE TABLE `unit_latest_evaluations` (
	`unit_id` bigint unsigned NOT NULL,
	`reading_id` bigint unsigned NOT NULL,
	`band` enum('healthy','watch','replace','remeasure') NOT NULL,
	`deviation_pct` double NOT NULL,
	`kvar_at_rated` double NOT NULL,
	`legs_uf` json NOT NULL,
	`recorded_at` datetime(3) NOT NULL,
	CONSTRAINT `unit_latest_evaluations_unit_id` PRIMARY KEY(`unit_id`)
);
--> statement-breakpoint
CREATE TABLE `work_order_transitions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`work_order_id` bigint unsigned NOT NULL,
	`from_state` enum('queued','dispatched','on-site','awaiting-review','sent-back','sealed','withdrawn'),
	`to_state` enum('queued','dispatched','on-site','awaiting-review','sent-back','sealed','withdrawn') NOT NULL,
	`actor_id` bigint unsigned,
	`comment` varchar(1000) NOT NULL DEFAULT '',
	`at` datetime(3) NOT NULL,
	CONSTRAINT `work_order_transitions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `work_orders` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` enum('inspection','corrective','baseline') NOT NULL,
	`site_id` bigint unsigned NOT NULL,
	`bank_id` bigint unsigned NOT NULL,
	`plan_id` bigint unsigned,
	`flag_id` bigint unsigned,
	`title` varchar(200) NOT NULL,
	`instructions` text NOT NULL,
	`checklist` json NOT NULL,
	`due_on` date NOT NULL,
	`priority` enum('low','normal','high','urgent') NOT NULL DEFAULT 'normal',
	`assignee_id` bigint unsigned,
	`state` enum('queued','dispatched','on-site','awaiting-review','sent-back','sealed','withdrawn') NOT NULL DEFAULT 'queued',
	`locked` boolean NOT NULL DEFAULT false,
	`safety_acknowledged_at` datetime(3),
	`safety_acknowledged_by_id` bigint unsigned,
	`submitted_at` datetime(3),
	`signed_at` datetime(3),
	`signed_by_id` bigint unsigned,
	`signed_by_name` varchar(200),
	`signature_meaning` varchar(400),
	`created_by_id` bigint unsigned,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `work_orders_id` PRIMARY KEY(`id`),
	CONSTRAINT `work_orders_plan_due` UNIQUE(`plan_id`,`due_on`)
);
--> statement-breakpoint
ALTER TABLE `flags` ADD CONSTRAINT `flags_site_id_sites_id_fk` FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `flags` ADD CONSTRAINT `flags_bank_id_banks_id_fk` FOREIGN KEY (`bank_id`) REFERENCES `banks`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `flags` ADD CONSTRAINT `flags_reading_id_readings_id_fk` FOREIGN KEY (`reading_id`) REFERENCES `readings`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `flags` ADD CONSTRAINT `flags_corrective_order_id_work_orders_id_fk` FOREIGN KEY (`corrective_order_id`) REFERENCES `work_orders`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `inspection_plans` ADD CONSTRAINT `inspection_plans_bank_id_banks_id_fk` FOREIGN KEY (`bank_id`) REFERENCES `banks`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `photos` ADD CONSTRAINT `photos_work_order_id_work_orders_id_fk` FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `photos` ADD CONSTRAINT `photos_reading_id_readings_id_fk` FOREIGN KEY (`reading_id`) REFERENCES `readings`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `photos` ADD CONSTRAINT `photos_taken_by_id_users_id_fk` FOREIGN KEY (`taken_by_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `readings` ADD CONSTRAINT `readings_work_order_id_work_orders_id_fk` FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `readings` ADD CONSTRAINT `readings_recorded_by_id_users_id_fk` FOREIGN KEY (`recorded_by_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `unit_latest_evaluations` ADD CONSTRAINT `unit_latest_evaluations_unit_id_capacitor_units_id_fk` FOREIGN KEY (`unit_id`) REFERENCES `capacitor_units`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `unit_latest_evaluations` ADD CONSTRAINT `unit_latest_evaluations_reading_id_readings_id_fk` FOREIGN KEY (`reading_id`) REFERENCES `readings`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_order_transitions` ADD CONSTRAINT `work_order_transitions_work_order_id_work_orders_id_fk` FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_order_transitions` ADD CONSTRAINT `work_order_transitions_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_site_id_sites_id_fk` FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_bank_id_banks_id_fk` FOREIGN KEY (`bank_id`) REFERENCES `banks`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_plan_id_inspection_plans_id_fk` FOREIGN KEY (`plan_id`) REFERENCES `inspection_plans`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_assignee_id_users_id_fk` FOREIGN KEY (`assignee_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_safety_acknowledged_by_id_users_id_fk` FOREIGN KEY (`safety_acknowledged_by_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_signed_by_id_users_id_fk` FOREIGN KEY (`signed_by_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_created_by_id_users_id_fk` FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `flags_state` ON `flags` (`state`,`raised_at`);--> statement-breakpoint
CREATE INDEX `flags_target` ON `flags` (`target`,`target_id`);--> statement-breakpoint
CREATE INDEX `inspection_plans_next_due` ON `inspection_plans` (`active`,`next_due_on`);--> statement-breakpoint
CREATE INDEX `photos_order` ON `photos` (`work_order_id`);--> statement-breakpoint
CREATE INDEX `readings_order` ON `readings` (`work_order_id`);--> statement-breakpoint
CREATE INDEX `readings_target` ON `readings` (`target`,`target_id`,`recorded_at`);--> statement-breakpoint
CREATE INDEX `work_order_transitions_order` ON `work_order_transitions` (`work_order_id`,`at`);--> statement-breakpoint
CREATE INDEX `work_orders_state_due` ON `work_orders` (`state`,`due_on`);--> statement-breakpoint
CREATE INDEX `work_orders_assignee_due` ON `work_orders` (`assignee_id`,`due_on`);--> statement-breakpoint
CREATE INDEX `work_orders_site_due` ON `work_orders` (`site_id`,`due_on`);--> statement-breakpoint
CREATE INDEX `work_orders_bank` ON `work_orders` (`bank_id`);