CREATE TABLE `noise_profiles` (
	`id` varchar(36) NOT NULL,
	`org_id` varchar(36) NOT NULL,
	`created_by_user_id` varchar(36),
	`name` varchar(80) NOT NULL,
	`noise` json NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `noise_profiles_id` PRIMARY KEY(`id`),
	CONSTRAINT `noise_profiles_org_name` UNIQUE(`org_id`,`name`)
);
--> statement-breakpoint
ALTER TABLE `noise_profiles` ADD CONSTRAINT `noise_profiles_org_id_organizations_id_fk` FOREIGN KEY (`org_id`) REFERENCES `organizations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `noise_profiles` ADD CONSTRAINT `noise_profiles_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `noise_profiles_org_updated` ON `noise_profiles` (`org_id`,`updated_at`);