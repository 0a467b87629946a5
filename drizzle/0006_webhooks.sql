CREATE TABLE `webhook_attempts` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`delivery_id` varchar(36) NOT NULL,
	`attempt` int NOT NULL,
	`response_status` int,
	`error` varchar(255),
	`duration_ms` int NOT NULL,
	`at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `webhook_attempts_id` PRIMARY KEY(`id`),
	CONSTRAINT `webhook_attempts_delivery_attempt` UNIQUE(`delivery_id`,`attempt`)
);
--> statement-breakpoint
CREATE TABLE `webhook_deliveries` (
	`id` varchar(36) NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`endpoint_id` varchar(36) NOT NULL,
	`run_id` varchar(36) NOT NULL,
	`event` varchar(32) NOT NULL,
	`body` mediumtext NOT NULL,
	`status` enum('pending','delivered','failed') NOT NULL DEFAULT 'pending',
	`attempts` int NOT NULL DEFAULT 0,
	`last_response_status` int,
	`last_error` varchar(255),
	`last_attempt_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `webhook_deliveries_id` PRIMARY KEY(`id`),
	CONSTRAINT `webhook_deliveries_endpoint_run` UNIQUE(`endpoint_id`,`run_id`)
);
--> statement-breakpoint
CREATE TABLE `webhook_endpoints` (
	`id` varchar(36) NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`created_by_user_id` varchar(36),
	`url` varchar(2048) NOT NULL,
	`description` varchar(120),
	`secret_cipher` varchar(255) NOT NULL,
	`secret_prefix` varchar(16) NOT NULL,
	`enabled` boolean NOT NULL DEFAULT true,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `webhook_endpoints_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `webhook_attempts` ADD CONSTRAINT `webhook_attempts_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_attempts` ADD CONSTRAINT `webhook_attempts_delivery_id_webhook_deliveries_id_fk` FOREIGN KEY (`delivery_id`) REFERENCES `webhook_deliveries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_deliveries` ADD CONSTRAINT `webhook_deliveries_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_deliveries` ADD CONSTRAINT `webhook_deliveries_endpoint_id_webhook_endpoints_id_fk` FOREIGN KEY (`endpoint_id`) REFERENCES `webhook_endpoints`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_endpoints` ADD CONSTRAINT `webhook_endpoints_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_endpoints` ADD CONSTRAINT `webhook_endpoints_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `webhook_deliveries_org_time` ON `webhook_deliveries` (`org_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `webhook_endpoints_org` ON `webhook_endpoints` (`org_id`,`created_at`);