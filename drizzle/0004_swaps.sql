CREATE TABLE `listing_event` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`listing_id` bigint unsigned NOT NULL,
	`action` varchar(32) NOT NULL,
	`actor_id` varchar(255),
	`from_state` enum('open','reserved','handed-over','withdrawn','expired'),
	`to_state` enum('open','reserved','handed-over','withdrawn','expired') NOT NULL,
	`requester_id` varchar(255),
	`note` varchar(300) NOT NULL DEFAULT '',
	`at` datetime(3) NOT NULL,
	CONSTRAINT `listing_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `listing` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`owner_id` varchar(255) NOT NULL,
	`kind` enum('offer','wanted') NOT NULL,
	`category` enum('plants','livestock','hardscape','equipment') NOT NULL,
	`title` varchar(120) NOT NULL,
	`species_id` bigint unsigned,
	`species_name` varchar(160) NOT NULL DEFAULT '',
	`quantity_amount` int NOT NULL,
	`quantity_unit` enum('stems','portions','pots','mat-cm2','individuals','pieces') NOT NULL,
	`condition_note` varchar(500) NOT NULL DEFAULT '',
	`description` text,
	`terms` enum('free','swap','token') NOT NULL DEFAULT 'free',
	`terms_note` varchar(160) NOT NULL DEFAULT '',
	`pickup_area_id` bigint unsigned,
	`pickup_near` boolean NOT NULL DEFAULT false,
	`lat` decimal(5,2) NOT NULL,
	`lng` decimal(6,2) NOT NULL,
	`tank_id` bigint unsigned,
	`state` enum('open','reserved','handed-over','withdrawn','expired') NOT NULL DEFAULT 'open',
	`available_until` datetime(3) NOT NULL,
	`reserved_thread_id` bigint unsigned,
	`reserved_requester_id` varchar(255),
	`reserved_at` datetime(3),
	`owner_confirmed_at` datetime(3),
	`requester_confirmed_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	CONSTRAINT `listing_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `member_block` (
	`blocker_id` varchar(255) NOT NULL,
	`blocked_id` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `member_block_blocker_id_blocked_id_pk` PRIMARY KEY(`blocker_id`,`blocked_id`)
);
--> statement-breakpoint
CREATE TABLE `restricted_species` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`species_id` bigint unsigned NOT NULL,
	`jurisdiction` varchar(80) NOT NULL,
	`level` enum('banned','cautioned') NOT NULL,
	`source` varchar(300) NOT NULL,
	`note` varchar(500) NOT NULL DEFAULT '',
	`checked_on` date NOT NULL,
	`check_basis` enum('source','memory') NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `restricted_species_id` PRIMARY KEY(`id`),
	CONSTRAINT `restricted_species_entry_idx` UNIQUE(`species_id`,`jurisdiction`)
);
--> statement-breakpoint
CREATE TABLE `swap_mail_state` (
	`user_id` varchar(255) NOT NULL,
	`summary_mailed_at` datetime(3),
	CONSTRAINT `swap_mail_state_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `swap_message` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`thread_id` bigint unsigned NOT NULL,
	`sender_id` varchar(255),
	`recipient_id` varchar(255) NOT NULL,
	`kind` enum('text','proposal','confirm','event') NOT NULL,
	`body` text NOT NULL,
	`pickup_on` date,
	`pickup_from` varchar(5),
	`pickup_to` varchar(5),
	`pickup_place` varchar(200),
	`refers_to` bigint unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`read_at` datetime(3),
	`notified_at` datetime(3),
	CONSTRAINT `swap_message_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `swap_report` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`reporter_id` varchar(255) NOT NULL,
	`listing_id` bigint unsigned NOT NULL,
	`message_id` bigint unsigned,
	`thread_id` bigint unsigned,
	`reason` varchar(1000) NOT NULL,
	`excerpt` text NOT NULL,
	`state` enum('open','resolved','dismissed') NOT NULL DEFAULT 'open',
	`resolved_by_id` varchar(255),
	`resolved_at` datetime(3),
	`resolution` varchar(500) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `swap_report_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `swap_setting` (
	`name` varchar(64) NOT NULL,
	`value` json NOT NULL,
	CONSTRAINT `swap_setting_name` PRIMARY KEY(`name`)
);
--> statement-breakpoint
CREATE TABLE `swap_thread` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`listing_id` bigint unsigned NOT NULL,
	`owner_id` varchar(255) NOT NULL,
	`requester_id` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_message_at` datetime(3) NOT NULL,
	`owner_mailed_at` datetime(3),
	`requester_mailed_at` datetime(3),
	CONSTRAINT `swap_thread_id` PRIMARY KEY(`id`),
	CONSTRAINT `swap_thread_pair_idx` UNIQUE(`listing_id`,`requester_id`)
);
--> statement-breakpoint
ALTER TABLE `listing_event` ADD CONSTRAINT `listing_event_listing_id_listing_id_fk` FOREIGN KEY (`listing_id`) REFERENCES `listing`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `listing_event` ADD CONSTRAINT `listing_event_actor_id_user_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `listing_event` ADD CONSTRAINT `listing_event_requester_id_user_id_fk` FOREIGN KEY (`requester_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `listing` ADD CONSTRAINT `listing_owner_id_user_id_fk` FOREIGN KEY (`owner_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `listing` ADD CONSTRAINT `listing_species_id_species_id_fk` FOREIGN KEY (`species_id`) REFERENCES `species`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `listing` ADD CONSTRAINT `listing_pickup_area_id_club_area_id_fk` FOREIGN KEY (`pickup_area_id`) REFERENCES `club_area`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `listing` ADD CONSTRAINT `listing_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `listing` ADD CONSTRAINT `listing_reserved_requester_id_user_id_fk` FOREIGN KEY (`reserved_requester_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `member_block` ADD CONSTRAINT `member_block_blocker_id_user_id_fk` FOREIGN KEY (`blocker_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `member_block` ADD CONSTRAINT `member_block_blocked_id_user_id_fk` FOREIGN KEY (`blocked_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `restricted_species` ADD CONSTRAINT `restricted_species_species_id_species_id_fk` FOREIGN KEY (`species_id`) REFERENCES `species`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_mail_state` ADD CONSTRAINT `swap_mail_state_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_message` ADD CONSTRAINT `swap_message_thread_id_swap_thread_id_fk` FOREIGN KEY (`thread_id`) REFERENCES `swap_thread`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_message` ADD CONSTRAINT `swap_message_sender_id_user_id_fk` FOREIGN KEY (`sender_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_message` ADD CONSTRAINT `swap_message_recipient_id_user_id_fk` FOREIGN KEY (`recipient_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_report` ADD CONSTRAINT `swap_report_reporter_id_user_id_fk` FOREIGN KEY (`reporter_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_report` ADD CONSTRAINT `swap_report_listing_id_listing_id_fk` FOREIGN KEY (`listing_id`) REFERENCES `listing`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_report` ADD CONSTRAINT `swap_report_message_id_swap_message_id_fk` FOREIGN KEY (`message_id`) REFERENCES `swap_message`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_report` ADD CONSTRAINT `swap_report_thread_id_swap_thread_id_fk` FOREIGN KEY (`thread_id`) REFERENCES `swap_thread`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_report` ADD CONSTRAINT `swap_report_resolved_by_id_user_id_fk` FOREIGN KEY (`resolved_by_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_thread` ADD CONSTRAINT `swap_thread_listing_id_listing_id_fk` FOREIGN KEY (`listing_id`) REFERENCES `listing`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_thread` ADD CONSTRAINT `swap_thread_owner_id_user_id_fk` FOREIGN KEY (`owner_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `swap_thread` ADD CONSTRAINT `swap_thread_requester_id_user_id_fk` FOREIGN KEY (`requester_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `listing_event_listing_idx` ON `listing_event` (`listing_id`,`at`);--> statement-breakpoint
CREATE INDEX `listing_nearby_idx` ON `listing` (`state`,`lat`,`lng`,`available_until`);--> statement-breakpoint
CREATE INDEX `listing_newest_idx` ON `listing` (`state`,`created_at`);--> statement-breakpoint
CREATE INDEX `listing_owner_idx` ON `listing` (`owner_id`,`state`);--> statement-breakpoint
CREATE INDEX `listing_requester_idx` ON `listing` (`reserved_requester_id`,`state`);--> statement-breakpoint
CREATE INDEX `member_block_blocked_idx` ON `member_block` (`blocked_id`);--> statement-breakpoint
CREATE INDEX `restricted_species_jurisdiction_idx` ON `restricted_species` (`jurisdiction`);--> statement-breakpoint
CREATE INDEX `swap_message_thread_idx` ON `swap_message` (`thread_id`,`id`);--> statement-breakpoint
CREATE INDEX `swap_message_unread_idx` ON `swap_message` (`recipient_id`,`read_at`);--> statement-breakpoint
CREATE INDEX `swap_message_mail_idx` ON `swap_message` (`notified_at`,`read_at`);--> statement-breakpoint
CREATE INDEX `swap_report_state_idx` ON `swap_report` (`state`,`created_at`);--> statement-breakpoint
CREATE INDEX `swap_report_thread_idx` ON `swap_report` (`thread_id`,`state`);--> statement-breakpoint
CREATE INDEX `swap_thread_requester_idx` ON `swap_thread` (`requester_id`,`last_message_at`);--> statement-breakpoint
CREATE INDEX `swap_thread_owner_idx` ON `swap_thread` (`owner_id`,`last_message_at`);