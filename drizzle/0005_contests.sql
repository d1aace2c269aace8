CREATE TABLE `contest_card` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`contest_id` bigint unsigned NOT NULL,
	`entry_id` bigint unsigned NOT NULL,
	`judge_id` varchar(255) NOT NULL,
	`status` enum('draft','submitted') NOT NULL DEFAULT 'draft',
	`fields` json NOT NULL,
	`version` int NOT NULL DEFAULT 1,
	`last_save_id` varchar(64),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL,
	`submitted_at` datetime(3),
	CONSTRAINT `contest_card_id` PRIMARY KEY(`id`),
	CONSTRAINT `contest_card_cell_idx` UNIQUE(`entry_id`,`judge_id`)
);
--> statement-breakpoint
CREATE TABLE `contest_category` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`contest_id` bigint unsigned NOT NULL,
	`position` int NOT NULL,
	`name` varchar(60) NOT NULL,
	`description` varchar(500) NOT NULL DEFAULT '',
	`min_litres` decimal(8,1),
	`max_litres` decimal(8,1),
	`min_age_weeks` int,
	CONSTRAINT `contest_category_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `contest_conflict` (
	`entry_id` bigint unsigned NOT NULL,
	`judge_id` varchar(255) NOT NULL,
	`reason` varchar(300) NOT NULL DEFAULT '',
	`declared_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `contest_conflict_entry_id_judge_id_pk` PRIMARY KEY(`entry_id`,`judge_id`)
);
--> statement-breakpoint
CREATE TABLE `contest_criterion` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`contest_id` bigint unsigned NOT NULL,
	`position` int NOT NULL,
	`label` varchar(80) NOT NULL,
	`guidance` varchar(1000) NOT NULL DEFAULT '',
	`max_points` decimal(5,1) NOT NULL,
	`weight` decimal(6,3) NOT NULL,
	`tie_break_rank` int NOT NULL,
	CONSTRAINT `contest_criterion_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `contest_entry` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`contest_id` bigint unsigned NOT NULL,
	`category_id` bigint unsigned NOT NULL,
	`entrant_id` varchar(255) NOT NULL,
	`tank_id` bigint unsigned,
	`number` int,
	`statement` text NOT NULL,
	`litres` decimal(8,1),
	`volume_source` enum('measured','estimated'),
	`age_weeks` int,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	CONSTRAINT `contest_entry_id` PRIMARY KEY(`id`),
	CONSTRAINT `contest_entry_number_idx` UNIQUE(`contest_id`,`number`),
	CONSTRAINT `contest_entry_tank_idx` UNIQUE(`contest_id`,`tank_id`)
);
--> statement-breakpoint
CREATE TABLE `contest_judge` (
	`contest_id` bigint unsigned NOT NULL,
	`judge_id` varchar(255) NOT NULL,
	`assigned_by` varchar(255),
	`assigned_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `contest_judge_contest_id_judge_id_pk` PRIMARY KEY(`contest_id`,`judge_id`)
);
--> statement-breakpoint
CREATE TABLE `contest` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`title` varchar(120) NOT NULL,
	`rules` text NOT NULL,
	`state` enum('draft','open','judging','published','archived') NOT NULL DEFAULT 'draft',
	`entry_opens_on` date NOT NULL,
	`entry_closes_on` date NOT NULL,
	`judging_opens_on` date NOT NULL,
	`judging_closes_on` date NOT NULL,
	`entries_per_member` int NOT NULL DEFAULT 1,
	`aggregation` enum('mean','median','trimmed-mean') NOT NULL DEFAULT 'mean',
	`rank_by` enum('raw','standardised') NOT NULL DEFAULT 'raw',
	`results_revision` int NOT NULL DEFAULT 0,
	`announced_revision` int,
	`created_by` varchar(255),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	`opened_at` datetime(3),
	`judging_started_at` datetime(3),
	`published_at` datetime(3),
	`archived_at` datetime(3),
	CONSTRAINT `contest_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `contest_card` ADD CONSTRAINT `contest_card_contest_id_contest_id_fk` FOREIGN KEY (`contest_id`) REFERENCES `contest`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_card` ADD CONSTRAINT `contest_card_entry_id_contest_entry_id_fk` FOREIGN KEY (`entry_id`) REFERENCES `contest_entry`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_card` ADD CONSTRAINT `contest_card_judge_id_user_id_fk` FOREIGN KEY (`judge_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_category` ADD CONSTRAINT `contest_category_contest_id_contest_id_fk` FOREIGN KEY (`contest_id`) REFERENCES `contest`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_conflict` ADD CONSTRAINT `contest_conflict_entry_id_contest_entry_id_fk` FOREIGN KEY (`entry_id`) REFERENCES `contest_entry`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_conflict` ADD CONSTRAINT `contest_conflict_judge_id_user_id_fk` FOREIGN KEY (`judge_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_criterion` ADD CONSTRAINT `contest_criterion_contest_id_contest_id_fk` FOREIGN KEY (`contest_id`) REFERENCES `contest`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_entry` ADD CONSTRAINT `contest_entry_contest_id_contest_id_fk` FOREIGN KEY (`contest_id`) REFERENCES `contest`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_entry` ADD CONSTRAINT `contest_entry_category_id_contest_category_id_fk` FOREIGN KEY (`category_id`) REFERENCES `contest_category`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_entry` ADD CONSTRAINT `contest_entry_entrant_id_user_id_fk` FOREIGN KEY (`entrant_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_entry` ADD CONSTRAINT `contest_entry_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_judge` ADD CONSTRAINT `contest_judge_contest_id_contest_id_fk` FOREIGN KEY (`contest_id`) REFERENCES `contest`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_judge` ADD CONSTRAINT `contest_judge_judge_id_user_id_fk` FOREIGN KEY (`judge_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest_judge` ADD CONSTRAINT `contest_judge_assigned_by_user_id_fk` FOREIGN KEY (`assigned_by`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contest` ADD CONSTRAINT `contest_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `contest_card_judge_idx` ON `contest_card` (`contest_id`,`judge_id`);--> statement-breakpoint
CREATE INDEX `contest_category_contest_idx` ON `contest_category` (`contest_id`,`position`);--> statement-breakpoint
CREATE INDEX `contest_criterion_contest_idx` ON `contest_criterion` (`contest_id`,`position`);--> statement-breakpoint
CREATE INDEX `contest_entry_entrant_idx` ON `contest_entry` (`contest_id`,`entrant_id`);--> statement-breakpoint
CREATE INDEX `contest_entry_category_idx` ON `contest_entry` (`category_id`);--> statement-breakpoint
CREATE INDEX `contest_state_idx` ON `contest` (`state`);