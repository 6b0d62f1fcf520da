CREATE TABLE `profile_supersessions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`profile_id` int NOT NULL,
	`superseded_by_id` int NOT NULL,
	`from_at` datetime(3) NOT NULL,
	`to_at` datetime(3) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `profile_supersessions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `profiles` MODIFY COLUMN `source` enum('radiosonde','wind-profiler','doppler-lidar','aircraft-reports','model-forecast','pilot-report','estimate','coded-report') NOT NULL;--> statement-breakpoint
ALTER TABLE `airfields` ADD `reporting_station` varchar(4);--> statement-breakpoint
ALTER TABLE `airfields` ADD `path_settings` json;--> statement-breakpoint
ALTER TABLE `profile_levels` ADD `temperature_c` double;--> statement-breakpoint
ALTER TABLE `profiles` ADD `qnh_hpa` double;--> statement-breakpoint
ALTER TABLE `profiles` ADD `surface_pressure_hpa` double;--> statement-breakpoint
ALTER TABLE `profiles` ADD `raw_report` text;--> statement-breakpoint
ALTER TABLE `profiles` ADD `observed_at` datetime(3);--> statement-breakpoint
ALTER TABLE `profiles` ADD `reported_wind_shear` json;--> statement-breakpoint
ALTER TABLE `threshold_sets` ADD `max_f_factor` double;--> statement-breakpoint
ALTER TABLE `profile_supersessions` ADD CONSTRAINT `profile_supersessions_profile_id_profiles_id_fk` FOREIGN KEY (`profile_id`) REFERENCES `profiles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `profile_supersessions` ADD CONSTRAINT `profile_supersessions_superseded_by_id_profiles_id_fk` FOREIGN KEY (`superseded_by_id`) REFERENCES `profiles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `profile_supersessions_profile` ON `profile_supersessions` (`profile_id`);--> statement-breakpoint
CREATE INDEX `profile_supersessions_by` ON `profile_supersessions` (`superseded_by_id`);