CREATE TABLE `write_turns` (
	`turn_key` varchar(330) NOT NULL,
	`seq` bigint NOT NULL DEFAULT 0,
	CONSTRAINT `write_turns_turn_key` PRIMARY KEY(`turn_key`)
);
