CREATE TABLE `away_helper` (
	`user_id` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `away_helper_user_id_pk` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `away_plan` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`keeper_id` varchar(255) NOT NULL,
	`starts_on` date NOT NULL,
	`ends_on` date NOT NULL,
	`feeding` enum('none','reduced','usual') NOT NULL,
	`lighting` enum('keep','shorten') NOT NULL,
	`keeper_phone` varchar(40) NOT NULL DEFAULT '',
	`body` mediumtext NOT NULL,
	`body_html` mediumtext,
	`share_token_hash` char(64),
	`summary_sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	CONSTRAINT `away_plan_id` PRIMARY KEY(`id`),
	CONSTRAINT `away_plan_share_idx` UNIQUE(`share_token_hash`)
);
--> statement-breakpoint
CREATE TABLE `away_sitter` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`plan_id` bigint unsigned NOT NULL,
	`sitter_id` varchar(255) NOT NULL,
	`state` enum('asked','accepted','declined','withdrawn') NOT NULL DEFAULT 'asked',
	`asked_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`answered_at` datetime(3),
	CONSTRAINT `away_sitter_id` PRIMARY KEY(`id`),
	CONSTRAINT `away_sitter_plan_idx` UNIQUE(`plan_id`,`sitter_id`)
);
--> statement-breakpoint
CREATE TABLE `away_visit` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`plan_id` bigint unsigned NOT NULL,
	`sitter_id` varchar(255) NOT NULL,
	`visited_on` date NOT NULL,
	`entry_id` bigint unsigned,
	`done` json NOT NULL,
	`note` varchar(1000) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `away_visit_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `journal_event` MODIFY COLUMN `kind` enum('water-change','top-up','trim','filter-clean','media-change','dose','glass','co2-check','plant-added','plant-removed','livestock-added','livestock-removed','algae','note','upkeep') NOT NULL;--> statement-breakpoint
ALTER TABLE `away_helper` ADD CONSTRAINT `away_helper_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_plan` ADD CONSTRAINT `away_plan_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_plan` ADD CONSTRAINT `away_plan_keeper_id_user_id_fk` FOREIGN KEY (`keeper_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_sitter` ADD CONSTRAINT `away_sitter_plan_id_away_plan_id_fk` FOREIGN KEY (`plan_id`) REFERENCES `away_plan`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_sitter` ADD CONSTRAINT `away_sitter_sitter_id_user_id_fk` FOREIGN KEY (`sitter_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_visit` ADD CONSTRAINT `away_visit_plan_id_away_plan_id_fk` FOREIGN KEY (`plan_id`) REFERENCES `away_plan`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_visit` ADD CONSTRAINT `away_visit_sitter_id_user_id_fk` FOREIGN KEY (`sitter_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_visit` ADD CONSTRAINT `away_visit_entry_id_journal_entry_id_fk` FOREIGN KEY (`entry_id`) REFERENCES `journal_entry`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `away_plan_tank_idx` ON `away_plan` (`tank_id`,`starts_on`);--> statement-breakpoint
CREATE INDEX `away_plan_keeper_idx` ON `away_plan` (`keeper_id`,`ends_on`);--> statement-breakpoint
CREATE INDEX `away_sitter_sitter_idx` ON `away_sitter` (`sitter_id`,`state`);--> statement-breakpoint
CREATE INDEX `away_visit_plan_idx` ON `away_visit` (`plan_id`,`visited_on`);