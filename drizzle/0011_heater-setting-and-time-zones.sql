ALTER TABLE `user` ADD `time_zone` varchar(64);--> statement-breakpoint
ALTER TABLE `tank` ADD `heater_set_c` decimal(4,1);--> statement-breakpoint
UPDATE `tank` SET `heater_set_c` = CAST(REGEXP_SUBSTR(`heater_note`, '[0-9]+([.][0-9])?') AS DECIMAL(4,1)), `heater_note` = '' WHERE `heater_set_c` IS NULL AND `heater_note` REGEXP '^set to [0-9]{2}([.][0-9])? ?°C$';
