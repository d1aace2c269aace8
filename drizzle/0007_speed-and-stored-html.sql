CREATE TABLE `markdown_render` (
	`field` varchar(64) NOT NULL,
	`version` int NOT NULL,
	`rendered_at` datetime(3) NOT NULL,
	CONSTRAINT `markdown_render_field` PRIMARY KEY(`field`)
);--> statement-breakpoint
CREATE TABLE `contest_result` (
	`contest_id` bigint unsigned NOT NULL,
	`revision` int NOT NULL,
	`results` json NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `contest_result_contest_id_revision_pk` PRIMARY KEY(`contest_id`,`revision`)
);--> statement-breakpoint
ALTER TABLE `entry_comment` ADD `body_html` mediumtext;--> statement-breakpoint
ALTER TABLE `journal_entry` ADD `body_html` mediumtext;--> statement-breakpoint
ALTER TABLE `tank` ADD `description_html` mediumtext;--> statement-breakpoint
ALTER TABLE `tank` ADD `recent_at` datetime(3) GENERATED ALWAYS AS (coalesce(activity_at, created_at)) STORED;--> statement-breakpoint
ALTER TABLE `listing` ADD `description_html` mediumtext;--> statement-breakpoint
ALTER TABLE `contest_entry` ADD `statement_html` mediumtext;--> statement-breakpoint
ALTER TABLE `contest_entry` ADD `statement_pictures` int;--> statement-breakpoint
ALTER TABLE `contest` ADD `rules_html` mediumtext;--> statement-breakpoint
ALTER TABLE `contest_result` ADD CONSTRAINT `contest_result_contest_id_contest_id_fk` FOREIGN KEY (`contest_id`) REFERENCES `contest`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `journal_entry_timeline_idx` ON `journal_entry` (`tank_id`,`entry_on`,`created_at`);--> statement-breakpoint
CREATE INDEX `journal_event_date_idx` ON `journal_event` (`tank_id`,`occurred_on`,`created_at`);--> statement-breakpoint
CREATE INDEX `journal_event_standalone_idx` ON `journal_event` (`tank_id`,`entry_id`,`occurred_on`,`created_at`);--> statement-breakpoint
CREATE INDEX `tank_showcase_recent_idx` ON `tank` (`visibility`,`retired_on`,`recent_at`);--> statement-breakpoint
CREATE INDEX `tank_showcase_new_idx` ON `tank` (`visibility`,`retired_on`,`created_at`);--> statement-breakpoint
CREATE INDEX `tank_showcase_style_idx` ON `tank` (`visibility`,`retired_on`,`style`);--> statement-breakpoint
CREATE INDEX `water_test_timeline_idx` ON `water_test` (`tank_id`,`tested_on`,`created_at`);--> statement-breakpoint
DROP INDEX `journal_entry_tank_idx` ON `journal_entry`;--> statement-breakpoint
DROP INDEX `journal_event_tank_idx` ON `journal_event`;--> statement-breakpoint
DROP INDEX `tank_visibility_idx` ON `tank`;--> statement-breakpoint
DROP INDEX `water_test_tank_idx` ON `water_test`;
