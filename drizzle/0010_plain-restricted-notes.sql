-- Notes on restricted species are shown to members; how an entry was checked is kept in check_basis
-- and explained on the sources page, so the seed's provenance remark leaves the note text.
UPDATE `restricted_species` SET `note` = REPLACE(`note`, ' (from memory)', '') WHERE `note` LIKE '%(from memory)%';
