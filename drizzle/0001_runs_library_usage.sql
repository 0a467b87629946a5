CREATE TABLE `runs` (
	`id` varchar(36) NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`created_by_user_id` varchar(36),
	`created_by_api_key_id` varchar(36),
	`name` varchar(120) NOT NULL,
	`request` json NOT NULL,
	`method` enum('statevector','density_matrix') NOT NULL,
	`qubits` int NOT NULL,
	`shots` bigint unsigned NOT NULL DEFAULT 0,
	`seed` bigint NOT NULL,
	`status` enum('queued','running','succeeded','failed','canceled') NOT NULL DEFAULT 'queued',
	`progress` double NOT NULL DEFAULT 0,
	`phase` varchar(64),
	`error` json,
	`result` json,
	`idempotency_key` varchar(255),
	`request_hash` char(64) NOT NULL,
	`attempts` int NOT NULL DEFAULT 0,
	`queued_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`started_at` datetime(3),
	`finished_at` datetime(3),
	`parse_ms` double,
	`simulate_ms` double,
	`sample_ms` double,
	CONSTRAINT `runs_id` PRIMARY KEY(`id`),
	CONSTRAINT `runs_org_idempotency` UNIQUE(`org_id`,`idempotency_key`)
);
--> statement-breakpoint
CREATE TABLE `circuits` (
	`id` varchar(36) NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`created_by_user_id` varchar(36),
	`name` varchar(120) NOT NULL,
	`description` varchar(2000) NOT NULL DEFAULT '',
	`tags` json NOT NULL,
	`format` enum('qasm2','qasm3') NOT NULL,
	`source` mediumtext NOT NULL,
	`qubits` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `circuits_id` PRIMARY KEY(`id`),
	CONSTRAINT `circuits_org_name` UNIQUE(`org_id`,`name`)
);
--> statement-breakpoint
CREATE TABLE `observables` (
	`id` varchar(36) NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`created_by_user_id` varchar(36),
	`name` varchar(120) NOT NULL,
	`description` varchar(2000) NOT NULL DEFAULT '',
	`tags` json NOT NULL,
	`format` enum('pauli','matrix') NOT NULL,
	`terms` mediumtext,
	`matrix` json,
	`qubits` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `observables_id` PRIMARY KEY(`id`),
	CONSTRAINT `observables_org_name` UNIQUE(`org_id`,`name`)
);
--> statement-breakpoint
CREATE TABLE `usage_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`run_id` varchar(36) NOT NULL,
	`metric` enum('runs','shots','simulation_seconds') NOT NULL,
	`quantity` decimal(20,6) NOT NULL,
	`period` char(7) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`reported_at` datetime(3),
	CONSTRAINT `usage_events_id` PRIMARY KEY(`id`),
	CONSTRAINT `usage_events_run_metric` UNIQUE(`run_id`,`metric`)
);
--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_created_by_api_key_id_api_keys_id_fk` FOREIGN KEY (`created_by_api_key_id`) REFERENCES `api_keys`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `circuits` ADD CONSTRAINT `circuits_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `circuits` ADD CONSTRAINT `circuits_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `observables` ADD CONSTRAINT `observables_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `observables` ADD CONSTRAINT `observables_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `usage_events` ADD CONSTRAINT `usage_events_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `usage_events` ADD CONSTRAINT `usage_events_run_id_runs_id_fk` FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `runs_org_queued` ON `runs` (`org_id`,`queued_at`,`id`);--> statement-breakpoint
CREATE INDEX `runs_org_status_queued` ON `runs` (`org_id`,`status`,`queued_at`,`id`);--> statement-breakpoint
CREATE INDEX `circuits_org_created` ON `circuits` (`org_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `observables_org_created` ON `observables` (`org_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `usage_events_org_period` ON `usage_events` (`org_id`,`period`,`metric`);