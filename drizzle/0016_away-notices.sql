CREATE TABLE `away_reminder` (
	`plan_id` bigint unsigned NOT NULL,
	`sitter_id` varchar(255) NOT NULL,
	`day` date NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `away_reminder_plan_id_sitter_id_day_pk` PRIMARY KEY(`plan_id`,`sitter_id`,`day`)
);
--> statement-breakpoint
ALTER TABLE `away_plan` ADD `visit_mail` enum('each','daily') DEFAULT 'each' NOT NULL;--> statement-breakpoint
ALTER TABLE `away_plan` ADD `digest_sent_on` date;--> statement-breakpoint
ALTER TABLE `away_visit` ADD `keeper_mailed_at` datetime(3);--> statement-breakpoint
ALTER TABLE `away_reminder` ADD CONSTRAINT `away_reminder_plan_id_away_plan_id_fk` FOREIGN KEY (`plan_id`) REFERENCES `away_plan`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `away_reminder` ADD CONSTRAINT `away_reminder_sitter_id_user_id_fk` FOREIGN KEY (`sitter_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
UPDATE `away_visit` SET `keeper_mailed_at` = `created_at` WHERE `keeper_mailed_at` IS NULL;
