CREATE TABLE `media` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`owner_id` varchar(255) NOT NULL,
	`scope` varchar(32),
	`scope_id` bigint unsigned,
	`storage_key` varchar(190) NOT NULL,
	`upload_bytes` int NOT NULL,
	`byte_size` int NOT NULL,
	`width` int NOT NULL,
	`height` int NOT NULL,
	`renditions` json NOT NULL,
	`alt_text` varchar(300) NOT NULL DEFAULT '',
	`caption` varchar(500) NOT NULL DEFAULT '',
	`position` int NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`attached_at` datetime(3),
	CONSTRAINT `media_id` PRIMARY KEY(`id`),
	CONSTRAINT `media_storageKey_unique` UNIQUE(`storage_key`)
);
--> statement-breakpoint
CREATE TABLE `species` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` enum('plant','fish','shrimp','snail','invertebrate') NOT NULL,
	`scientific_name` varchar(160) NOT NULL,
	`common_name` varchar(120) NOT NULL DEFAULT '',
	`other_names` varchar(300) NOT NULL DEFAULT '',
	`placement` enum('foreground','midground','background','epiphyte','floating'),
	`growth_habit` enum('stem','rosette','rhizome','moss','carpeting','floating','bulb'),
	`growth_speed` enum('slow','moderate','fast'),
	`adult_size_cm` decimal(5,1),
	`temperament` enum('peaceful','semi-aggressive','aggressive','predatory'),
	`note` varchar(300) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `species_id` PRIMARY KEY(`id`),
	CONSTRAINT `species_scientificName_unique` UNIQUE(`scientific_name`)
);
--> statement-breakpoint
CREATE TABLE `tank_fertiliser` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`position` int NOT NULL DEFAULT 0,
	`item` varchar(120) NOT NULL,
	`amount` varchar(60) NOT NULL DEFAULT '',
	`frequency` varchar(60) NOT NULL DEFAULT '',
	CONSTRAINT `tank_fertiliser_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tank_filter` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`position` int NOT NULL DEFAULT 0,
	`label` varchar(120) NOT NULL DEFAULT '',
	`rated_flow` decimal(8,1),
	`flow_unit` enum('lph','usgph') NOT NULL DEFAULT 'lph',
	`media_notes` varchar(300) NOT NULL DEFAULT '',
	CONSTRAINT `tank_filter_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tank_light` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`position` int NOT NULL DEFAULT 0,
	`label` varchar(120) NOT NULL DEFAULT '',
	`watts` decimal(6,1) NOT NULL,
	`hours_per_day` decimal(4,2) NOT NULL,
	CONSTRAINT `tank_light_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tank_livestock` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`position` int NOT NULL DEFAULT 0,
	`species_id` bigint unsigned,
	`name` varchar(160) NOT NULL,
	`count` int NOT NULL DEFAULT 1,
	`added_on` date,
	`removed_on` date,
	CONSTRAINT `tank_livestock_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tank_plant` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tank_id` bigint unsigned NOT NULL,
	`position` int NOT NULL DEFAULT 0,
	`species_id` bigint unsigned,
	`name` varchar(160) NOT NULL,
	`placement` enum('foreground','midground','background','epiphyte','floating'),
	`added_on` date,
	`removed_on` date,
	CONSTRAINT `tank_plant_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tank` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`owner_id` varchar(255) NOT NULL,
	`name` varchar(80) NOT NULL,
	`style` varchar(40) NOT NULL DEFAULT '',
	`set_up_on` date,
	`length_cm` decimal(7,2) NOT NULL,
	`width_cm` decimal(7,2) NOT NULL,
	`height_cm` decimal(7,2) NOT NULL,
	`glass_mm` decimal(5,2),
	`substrate_kind` varchar(40) NOT NULL DEFAULT '',
	`substrate_note` varchar(120) NOT NULL DEFAULT '',
	`substrate_depth_cm` decimal(6,2),
	`hardscape` varchar(500) NOT NULL DEFAULT '',
	`hardscape_litres` decimal(8,2),
	`heater_watts` decimal(6,1),
	`heater_note` varchar(160) NOT NULL DEFAULT '',
	`co2_method` enum('none','liquid','pressurised') NOT NULL DEFAULT 'none',
	`co2_bubbles_per_second` decimal(4,1),
	`water_litres` decimal(8,2),
	`description` text,
	`visibility` enum('public','club','private') NOT NULL DEFAULT 'club',
	`retired_on` date,
	`retired_note` varchar(300) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	CONSTRAINT `tank_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `media` ADD CONSTRAINT `media_owner_id_user_id_fk` FOREIGN KEY (`owner_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_fertiliser` ADD CONSTRAINT `tank_fertiliser_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_filter` ADD CONSTRAINT `tank_filter_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_light` ADD CONSTRAINT `tank_light_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_livestock` ADD CONSTRAINT `tank_livestock_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_livestock` ADD CONSTRAINT `tank_livestock_species_id_species_id_fk` FOREIGN KEY (`species_id`) REFERENCES `species`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_plant` ADD CONSTRAINT `tank_plant_tank_id_tank_id_fk` FOREIGN KEY (`tank_id`) REFERENCES `tank`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank_plant` ADD CONSTRAINT `tank_plant_species_id_species_id_fk` FOREIGN KEY (`species_id`) REFERENCES `species`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tank` ADD CONSTRAINT `tank_owner_id_user_id_fk` FOREIGN KEY (`owner_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `media_scope_idx` ON `media` (`scope`,`scope_id`,`position`);--> statement-breakpoint
CREATE INDEX `media_owner_idx` ON `media` (`owner_id`,`scope`);--> statement-breakpoint
CREATE INDEX `media_pending_idx` ON `media` (`scope`,`created_at`);--> statement-breakpoint
CREATE INDEX `species_kind_idx` ON `species` (`kind`);--> statement-breakpoint
CREATE INDEX `species_common_idx` ON `species` (`common_name`);--> statement-breakpoint
CREATE INDEX `tank_fertiliser_tank_idx` ON `tank_fertiliser` (`tank_id`,`position`);--> statement-breakpoint
CREATE INDEX `tank_filter_tank_idx` ON `tank_filter` (`tank_id`,`position`);--> statement-breakpoint
CREATE INDEX `tank_light_tank_idx` ON `tank_light` (`tank_id`,`position`);--> statement-breakpoint
CREATE INDEX `tank_livestock_tank_idx` ON `tank_livestock` (`tank_id`,`position`);--> statement-breakpoint
CREATE INDEX `tank_plant_tank_idx` ON `tank_plant` (`tank_id`,`position`);--> statement-breakpoint
CREATE INDEX `tank_owner_idx` ON `tank` (`owner_id`,`retired_on`);--> statement-breakpoint
CREATE INDEX `tank_visibility_idx` ON `tank` (`visibility`);