import type { AdapterAccountType } from '@auth/sveltekit/adapters';
import { boolean, char, decimal, index, int, mysqlEnum, mysqlTable, primaryKey, text, timestamp, tinyint, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { ROLES, UNIT_SYSTEMS } from '../../club/roles';
import { JOIN_POLICIES, MEMBER_STATES } from '../../club/membership';

// The four Auth.js tables keep the column names @auth/drizzle-adapter expects;
// our own columns on `user` and `session` are additions the adapter ignores.

export const users = mysqlTable(
	'user',
	{
		id: varchar('id', { length: 255 })
			.primaryKey()
			.$defaultFn(() => crypto.randomUUID()),
		name: varchar('name', { length: 255 }),
		email: varchar('email', { length: 255 }).unique(),
		emailVerified: timestamp('emailVerified', { mode: 'date', fsp: 3 }),
		image: varchar('image', { length: 255 }),
		displayName: varchar({ length: 60 }),
		role: mysqlEnum(ROLES).notNull().default('member'),
		// Rounded to two decimals (about 1.1 km north-south) before it is stored; see club/location.ts.
		homeLat: decimal({ precision: 5, scale: 2, mode: 'number' }),
		homeLng: decimal({ precision: 6, scale: 2, mode: 'number' }),
		homeAreaId: ref(),
		units: mysqlEnum(UNIT_SYSTEMS).notNull().default('metric'),
		/** IANA name; null until the member chose one or their browser reported its own. */
		timeZone: varchar({ length: 64 }),
		notifyMessages: mysqlEnum(['each', 'hourly', 'off']).notNull().default('hourly'),
		weeklyDigest: boolean().notNull().default(false),
		announcements: boolean().notNull().default(true),
		unsubscribeToken: char({ length: 32 })
			.notNull()
			.$defaultFn(() => crypto.randomUUID().replaceAll('-', '')),
		createdAt: createdAt(),
		lastSeenAt: at(),
		// Membership (see the block at the end of this file): only `active` people are members.
		state: mysqlEnum(MEMBER_STATES).notNull().default('active'),
		/** Why an admin suspended the member (shown to admins only). */
		stateReason: varchar({ length: 500 }),
		/** Whether the member appears in the member directory; off until they choose it. */
		inDirectory: boolean().notNull().default(false),
		/** Set when the member deleted their account (or an admin removed it): the row is then an
		 * opaque tombstone with nothing personal left, kept so published results, conversations and
		 * audit rows still point somewhere. See club/account-deletion.ts. */
		deletedAt: at()
	},
	(t) => [index('user_role_idx').on(t.role), index('user_display_name_idx').on(t.displayName), index('user_state_idx').on(t.state)]
);

export const accounts = mysqlTable(
	'account',
	{
		userId: varchar('userId', { length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		type: varchar('type', { length: 255 }).$type<AdapterAccountType>().notNull(),
		provider: varchar('provider', { length: 255 }).notNull(),
		providerAccountId: varchar('providerAccountId', { length: 255 }).notNull(),
		refresh_token: varchar('refresh_token', { length: 255 }),
		access_token: varchar('access_token', { length: 255 }),
		expires_at: int('expires_at'),
		token_type: varchar('token_type', { length: 255 }),
		scope: varchar('scope', { length: 255 }),
		id_token: varchar('id_token', { length: 2048 }),
		session_state: varchar('session_state', { length: 255 })
	},
	(account) => [primaryKey({ columns: [account.provider, account.providerAccountId] })]
);

export const sessions = mysqlTable(
	'session',
	{
		sessionToken: varchar('sessionToken', { length: 255 }).primaryKey(),
		userId: varchar('userId', { length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		expires: timestamp('expires', { mode: 'date' }).notNull(),
		createdAt: createdAt(),
		lastSeenAt: at(),
		userAgent: varchar({ length: 255 })
	},
	(t) => [index('session_user_idx').on(t.userId)]
);

export const verificationTokens = mysqlTable(
	'verificationToken',
	{
		identifier: varchar('identifier', { length: 255 }).notNull(),
		token: varchar('token', { length: 255 }).notNull(),
		expires: timestamp('expires', { mode: 'date' }).notNull()
	},
	(vt) => [primaryKey({ columns: [vt.identifier, vt.token] })]
);

/** One row per sign-in link requested; read back to rate-limit per address and per client. */
export const signInRequests = mysqlTable(
	'sign_in_request',
	{
		id: id(),
		emailHash: char({ length: 64 }).notNull(),
		clientHash: char({ length: 64 }).notNull(),
		createdAt: at().notNull()
	},
	(t) => [index('sign_in_email_idx').on(t.emailHash, t.createdAt), index('sign_in_client_idx').on(t.clientHash, t.createdAt)]
);

/** Admin-defined neighbourhoods with a centre point; members may pick one as their home area. */
export const clubAreas = mysqlTable('club_area', {
	id: id(),
	name: varchar({ length: 80 }).notNull().unique(),
	lat: decimal({ precision: 5, scale: 2, mode: 'number' }).notNull(),
	lng: decimal({ precision: 6, scale: 2, mode: 'number' }).notNull(),
	createdAt: createdAt()
});

// ---------------------------------------------------------------------------------------------
// Membership: the club's settings, join requests and invitations.
// ---------------------------------------------------------------------------------------------

/** The club's own settings: one row (id 1); missing until an admin first saves them. */
export const clubSettings = mysqlTable('club_settings', {
	id: tinyint({ unsigned: true }).primaryKey(),
	name: varchar({ length: 80 }).notNull(),
	/** Markdown as the admin wrote it, and its sanitised HTML made once when saved. */
	description: text().notNull(),
	descriptionHtml: text().notNull(),
	contactEmail: varchar({ length: 254 }).notNull(),
	joinPolicy: mysqlEnum(JOIN_POLICIES).notNull().default('open'),
	updatedAt: at(),
	updatedBy: varchar({ length: 255 })
});

/** A signed-in person's request to join a club that admits by approval, and the admin's answer. */
export const joinRequests = mysqlTable(
	'join_request',
	{
		id: id(),
		userId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		note: varchar({ length: 500 }).notNull().default(''),
		state: mysqlEnum(['pending', 'approved', 'declined']).notNull().default('pending'),
		/** The admin's message with the decision (mailed to the applicant). */
		message: varchar({ length: 1000 }),
		decidedBy: varchar({ length: 255 }),
		createdAt: createdAt(),
		decidedAt: at()
	},
	(t) => [index('join_request_state_idx').on(t.state, t.createdAt), index('join_request_user_idx').on(t.userId)]
);

/**
 * An invitation by e-mail. The link's token is stored only as its SHA-256; a resend replaces it.
 * Expired is not stored: a pending invitation past `expiresAt` is expired.
 */
export const invitations = mysqlTable(
	'invitation',
	{
		id: id(),
		email: varchar({ length: 254 }).notNull(),
		tokenHash: char({ length: 64 }).notNull().unique(),
		state: mysqlEnum(['pending', 'accepted', 'revoked']).notNull().default('pending'),
		invitedBy: varchar({ length: 255 }).notNull(),
		createdAt: createdAt(),
		sentAt: at().notNull(),
		expiresAt: at().notNull(),
		acceptedAt: at(),
		acceptedBy: varchar({ length: 255 }),
		revokedAt: at()
	},
	(t) => [index('invitation_email_idx').on(t.email), index('invitation_state_idx').on(t.state, t.createdAt)]
);
