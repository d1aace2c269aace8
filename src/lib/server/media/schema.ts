import { index, int, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { users } from '../club/schema';
import type { RenditionSize } from '../../media/urls';

export interface StoredRendition {
	width: number;
	height: number;
	bytes: number;
}

/**
 * One uploaded photo. Its renditions live in the bucket under `storageKey` + "/<size>.webp"
 * (keys never change, so a URL can be cached for a long time). A fresh upload has no scope: it is
 * pending, visible to its owner only, until the owning feature attaches it inside its own
 * transaction; pending uploads older than a day are swept away with their objects.
 */
export const media = mysqlTable(
	'media',
	{
		id: id(),
		ownerId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id),
		/** What the photo belongs to ('tank', and the scopes other features register); null while pending. */
		scope: varchar({ length: 32 }),
		scopeId: ref(),
		storageKey: varchar({ length: 190 }).notNull().unique(),
		/** Bytes of the file as uploaded, and of every stored rendition together. */
		uploadBytes: int().notNull(),
		byteSize: int().notNull(),
		/** The upright picture's size, after the camera's orientation tag was applied. */
		width: int().notNull(),
		height: int().notNull(),
		renditions: json().$type<Record<RenditionSize, StoredRendition>>().notNull(),
		altText: varchar({ length: 300 }).notNull().default(''),
		caption: varchar({ length: 500 }).notNull().default(''),
		position: int().notNull().default(0),
		createdAt: createdAt(),
		attachedAt: at()
	},
	(t) => [
		index('media_scope_idx').on(t.scope, t.scopeId, t.position),
		index('media_owner_idx').on(t.ownerId, t.scope),
		index('media_pending_idx').on(t.scope, t.createdAt)
	]
);

export type MediaRow = typeof media.$inferSelect;
