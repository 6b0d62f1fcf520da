CREATE TABLE `airfield_versions` (
	`airfield_id` int NOT NULL,
	`version` bigint NOT NULL DEFAULT 0,
	CONSTRAINT `airfield_versions_airfield_id` PRIMARY KEY(`airfield_id`)
);
--> statement-breakpoint
-- Every airfield starts counted; 0 is the organisation's limits (see server/db/schema/versions.ts).
INSERT INTO airfield_versions (airfield_id, version) SELECT id, 1 FROM airfields UNION ALL SELECT 0, 1;
--> statement-breakpoint
CREATE TRIGGER `av_airfields_insert` AFTER INSERT ON `airfields` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_airfields_update` AFTER UPDATE ON `airfields` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_runways_insert` AFTER INSERT ON `runways` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_runways_update` AFTER UPDATE ON `runways` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_runways_delete` AFTER DELETE ON `runways` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (OLD.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_runway_ends_insert` AFTER INSERT ON `runway_ends` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_runway_ends_update` AFTER UPDATE ON `runway_ends` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_runway_ends_delete` AFTER DELETE ON `runway_ends` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (OLD.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_profiles_insert` AFTER INSERT ON `profiles` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_profiles_update` AFTER UPDATE ON `profiles` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_profiles_delete` AFTER DELETE ON `profiles` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (OLD.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_alert_subscriptions_insert` AFTER INSERT ON `alert_subscriptions` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_alert_subscriptions_update` AFTER UPDATE ON `alert_subscriptions` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (NEW.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_alert_subscriptions_delete` AFTER DELETE ON `alert_subscriptions` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (OLD.airfield_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_threshold_sets_insert` AFTER INSERT ON `threshold_sets` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (IFNULL(NEW.airfield_id, 0), 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_profile_supersessions_insert` AFTER INSERT ON `profile_supersessions` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES ((SELECT p.airfield_id FROM profiles p WHERE p.id = NEW.profile_id), 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_threshold_sets_update` AFTER UPDATE ON `threshold_sets` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (IFNULL(NEW.airfield_id, 0), 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_profile_supersessions_update` AFTER UPDATE ON `profile_supersessions` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES ((SELECT p.airfield_id FROM profiles p WHERE p.id = NEW.profile_id), 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_threshold_sets_delete` AFTER DELETE ON `threshold_sets` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (IFNULL(OLD.airfield_id, 0), 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_profile_supersessions_delete` AFTER DELETE ON `profile_supersessions` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES ((SELECT p.airfield_id FROM profiles p WHERE p.id = OLD.profile_id), 1) ON DUPLICATE KEY UPDATE version = version + 1;
