CREATE TABLE `usage_totals` (
	`org_id` varchar(36) NOT NULL,
	`period` char(7) NOT NULL,
	`metric` enum('runs','shots','simulation_seconds') NOT NULL,
	`quantity` decimal(20,6) NOT NULL DEFAULT 0,
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `usage_totals_org_id_period_metric_pk` PRIMARY KEY(`org_id`,`period`,`metric`)
);
--> statement-breakpoint
ALTER TABLE `usage_totals` ADD CONSTRAINT `usage_totals_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;