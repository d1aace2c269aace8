import { bigint, datetime } from 'drizzle-orm/mysql-core';
import { sql } from 'drizzle-orm';

// Column shapes every domain shares. MariaDB rejects Drizzle's `serial` (it emits
// "serial AUTO_INCREMENT"), so ids are spelled out as unsigned BIGINT AUTO_INCREMENT.

export const id = () => bigint({ mode: 'number', unsigned: true }).autoincrement().primaryKey();

/** A reference to another table's `id()`. */
export const ref = () => bigint({ mode: 'number', unsigned: true });

/** A UTC timestamp with milliseconds; DATETIME rather than TIMESTAMP, which ends in 2038. */
export const at = () => datetime({ mode: 'date', fsp: 3 });

export const createdAt = () =>
	datetime({ mode: 'date', fsp: 3 })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP(3)`);
