CREATE TABLE `data_migrations` (
	`name` varchar(120) NOT NULL,
	`rows_changed` int NOT NULL DEFAULT 0,
	`applied_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `data_migrations_name` PRIMARY KEY(`name`)
);
--> statement-breakpoint
ALTER TABLE `runs` ADD `shots_plan` enum('fixed','state_aware','worst_case');--> statement-breakpoint
ALTER TABLE `runs` ADD `shots_drawn` bigint unsigned;