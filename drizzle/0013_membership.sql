CREATE TABLE `club_settings` (
	`id` tinyint unsigned NOT NULL,
	`name` varchar(80) NOT NULL,
	`description` text NOT NULL,
	`description_html` text NOT NULL,
	`contact_email` varchar(254) NOT NULL,
	`join_policy` enum('open','approval','invitation') NOT NULL DEFAULT 'open',
	`updated_at` datetime(3),
	`updated_by` varchar(255),
	CONSTRAINT `club_settings_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `invitation` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`state` enum('pending','accepted','revoked') NOT NULL DEFAULT 'pending',
	`invited_by` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`sent_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`accepted_at` datetime(3),
	`accepted_by` varchar(255),
	`revoked_at` datetime(3),
	CONSTRAINT `invitation_id` PRIMARY KEY(`id`),
	CONSTRAINT `invitation_tokenHash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `join_request` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`note` varchar(500) NOT NULL DEFAULT '',
	`state` enum('pending','approved','declined') NOT NULL DEFAULT 'pending',
	`message` varchar(1000),
	`decided_by` varchar(255),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`decided_at` datetime(3),
	CONSTRAINT `join_request_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `audit_log` DROP FOREIGN KEY `audit_log_actor_id_user_id_fk`;
--> statement-breakpoint
ALTER TABLE `user` ADD `state` enum('active','pending','declined','suspended') DEFAULT 'active' NOT NULL;--> statement-breakpoint
ALTER TABLE `user` ADD `state_reason` varchar(500);--> statement-breakpoint
ALTER TABLE `user` ADD `in_directory` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `audit_log` ADD `before` json;--> statement-breakpoint
ALTER TABLE `audit_log` ADD `after` json;--> statement-breakpoint
ALTER TABLE `join_request` ADD CONSTRAINT `join_request_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `invitation_email_idx` ON `invitation` (`email`);--> statement-breakpoint
CREATE INDEX `invitation_state_idx` ON `invitation` (`state`,`created_at`);--> statement-breakpoint
CREATE INDEX `join_request_state_idx` ON `join_request` (`state`,`created_at`);--> statement-breakpoint
CREATE INDEX `join_request_user_idx` ON `join_request` (`user_id`);--> statement-breakpoint
CREATE INDEX `user_state_idx` ON `user` (`state`);--> statement-breakpoint
CREATE INDEX `audit_actor_idx` ON `audit_log` (`actor_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `audit_action_idx` ON `audit_log` (`action`,`created_at`);--> statement-breakpoint
CREATE INDEX `audit_created_idx` ON `audit_log` (`created_at`);--> statement-breakpoint
-- The audit log is append-only: the database refuses to change or remove a row, whoever asks.
CREATE TRIGGER `audit_log_no_update` BEFORE UPDATE ON `audit_log` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The audit log is append-only: rows cannot be changed.';--> statement-breakpoint
CREATE TRIGGER `audit_log_no_delete` BEFORE DELETE ON `audit_log` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The audit log is append-only: rows cannot be removed.';
