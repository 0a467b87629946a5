CREATE TABLE `billing_events` (
	`id` varchar(255) NOT NULL,
	`type` varchar(80) NOT NULL,
	`org_id` varchar(36),
	`received_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `billing_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `overage_reports` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`period` char(7) NOT NULL,
	`metric` enum('shots','simulation_seconds') NOT NULL,
	`quantity` bigint unsigned NOT NULL,
	`identifier` varchar(100) NOT NULL,
	`status` enum('pending','sent') NOT NULL DEFAULT 'pending',
	`attempts` int NOT NULL DEFAULT 0,
	`last_error` varchar(255),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`sent_at` datetime(3),
	CONSTRAINT `overage_reports_id` PRIMARY KEY(`id`),
	CONSTRAINT `overage_reports_identifier_unique` UNIQUE(`identifier`),
	CONSTRAINT `overage_reports_org_period_metric` UNIQUE(`org_id`,`period`,`metric`)
);
--> statement-breakpoint
ALTER TABLE `api_keys` ADD `scope` enum('personal','organization') DEFAULT 'personal' NOT NULL;--> statement-breakpoint
ALTER TABLE `overage_reports` ADD CONSTRAINT `overage_reports_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `billing_events_org` ON `billing_events` (`org_id`,`received_at`);