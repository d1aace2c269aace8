import { index, int, json, mediumtext, mysqlEnum, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id } from '../db/columns';
import { users } from '../club/schema';
import { VISIBILITIES, type Audience } from '../../news/post';

/**
 * A post by the club's admins: a draft until it is published, then shown on /news (public posts to
 * everyone, members-only posts to members) and mailed once to its audience through the outbox
 * (topic `news:<id>:post`, one row per recipient).
 */
export const newsPosts = mysqlTable(
	'news_post',
	{
		id: id(),
		authorId: varchar({ length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		title: varchar({ length: 160 }).notNull(),
		body: mediumtext().notNull(),
		bodyHtml: mediumtext(),
		visibility: mysqlEnum(VISIBILITIES).notNull().default('members'),
		audience: json().$type<Audience>().notNull(),
		/** How many members the mail was queued for when it was published. */
		recipients: int(),
		publishedAt: at(),
		createdAt: createdAt(),
		updatedAt: at()
	},
	(t) => [index('news_post_published_idx').on(t.publishedAt)]
);
