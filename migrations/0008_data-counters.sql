CREATE TABLE `data_versions` (
	`id` int NOT NULL,
	`version` bigint NOT NULL DEFAULT 0,
	CONSTRAINT `data_versions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `reader_versions` (
	`user_id` int NOT NULL,
	`version` bigint NOT NULL DEFAULT 0,
	CONSTRAINT `reader_versions_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
-- Every change that any list or briefing shows already moves a row of airfield_versions (0006, 0007): each such move
-- also moves the one data counter, read with every session.
INSERT INTO data_versions (id, version) VALUES (1, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `dv_airfield_versions_insert` AFTER INSERT ON `airfield_versions` FOR EACH ROW INSERT INTO data_versions (id, version) VALUES (1, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `dv_airfield_versions_update` AFTER UPDATE ON `airfield_versions` FOR EACH ROW INSERT INTO data_versions (id, version) VALUES (1, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `dv_airfield_versions_delete` AFTER DELETE ON `airfield_versions` FOR EACH ROW INSERT INTO data_versions (id, version) VALUES (1, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
-- A reader's receipts (what a briefing shows them as read) move their own counter.
CREATE TRIGGER `rv_briefing_receipts_insert` AFTER INSERT ON `briefing_receipts` FOR EACH ROW INSERT INTO reader_versions (user_id, version) VALUES (NEW.user_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
--> statement-breakpoint
CREATE TRIGGER `rv_briefing_receipts_update` AFTER UPDATE ON `briefing_receipts` FOR EACH ROW INSERT INTO reader_versions (user_id, version) SELECT t.u, 1 FROM (SELECT NEW.user_id AS u UNION SELECT OLD.user_id) t ON DUPLICATE KEY UPDATE version = reader_versions.version + 1;
--> statement-breakpoint
CREATE TRIGGER `rv_briefing_receipts_delete` AFTER DELETE ON `briefing_receipts` FOR EACH ROW INSERT INTO reader_versions (user_id, version) VALUES (OLD.user_id, 1) ON DUPLICATE KEY UPDATE version = version + 1;
