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
CREATE TABLE `briefing_receipts` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`profile_id` int NOT NULL,
	`airfield_id` int NOT NULL,
	`read_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `briefing_receipts_id` PRIMARY KEY(`id`),
	CONSTRAINT `briefing_receipts_user_profile` UNIQUE(`user_id`,`profile_id`)
);
--> statement-breakpoint
CREATE TABLE `user_preferences` (
	`user_id` int NOT NULL,
	`speed_unit` enum('kt','mps') NOT NULL DEFAULT 'kt',
	`height_unit` enum('ft','m') NOT NULL DEFAULT 'ft',
	`heading_ref` enum('true','magnetic') NOT NULL DEFAULT 'true',
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `user_preferences_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `alert_inbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`alert_id` int NOT NULL,
	`event` enum('raised','cleared') NOT NULL,
	`title` varchar(300) NOT NULL,
	`acknowledged_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `alert_inbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `alert_subscriptions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`airfield_id` int NOT NULL,
	`email` boolean NOT NULL DEFAULT true,
	`push` boolean NOT NULL DEFAULT false,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `alert_subscriptions_id` PRIMARY KEY(`id`),
	CONSTRAINT `alert_subscriptions_user_airfield` UNIQUE(`user_id`,`airfield_id`)
);
--> statement-breakpoint
CREATE TABLE `alerts` (
	`id` int AUTO_INCREMENT NOT NULL,
	`airfield_id` int NOT NULL,
	`profile_id` int NOT NULL,
	`designator` varchar(3) NOT NULL,
	`kind` varchar(32) NOT NULL,
	`value` double NOT NULL,
	`limit_value` double NOT NULL,
	`unit` varchar(16) NOT NULL,
	`excess` double NOT NULL,
	`message` varchar(300) NOT NULL,
	`state` enum('active','cleared','superseded','expired') NOT NULL DEFAULT 'active',
	`continues_alert_id` int,
	`raised_count` int NOT NULL DEFAULT 1,
	`cleared_at` datetime(3),
	`clear_reason` varchar(300),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `alerts_id` PRIMARY KEY(`id`),
	CONSTRAINT `alerts_profile_end_kind` UNIQUE(`profile_id`,`designator`,`kind`)
);
--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`kind` enum('alert-raised','alert-cleared','invitation','password-reset') NOT NULL,
	`channel` enum('email','push') NOT NULL,
	`dedupe_key` varchar(160) NOT NULL,
	`alert_id` int,
	`user_id` int,
	`push_subscription_id` int,
	`to_address` varchar(254),
	`subject` varchar(300),
	`text_body` mediumtext,
	`html_body` mediumtext,
	`push_payload` json,
	`state` enum('queued','sent','failed') NOT NULL DEFAULT 'queued',
	`attempts` int NOT NULL DEFAULT 0,
	`next_attempt_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_error` text,
	`sent_at` datetime(3),
	`sent_by` varchar(64),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`),
	CONSTRAINT `outbox_dedupe` UNIQUE(`dedupe_key`)
);
--> statement-breakpoint
CREATE TABLE `push_subscriptions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`endpoint` varchar(500) NOT NULL,
	`p256dh` varchar(120) NOT NULL,
	`auth` varchar(60) NOT NULL,
	`label` varchar(120) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `push_subscriptions_id` PRIMARY KEY(`id`),
	CONSTRAINT `push_subscriptions_endpoint` UNIQUE(`endpoint`)
);
--> statement-breakpoint
CREATE TABLE `threshold_changes` (
	`id` int AUTO_INCREMENT NOT NULL,
	`scope_key` varchar(40) NOT NULL,
	`airfield_id` int,
	`designator` varchar(3),
	`changed_by_user_id` int NOT NULL,
	`changed_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`reason` varchar(500) NOT NULL,
	`old_values` json,
	`new_values` json NOT NULL,
	CONSTRAINT `threshold_changes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `threshold_sets` (
	`id` int AUTO_INCREMENT NOT NULL,
	`scope_key` varchar(40) NOT NULL,
	`airfield_id` int,
	`designator` varchar(3),
	`max_crosswind_kt` double,
	`max_tailwind_kt` double,
	`max_layer_shear_kt_per_100ft` double,
	`max_vector_diff_600m_kt` double,
	`max_airspeed_loss_kt` double,
	`near_limit_margin_pct` double,
	`updated_by_user_id` int,
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `threshold_sets_id` PRIMARY KEY(`id`),
	CONSTRAINT `threshold_sets_scope` UNIQUE(`scope_key`)
);
--> statement-breakpoint
CREATE TABLE `user_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`purpose` enum('invitation','password-reset') NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	`created_by_user_id` int,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `user_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `user_tokens_hash` UNIQUE(`token_hash`)
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
ALTER TABLE `briefing_receipts` ADD CONSTRAINT `briefing_receipts_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `briefing_receipts` ADD CONSTRAINT `briefing_receipts_profile_id_profiles_id_fk` FOREIGN KEY (`profile_id`) REFERENCES `profiles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `briefing_receipts` ADD CONSTRAINT `briefing_receipts_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `user_preferences` ADD CONSTRAINT `user_preferences_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `alert_inbox` ADD CONSTRAINT `alert_inbox_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `alert_inbox` ADD CONSTRAINT `alert_inbox_alert_id_alerts_id_fk` FOREIGN KEY (`alert_id`) REFERENCES `alerts`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `alert_subscriptions` ADD CONSTRAINT `alert_subscriptions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `alert_subscriptions` ADD CONSTRAINT `alert_subscriptions_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `alerts` ADD CONSTRAINT `alerts_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `alerts` ADD CONSTRAINT `alerts_profile_id_profiles_id_fk` FOREIGN KEY (`profile_id`) REFERENCES `profiles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `outbox` ADD CONSTRAINT `outbox_alert_id_alerts_id_fk` FOREIGN KEY (`alert_id`) REFERENCES `alerts`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `outbox` ADD CONSTRAINT `outbox_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `push_subscriptions` ADD CONSTRAINT `push_subscriptions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `threshold_changes` ADD CONSTRAINT `threshold_changes_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `threshold_changes` ADD CONSTRAINT `threshold_changes_changed_by_user_id_users_id_fk` FOREIGN KEY (`changed_by_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `threshold_sets` ADD CONSTRAINT `threshold_sets_airfield_id_airfields_id_fk` FOREIGN KEY (`airfield_id`) REFERENCES `airfields`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `threshold_sets` ADD CONSTRAINT `threshold_sets_updated_by_user_id_users_id_fk` FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `user_tokens` ADD CONSTRAINT `user_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `user_tokens` ADD CONSTRAINT `user_tokens_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
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
CREATE INDEX `briefing_receipts_airfield` ON `briefing_receipts` (`airfield_id`,`read_at`);--> statement-breakpoint
CREATE INDEX `alert_inbox_user` ON `alert_inbox` (`user_id`,`acknowledged_at`);--> statement-breakpoint
CREATE INDEX `alerts_airfield_state` ON `alerts` (`airfield_id`,`state`);--> statement-breakpoint
CREATE INDEX `outbox_due` ON `outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `outbox_alert` ON `outbox` (`alert_id`);--> statement-breakpoint
CREATE INDEX `push_subscriptions_user` ON `push_subscriptions` (`user_id`);--> statement-breakpoint
CREATE INDEX `threshold_changes_scope` ON `threshold_changes` (`scope_key`,`changed_at`);--> statement-breakpoint
CREATE INDEX `threshold_sets_airfield` ON `threshold_sets` (`airfield_id`);--> statement-breakpoint
CREATE INDEX `user_tokens_user` ON `user_tokens` (`user_id`);--> statement-breakpoint
CREATE INDEX `idempotency_created` ON `idempotency_keys` (`created_at`);