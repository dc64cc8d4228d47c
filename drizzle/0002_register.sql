CREATE TABLE `banks` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`site_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`location` varchar(200) NOT NULL DEFAULT '',
	`controller_target_pf` decimal(4,3),
	`detuned` boolean NOT NULL DEFAULT false,
	`detuning_factor` decimal(6,4),
	`commissioned_on` date,
	`retired_at` datetime(3),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `banks_id` PRIMARY KEY(`id`),
	CONSTRAINT `banks_site_name` UNIQUE(`site_id`,`name`)
);
--> statement-breakpoint
CREATE TABLE `capacitor_units` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`step_id` bigint unsigned NOT NULL,
	`position` smallint NOT NULL,
	`nameplate_kvar` double NOT NULL,
	`nameplate_voltage_v` double NOT NULL,
	`nameplate_frequency_hz` smallint NOT NULL,
	`connection` enum('delta','star','single-phase') NOT NULL,
	`capacitance_uf` double NOT NULL,
	`capacitance_given` boolean NOT NULL DEFAULT false,
	`tolerance_preset` enum('iec','ieee','custom') NOT NULL DEFAULT 'iec',
	`tolerance_minus_pct` double NOT NULL DEFAULT -5,
	`tolerance_plus_pct` double NOT NULL DEFAULT 10,
	`temperature_category` varchar(16) NOT NULL DEFAULT '',
	`discharge_time_s` int NOT NULL DEFAULT 180,
	`serial` varchar(80) NOT NULL DEFAULT '',
	`maker` varchar(120) NOT NULL DEFAULT '',
	`model` varchar(120) NOT NULL DEFAULT '',
	`installed_on` date,
	`removed_on` date,
	`removal_reason` varchar(300),
	`replaced_by_id` bigint unsigned,
	`active_position` smallint GENERATED ALWAYS AS (IF(removed_on IS NULL, position, NULL)) STORED,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `capacitor_units_id` PRIMARY KEY(`id`),
	CONSTRAINT `capacitor_units_active_position` UNIQUE(`step_id`,`active_position`)
);
--> statement-breakpoint
CREATE TABLE `contactors` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`step_id` bigint unsigned NOT NULL,
	`rated_operations` int NOT NULL,
	`counter_at_install` int NOT NULL DEFAULT 0,
	`maker` varchar(120) NOT NULL DEFAULT '',
	`model` varchar(120) NOT NULL DEFAULT '',
	`installed_on` date,
	`removed_on` date,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `contactors_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `fuse_sets` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`step_id` bigint unsigned NOT NULL,
	`rated_current_a` double NOT NULL,
	`type` varchar(40) NOT NULL DEFAULT 'gG',
	`installed_on` date,
	`removed_on` date,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `fuse_sets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `reactors` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`step_id` bigint unsigned NOT NULL,
	`inductance_mh` double NOT NULL,
	`rated_current_a` double NOT NULL,
	`detuning_factor` decimal(6,4) NOT NULL,
	`maker` varchar(120) NOT NULL DEFAULT '',
	`model` varchar(120) NOT NULL DEFAULT '',
	`installed_on` date,
	`removed_on` date,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `reactors_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sites` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`address` varchar(400) NOT NULL DEFAULT '',
	`voltage_v` double NOT NULL,
	`frequency_hz` smallint NOT NULL,
	`transformer_kva` double NOT NULL,
	`transformer_impedance_pct` double NOT NULL,
	`utility_short_circuit_kva` double,
	`target_pf` decimal(4,3) NOT NULL,
	`tariff_basis` enum('pf-threshold','tan-phi-limit') NOT NULL,
	`tariff_limit` decimal(5,3) NOT NULL,
	`price_per_kvarh` decimal(10,5) NOT NULL DEFAULT 0,
	`currency` varchar(3) NOT NULL DEFAULT 'EUR',
	`time_zone` varchar(64) NOT NULL DEFAULT 'UTC',
	`planned_load_kw` double,
	`planned_load_pf` decimal(4,3),
	`retired_at` datetime(3),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sites_id` PRIMARY KEY(`id`),
	CONSTRAINT `sites_name` UNIQUE(`name`)
);
--> statement-breakpoint
CREATE TABLE `steps` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`bank_id` bigint unsigned NOT NULL,
	`number` smallint NOT NULL,
	`rated_kvar` double NOT NULL,
	`retired_at` datetime(3),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `steps_id` PRIMARY KEY(`id`),
	CONSTRAINT `steps_bank_number` UNIQUE(`bank_id`,`number`)
);
--> statement-breakpoint
ALTER TABLE `banks` ADD CONSTRAINT `banks_site_id_sites_id_fk` FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `capacitor_units` ADD CONSTRAINT `capacitor_units_step_id_steps_id_fk` FOREIGN KEY (`step_id`) REFERENCES `steps`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contactors` ADD CONSTRAINT `contactors_step_id_steps_id_fk` FOREIGN KEY (`step_id`) REFERENCES `steps`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fuse_sets` ADD CONSTRAINT `fuse_sets_step_id_steps_id_fk` FOREIGN KEY (`step_id`) REFERENCES `steps`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reactors` ADD CONSTRAINT `reactors_step_id_steps_id_fk` FOREIGN KEY (`step_id`) REFERENCES `steps`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `steps` ADD CONSTRAINT `steps_bank_id_banks_id_fk` FOREIGN KEY (`bank_id`) REFERENCES `banks`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `capacitor_units_step` ON `capacitor_units` (`step_id`);--> statement-breakpoint
CREATE INDEX `contactors_step` ON `contactors` (`step_id`);--> statement-breakpoint
CREATE INDEX `fuse_sets_step` ON `fuse_sets` (`step_id`);--> statement-breakpoint
CREATE INDEX `reactors_step` ON `reactors` (`step_id`);--> statement-breakpoint
ALTER TABLE `viewer_site_grants` ADD CONSTRAINT `viewer_site_grants_site_id_sites_id_fk` FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON DELETE no action ON UPDATE no action;