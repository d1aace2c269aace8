ALTER TABLE `listing` MODIFY COLUMN `quantity_unit` enum('stems','plants','rhizome-pieces','bulbs','portions','cups','pots','mat-cm2','individuals','pieces') NOT NULL;--> statement-breakpoint
ALTER TABLE `entry_comment` ADD `parent_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `entry_comment` ADD `edited_at` datetime(3);--> statement-breakpoint
ALTER TABLE `tank` ADD `par_at_substrate` int;--> statement-breakpoint
ALTER TABLE `tank` ADD `par_depth_cm` decimal(5,1);--> statement-breakpoint
ALTER TABLE `water_test` ADD `edited_at` datetime(3);--> statement-breakpoint
ALTER TABLE `entry_comment` ADD CONSTRAINT `entry_comment_parent_id_entry_comment_id_fk` FOREIGN KEY (`parent_id`) REFERENCES `entry_comment`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `entry_comment_parent_idx` ON `entry_comment` (`parent_id`);