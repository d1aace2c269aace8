-- The tank form's style suggestions are the club's own words now: a style picked from the old
-- suggestions moves to its new name. Free text a keeper typed otherwise is left as it is.
UPDATE `tank` SET `style` = 'wood and stone' WHERE `style` = 'nature';
--> statement-breakpoint
UPDATE `tank` SET `style` = 'stem garden' WHERE `style` = 'dutch';
