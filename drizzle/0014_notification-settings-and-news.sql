CREATE TABLE `mail_preference` (
	`user_id` varchar(255) NOT NULL,
	`swaps` enum('immediately','daily','off') NOT NULL DEFAULT 'immediately',
	`comments` enum('on','off') NOT NULL DEFAULT 'on',
	`follows` enum('daily','off') NOT NULL DEFAULT 'daily',
	`upkeep` enum('weekly','off') NOT NULL DEFAULT 'off',
	`news` enum('on','off') NOT NULL DEFAULT 'on',
	`results` enum('on','off') NOT NULL DEFAULT 'on',
	`judging` enum('on','off') NOT NULL DEFAULT 'on',
	`updated_at` datetime(3),
	CONSTRAINT `mail_preference_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `news_post` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`author_id` varchar(255),
	`title` varchar(160) NOT NULL,
	`body` mediumtext NOT NULL,
	`body_html` mediumtext,
	`visibility` enum('public','members') NOT NULL DEFAULT 'members',
	`audience` json NOT NULL,
	`recipients` int,
	`published_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	CONSTRAINT `news_post_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `outbox` ADD `category` varchar(16) DEFAULT 'account' NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_preference` ADD CONSTRAINT `mail_preference_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `news_post` ADD CONSTRAINT `news_post_author_id_user_id_fk` FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `news_post_published_idx` ON `news_post` (`published_at`);--> statement-breakpoint
-- Today's settings move over before their columns go: a summary an hour becomes the daily digest,
-- the weekly digest the weekly upkeep reminder, announcements both club news and contest results.
INSERT INTO `mail_preference` (`user_id`, `swaps`, `upkeep`, `news`, `results`)
SELECT `id`,
	CASE `notify_messages` WHEN 'each' THEN 'immediately' WHEN 'hourly' THEN 'daily' ELSE 'off' END,
	IF(`weekly_digest`, 'weekly', 'off'),
	IF(`announcements`, 'on', 'off'),
	IF(`announcements`, 'on', 'off')
FROM `user` WHERE `deleted_at` IS NULL;--> statement-breakpoint
UPDATE `outbox` SET `category` = CASE
	WHEN `topic` LIKE 'swap-%' THEN 'swaps'
	WHEN `topic` LIKE 'tank-follow:%' THEN 'follows'
	WHEN `topic` = 'journal-digest' THEN 'upkeep'
	WHEN `topic` LIKE 'contest:%:results:%' THEN 'results'
	WHEN `topic` LIKE 'contest:%:reminder' OR `topic` LIKE 'contest:%:nudge' THEN 'judging'
	ELSE 'account' END;--> statement-breakpoint
ALTER TABLE `user` DROP COLUMN `notify_messages`;--> statement-breakpoint
ALTER TABLE `user` DROP COLUMN `weekly_digest`;--> statement-breakpoint
ALTER TABLE `user` DROP COLUMN `announcements`;