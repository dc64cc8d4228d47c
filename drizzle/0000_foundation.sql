CREATE TABLE `outbox` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` varchar(64) NOT NULL,
	`to_address` varchar(320) NOT NULL,
	`subject` varchar(300) NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text,
	`status` enum('waiting','sent','failed') NOT NULL DEFAULT 'waiting',
	`attempts` int NOT NULL DEFAULT 0,
	`last_error` varchar(500),
	`send_after` datetime(3) NOT NULL,
	`sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `seed_marker` (
	`id` tinyint NOT NULL DEFAULT 1,
	`seeded_at` datetime(3) NOT NULL,
	CONSTRAINT `seed_marker_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `outbox_status_send_after` ON `outbox` (`status`,`send_after`);