CREATE TABLE `follow_versions` (
	`user_id` int NOT NULL,
	`version` bigint NOT NULL DEFAULT 0,
	CONSTRAINT `follow_versions_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
-- The set of airfields starts counted (row -1 of airfield_versions); a user's follows count from their first change.
INSERT INTO airfield_versions (airfield_id, version) VALUES (-1, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
-- An airfield added, removed, recoded or renamed changes which airfields a search finds, their order and their count.
CREATE TRIGGER `av_set_airfields_insert` AFTER INSERT ON `airfields` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (-1, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_set_airfields_update` AFTER UPDATE ON `airfields` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) SELECT -1, 1 FROM DUAL WHERE NOT (NEW.code <=> OLD.code) OR NOT (NEW.name <=> OLD.name) OR NEW.id <> OLD.id ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `av_set_airfields_delete` AFTER DELETE ON `airfields` FOR EACH ROW INSERT INTO airfield_versions (airfield_id, version) VALUES (-1, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
-- Following or no longer following an airfield changes which airfields come first in that user's lists.
CREATE TRIGGER `fv_alert_subscriptions_insert` AFTER INSERT ON `alert_subscriptions` FOR EACH ROW INSERT INTO follow_versions (user_id, version) VALUES (NEW.user_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `fv_alert_subscriptions_update` AFTER UPDATE ON `alert_subscriptions` FOR EACH ROW INSERT INTO follow_versions (user_id, version) SELECT t.u, 1 FROM (SELECT NEW.user_id AS u UNION SELECT OLD.user_id) t ON DUPLICATE KEY UPDATE version = follow_versions.version + 1;
--> statement-breakpoint
CREATE TRIGGER `fv_alert_subscriptions_delete` AFTER DELETE ON `alert_subscriptions` FOR EACH ROW INSERT INTO follow_versions (user_id, version) VALUES (OLD.user_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
