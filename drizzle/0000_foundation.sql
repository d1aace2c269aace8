CREATE TABLE `seed_run` (
	`name` varchar(64) NOT NULL,
	`ran_at` datetime(3) NOT NULL,
	CONSTRAINT `seed_run_name` PRIMARY KEY(`name`)
);
--> statement-breakpoint
CREATE TABLE `account` (
	`userId` varchar(255) NOT NULL,
	`type` varchar(255) NOT NULL,
	`provider` varchar(255) NOT NULL,
	`providerAccountId` varchar(255) NOT NULL,
	`refresh_token` varchar(255),
	`access_token` varchar(255),
	`expires_at` int,
	`token_type` varchar(255),
	`scope` varchar(255),
	`id_token` varchar(2048),
	`session_state` varchar(255),
	CONSTRAINT `account_provider_providerAccountId_pk` PRIMARY KEY(`provider`,`providerAccountId`)
);
--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`actor_id` varchar(255),
	`action` varchar(64) NOT NULL,
	`subject_type` varchar(32) NOT NULL,
	`subject_id` varchar(255) NOT NULL,
	`detail` json,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `club_area` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(80) NOT NULL,
	`lat` decimal(5,2) NOT NULL,
	`lng` decimal(6,2) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `club_area_id` PRIMARY KEY(`id`),
	CONSTRAINT `club_area_name_unique` UNIQUE(`name`)
);
--> statement-breakpoint
CREATE TABLE `session` (
	`sessionToken` varchar(255) NOT NULL,
	`userId` varchar(255) NOT NULL,
	`expires` timestamp NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_seen_at` datetime(3),
	`user_agent` varchar(255),
	CONSTRAINT `session_sessionToken` PRIMARY KEY(`sessionToken`)
);
--> statement-breakpoint
CREATE TABLE `sign_in_request` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email_hash` char(64) NOT NULL,
	`client_hash` char(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `sign_in_request_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `user` (
	`id` varchar(255) NOT NULL,
	`name` varchar(255),
	`email` varchar(255),
	`emailVerified` timestamp(3),
	`image` varchar(255),
	`display_name` varchar(60),
	`role` enum('member','judge','admin') NOT NULL DEFAULT 'member',
	`home_lat` decimal(5,2),
	`home_lng` decimal(6,2),
	`home_area_id` bigint unsigned,
	`units` enum('metric','us','imperial') NOT NULL DEFAULT 'metric',
	`notify_messages` enum('each','hourly','off') NOT NULL DEFAULT 'hourly',
	`weekly_digest` boolean NOT NULL DEFAULT false,
	`announcements` boolean NOT NULL DEFAULT true,
	`unsubscribe_token` char(32) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_seen_at` datetime(3),
	CONSTRAINT `user_id` PRIMARY KEY(`id`),
	CONSTRAINT `user_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `verificationToken` (
	`identifier` varchar(255) NOT NULL,
	`token` varchar(255) NOT NULL,
	`expires` timestamp NOT NULL,
	CONSTRAINT `verificationToken_identifier_token_pk` PRIMARY KEY(`identifier`,`token`)
);
--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`to_address` varchar(255) NOT NULL,
	`subject` varchar(255) NOT NULL,
	`text_body` mediumtext NOT NULL,
	`html_body` mediumtext NOT NULL,
	`headers` json,
	`topic` varchar(120),
	`dedupe_key` varchar(190),
	`message_id` varchar(190) NOT NULL,
	`state` enum('queued','sending','sent','failed') NOT NULL DEFAULT 'queued',
	`attempts` int NOT NULL DEFAULT 0,
	`next_attempt_at` datetime(3) NOT NULL,
	`lease_until` datetime(3),
	`last_error` text,
	`sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`),
	CONSTRAINT `outbox_dedupeKey_unique` UNIQUE(`dedupe_key`)
);
--> statement-breakpoint
CREATE TABLE `outbox_attempt` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`outbox_id` bigint unsigned NOT NULL,
	`worker` varchar(64) NOT NULL,
	`ok` boolean NOT NULL,
	`error` text,
	`at` datetime(3) NOT NULL,
	CONSTRAINT `outbox_attempt_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `account` ADD CONSTRAINT `account_userId_user_id_fk` FOREIGN KEY (`userId`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_actor_id_user_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `session` ADD CONSTRAINT `session_userId_user_id_fk` FOREIGN KEY (`userId`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `outbox_attempt` ADD CONSTRAINT `outbox_attempt_outbox_id_outbox_id_fk` FOREIGN KEY (`outbox_id`) REFERENCES `outbox`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `audit_subject_idx` ON `audit_log` (`subject_type`,`subject_id`);--> statement-breakpoint
CREATE INDEX `session_user_idx` ON `session` (`userId`);--> statement-breakpoint
CREATE INDEX `sign_in_email_idx` ON `sign_in_request` (`email_hash`,`created_at`);--> statement-breakpoint
CREATE INDEX `sign_in_client_idx` ON `sign_in_request` (`client_hash`,`created_at`);--> statement-breakpoint
CREATE INDEX `user_role_idx` ON `user` (`role`);--> statement-breakpoint
CREATE INDEX `user_display_name_idx` ON `user` (`display_name`);--> statement-breakpoint
CREATE INDEX `outbox_due_idx` ON `outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `outbox_topic_idx` ON `outbox` (`topic`);--> statement-breakpoint
CREATE INDEX `outbox_attempt_outbox_idx` ON `outbox_attempt` (`outbox_id`);