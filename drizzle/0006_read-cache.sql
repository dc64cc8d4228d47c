CREATE TABLE `read_cache` (
	`cache_key` varchar(190) NOT NULL,
	`site_id` bigint unsigned,
	`revision` bigint unsigned NOT NULL,
	`valid_for` varchar(16) NOT NULL,
	`body` mediumtext NOT NULL,
	`stored_at` datetime(3) NOT NULL,
	CONSTRAINT `read_cache_cache_key` PRIMARY KEY(`cache_key`)
);
--> statement-breakpoint
CREATE TABLE `read_revision` (
	`id` tinyint NOT NULL DEFAULT 1,
	`revision` bigint unsigned NOT NULL DEFAULT 0,
	CONSTRAINT `read_revision_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `read_cache_stored_at` ON `read_cache` (`stored_at`);--> statement-breakpoint
INSERT INTO `read_revision` (`id`, `revision`) VALUES (1, 0);
