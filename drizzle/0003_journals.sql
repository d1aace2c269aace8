CREATE TABLE `entry_comment` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`entry_id` bigint unsigned NOT NULL,
	`author_id` varchar(255) NOT NULL,
	`body` text NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `entry_comment_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `journal_digest` (
	`user_id` varchar(255) NOT NULL,
	`week_of` date NOT NULL,
	`sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `journal_digest_user_id_week_of_pk` PRIMARY KEY(`user_id`,`week_of`)
);
--> statement-breakpoint
CREATE TABLE `journal_entry` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`author_id` varchar(255) NOT NULL,
	`entry_on` date NOT NULL,
	`title` varchar(120) NOT NULL DEFAULT '',
	`body` mediumtext NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	CONSTRAINT `journal_entry_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `journal_event` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`entry_id` bigint unsigned,
	`kind` enum('water-change','trim','filter-clean','media-change','dose','glass','co2-check','plant-added','plant-removed','livestock-added','livestock-removed','algae','note','upkeep') NOT NULL,
	`occurred_on` date NOT NULL,
	`position` int NOT NULL DEFAULT 0,
	`percent` decimal(4,1),
	`filter_part` enum('prefilter','media','impeller','hoses','intake','whole'),
	`what` varchar(160) NOT NULL DEFAULT '',
	`amount` decimal(10,3),
	`amount_unit` enum('mL','g','mg','drops','tablets'),
	`salt_id` varchar(24),
	`species_id` bigint unsigned,
	`species_name` varchar(160) NOT NULL DEFAULT '',
	`count` int,
	`algae_kind` enum('green-dust','green-spots','threads','dark-tufts','slime','brown-film','green-water','other'),
	`note` varchar(1000) NOT NULL DEFAULT '',
	`tank_plant_id` bigint unsigned,
	`tank_livestock_id` bigint unsigned,
	`task_id` bigint unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `journal_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `maintenance_task` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`kind` enum('water-change','trim','filter-clean','media-change','dose','glass','co2-check','water-test','other') NOT NULL,
	`filter_part` enum('prefilter','media','impeller','hoses','intake','whole'),
	`label` varchar(80) NOT NULL,
	`interval_days` int NOT NULL,
	`last_done_on` date,
	`position` int NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `maintenance_task_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tank_admire` (
	`tank_id` bigint unsigned NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `tank_admire_tank_id_user_id_pk` PRIMARY KEY(`tank_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `tank_follow` (
	`tank_id` bigint unsigned NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`last_mailed_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `tank_follow_tank_id_user_id_pk` PRIMARY KEY(`tank_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `water_test` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`tested_on` date NOT NULL,
	`ph` decimal(4,2),
	`kh` decimal(5,2),
	`gh` decimal(5,2),
	`no3` decimal(7,2),
	`po4` decimal(6,2),
	`k` decimal(7,2),
	`fe` decimal(6,3),
	`ammonia` decimal(6,3),
	`ammonia_basis` enum('NH3','NH4','N') NOT NULL DEFAULT 'NH3',
	`no2` decimal(6,3),
	`temperature_c` decimal(4,1),
	`tds` int,
	`note` varchar(500) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `water_test_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `tank` ADD `volume_litres` decimal(8,2);--> statement-breakpoint
ALTER TABLE `tank` ADD `activity_at` datetime(3);--> statement-breakpoint
ALTER TABLE `entry_comment` ADD CONSTRAINT `entry_comment_entry_id_journal_entry_id_fk` FOREIGN KEY (`entry_id`) REFERENCES `journal_entry`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `entry_comment` ADD CONSTRAINT `entry_comment_author_id_user_id_fk` FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_digest` ADD CONSTRAINT `journal_digest_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_entry` ADD CONSTRAINT `journal_entry_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_entry` ADD CONSTRAINT `journal_entry_author_id_user_id_fk` FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_event` ADD CONSTRAINT `journal_event_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_event` ADD CONSTRAINT `journal_event_entry_id_journal_entry_id_fk` FOREIGN KEY (`entry_id`) REFERENCES `journal_entry`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_event` ADD CONSTRAINT `journal_event_species_id_species_id_fk` FOREIGN KEY (`species_id`) REFERENCES `species`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_event` ADD CONSTRAINT `journal_event_tank_plant_id_tank_plant_id_fk` FOREIGN KEY (`tank_plant_id`) REFERENCES `tank_plant`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_event` ADD CONSTRAINT `journal_event_tank_livestock_id_tank_livestock_id_fk` FOREIGN KEY (`tank_livestock_id`) REFERENCES `tank_livestock`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_event` ADD CONSTRAINT `journal_event_task_id_maintenance_task_id_fk` FOREIGN KEY (`task_id`) REFERENCES `maintenance_task`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `maintenance_task` ADD CONSTRAINT `maintenance_task_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_admire` ADD CONSTRAINT `tank_admire_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_admire` ADD CONSTRAINT `tank_admire_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_follow` ADD CONSTRAINT `tank_follow_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_follow` ADD CONSTRAINT `tank_follow_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `water_test` ADD CONSTRAINT `water_test_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `entry_comment_entry_idx` ON `entry_comment` (`entry_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `journal_entry_tank_idx` ON `journal_entry` (`tank_id`,`entry_on`);--> statement-breakpoint
CREATE INDEX `journal_event_tank_idx` ON `journal_event` (`tank_id`,`occurred_on`);--> statement-breakpoint
CREATE INDEX `journal_event_entry_idx` ON `journal_event` (`entry_id`,`position`);--> statement-breakpoint
CREATE INDEX `maintenance_task_tank_idx` ON `maintenance_task` (`tank_id`,`position`);--> statement-breakpoint
CREATE INDEX `tank_admire_user_idx` ON `tank_admire` (`user_id`);--> statement-breakpoint
CREATE INDEX `tank_follow_user_idx` ON `tank_follow` (`user_id`);--> statement-breakpoint
CREATE INDEX `water_test_tank_idx` ON `water_test` (`tank_id`,`tested_on`);--> statement-breakpoint
CREATE INDEX `tank_activity_idx` ON `tank` (`visibility`,`activity_at`);