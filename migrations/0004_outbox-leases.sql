CREATE TABLE `outbox_attempts` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`outbox_id` bigint NOT NULL,
	`attempt` int NOT NULL,
	`claim_token` varchar(36) NOT NULL,
	`instance` varchar(64) NOT NULL,
	`claimed_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`finished_at` datetime(3),
	`outcome` enum('sending','sent','error','released','lease-expired') NOT NULL DEFAULT 'sending',
	`error` text,
	CONSTRAINT `outbox_attempts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
DROP INDEX `outbox_due` ON `outbox`;--> statement-breakpoint
ALTER TABLE `outbox` ADD `delivery_id` varchar(36) DEFAULT (uuid()) NOT NULL;--> statement-breakpoint
ALTER TABLE `outbox` ADD `priority` tinyint DEFAULT 2 NOT NULL;--> statement-breakpoint
ALTER TABLE `outbox` ADD `fan_seq` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `outbox` ADD `airfield_id` int;--> statement-breakpoint
ALTER TABLE `outbox` ADD `claim_token` varchar(36);--> statement-breakpoint
ALTER TABLE `outbox` ADD `claimed_by` varchar(64);--> statement-breakpoint
ALTER TABLE `outbox` ADD `lease_until` datetime(3);--> statement-breakpoint
ALTER TABLE `outbox` ADD `first_attempt_at` datetime(3);--> statement-breakpoint
ALTER TABLE `outbox` ADD CONSTRAINT `outbox_delivery` UNIQUE(`delivery_id`);--> statement-breakpoint
CREATE INDEX `outbox_attempts_outbox` ON `outbox_attempts` (`outbox_id`,`attempt`);--> statement-breakpoint
CREATE INDEX `outbox_due` ON `outbox` (`state`,`priority`,`fan_seq`,`next_attempt_at`);