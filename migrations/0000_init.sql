CREATE TABLE `sign_in_failures` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`client_address` varchar(64) NOT NULL,
	`at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sign_in_failures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`role` enum('admin','dispatcher','pilot','safety') NOT NULL,
	`password_hash` varchar(255),
	`disabled` boolean NOT NULL DEFAULT false,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `app_meta` (
	`meta_key` varchar(64) NOT NULL,
	`meta_value` varchar(255) NOT NULL,
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `app_meta_meta_key` PRIMARY KEY(`meta_key`)
);
--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`actor_user_id` int,
	`actor_label` varchar(160) NOT NULL,
	`action` varchar(64) NOT NULL,
	`entity_type` varchar(32) NOT NULL,
	`entity_id` varchar(64) NOT NULL,
	`details` json,
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `airfields` (
	`id` int AUTO_INCREMENT NOT NULL,
	`code` varchar(4) NOT NULL,
	`name` varchar(120) NOT NULL,
	`latitude_deg` double NOT NULL,
	`longitude_deg` double NOT NULL,
	`elevation_m` double NOT NULL,
	`elevation_unit` enum('ft','m') NOT NULL DEFAULT 'ft',
	`mag_var_override_deg` double,
	`mag_var_override_reason` varchar(255),
	`notes` text,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `airfields_id` PRIMARY KEY(`id`),
	CONSTRAINT `airfields_code` UNIQUE(`code`)
);
--> statement-breakpoint
CREATE TABLE `runway_ends` (
	`id` int AUTO_INCREMENT NOT NULL,
	`runway_id` int NOT NULL,
	`airfield_id` int NOT NULL,
	`designator` varchar(3) NOT NULL,
	`threshold_lat_deg` double,
	`threshold_lon_deg` double,
	`threshold_elevation_m` double,
	`true_heading_deg` double NOT NULL,
	`heading_source` enum('coordinates','entered') NOT NULL,
	CONSTRAINT `runway_ends_id` PRIMARY KEY(`id`),
	CONSTRAINT `runway_ends_airfield_designator` UNIQUE(`airfield_id`,`designator`)
);
--> statement-breakpoint
CREATE TABLE `runways` (
	`id` int AUTO_INCREMENT NOT NULL,
	`airfield_id` int NOT NULL,
	`length_m` double,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `runways_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `profile_levels` (
	`id` int AUTO_INCREMENT NOT NULL,
	`profile_id` int NOT NULL,
	`seq` int NOT NULL,
	`height_m` double,
	`height_ft` double,
	`pressure_hpa` double,
	`direction_deg` double NOT NULL,
	`speed_kt` double,
	`speed_mps` double,
	`gust_kt` double,
	`gust_mps` double,
	CONSTRAINT `profile_levels_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `profiles` (
	`id` int AUTO_INCREMENT NOT NULL,
	`airfield_id` int NOT NULL,
	`valid_from` datetime(3) NOT NULL,
	`valid_to` datetime(3) NOT NULL,
	`source` enum('radiosonde','wind-profiler','doppler-lidar','aircraft-reports','model-forecast','pilot-report','estimate') NOT NULL,
	`height_reference` enum('AGL','MSL') NOT NULL,
	`status` enum('active','superseded','withdrawn') NOT NULL DEFAULT 'active',
	`superseded_by_id` int,
	`superseded_at` datetime(3),
	`withdrawn_at` datetime(3),
	`withdrawn_reason` varchar(500),
	`withdrawn_by_user_id` int,
	`filed_by_user_id` int,
	`filed_by_token_id` int,
	`entry` json,
	`notes` text,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `profiles_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `api_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`token_prefix` varchar(16) NOT NULL,
	`created_by_user_id` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_used_at` datetime(3),
	`revoked_at` datetime(3),
	`revoked_by_user_id` int,
	CONSTRAINT `api_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `api_tokens_hash` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `idempotency_keys` (
	`id` int AUTO_INCREMENT NOT NULL,
	`scope` varchar(40) NOT NULL,
	`idem_key` varchar(200) NOT NULL,
	`route` varchar(200) NOT NULL,
	`request_hash` char(64) NOT NULL,
	`response_status` smallint NOT NULL,
	`response_body` json NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `idempotency_keys_id` PRIMARY KEY(`id`),
	CONSTRAINT `idempotency_scope_key` UNIQUE(`scope`,`idem_key`)
);
--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_actor_user_id_users_id_fk` FOREIGN KEY (`actor_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runway_ends` ADD CONSTRAINT `runway_ends_runway_id_runways_id_fk` FOREIGN KEY (`runway_id`) REFERENCES `runways`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runway_ends` ADD CONSTRAINT `runway_ends_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runways` ADD CONSTRAINT `runways_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `profile_levels` ADD CONSTRAINT `profile_levels_profile_id_profiles_id_fk` FOREIGN KEY (`profile_id`) REFERENCES `profiles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `profiles` ADD CONSTRAINT `profiles_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `profiles` ADD CONSTRAINT `profiles_withdrawn_by_user_id_users_id_fk` FOREIGN KEY (`withdrawn_by_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `profiles` ADD CONSTRAINT `profiles_filed_by_user_id_users_id_fk` FOREIGN KEY (`filed_by_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_revoked_by_user_id_users_id_fk` FOREIGN KEY (`revoked_by_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `sign_in_failures_email_at` ON `sign_in_failures` (`email`,`at`);--> statement-breakpoint
CREATE INDEX `sign_in_failures_addr_at` ON `sign_in_failures` (`client_address`,`at`);--> statement-breakpoint
CREATE INDEX `audit_log_at` ON `audit_log` (`at`);--> statement-breakpoint
CREATE INDEX `audit_log_entity` ON `audit_log` (`entity_type`,`entity_id`);--> statement-breakpoint
CREATE INDEX `runway_ends_runway` ON `runway_ends` (`runway_id`);--> statement-breakpoint
CREATE INDEX `runways_airfield` ON `runways` (`airfield_id`);--> statement-breakpoint
CREATE INDEX `profile_levels_profile` ON `profile_levels` (`profile_id`,`seq`);--> statement-breakpoint
CREATE INDEX `profiles_airfield_valid` ON `profiles` (`airfield_id`,`valid_from`,`valid_to`);--> statement-breakpoint
CREATE INDEX `profiles_airfield_status` ON `profiles` (`airfield_id`,`status`);--> statement-breakpoint
CREATE INDEX `idempotency_created` ON `idempotency_keys` (`created_at`);