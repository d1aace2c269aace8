import { boolean, date, decimal, index, int, json, mediumtext, mysqlEnum, mysqlTable, primaryKey, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { clubAreas, users } from '../club/schema';
import { species } from '../species/schema';
import { tanks } from '../journals/schema';
import { LISTING_CATEGORIES, LISTING_KINDS } from '../../swaps/listing';
import { LISTING_STATES } from '../../swaps/listing-state';
import { QUANTITY_UNITS } from '../../swaps/quantity';
import { LISTING_TERMS } from '../../swaps/terms';
import { CHECK_BASES, RESTRICTION_LEVELS } from '../../swaps/restrictions';

// The swap board: listings, their history, the private conversations about them, blocks,
// reports, the restricted species list and the board's settings.

const userRef = () => varchar({ length: 255 }).references(() => users.id);

/**
 * An offer or a wanted post. `lat`/`lng` are the owner's rounded point (or the pickup area's
 * centre) copied at creation, so the nearby search filters on this table's own indexed columns.
 * The reservation columns mirror the pure Reservation of $lib/swaps/listing-state.
 */
export const listings = mysqlTable(
	'listing',
	{
		id: id(),
		ownerId: userRef().notNull(),
		kind: mysqlEnum(LISTING_KINDS).notNull(),
		category: mysqlEnum(LISTING_CATEGORIES).notNull(),
		title: varchar({ length: 120 }).notNull(),
		speciesId: ref().references(() => species.id, { onDelete: 'set null' }),
		/** The catalogue's scientific name when picked, else what the member typed ('' for none). */
		speciesName: varchar({ length: 160 }).notNull().default(''),
		quantityAmount: int().notNull(),
		quantityUnit: mysqlEnum(QUANTITY_UNITS).notNull(),
		conditionNote: varchar({ length: 500 }).notNull().default(''),
		description: text(),
		/** The source rendered by $lib/server/markdown (sanitised), kept so reads do not render; rebuilt by the migration runner when the rules change. */
		descriptionHtml: mediumtext(),
		terms: mysqlEnum(LISTING_TERMS).notNull().default('free'),
		termsNote: varchar({ length: 160 }).notNull().default(''),
		pickupAreaId: ref().references(() => clubAreas.id, { onDelete: 'set null' }),
		/** Shown as "near <area>" rather than the area's name: the owner does not live in that area. */
		pickupNear: boolean().notNull().default(false),
		lat: decimal({ precision: 5, scale: 2, mode: 'number' }).notNull(),
		lng: decimal({ precision: 6, scale: 2, mode: 'number' }).notNull(),
		tankId: ref().references(() => tanks.id, { onDelete: 'set null' }),
		state: mysqlEnum(LISTING_STATES).notNull().default('open'),
		availableUntil: at().notNull(),
		reservedThreadId: ref(),
		reservedRequesterId: userRef(),
		reservedAt: at(),
		ownerConfirmedAt: at(),
		requesterConfirmedAt: at(),
		createdAt: createdAt(),
		updatedAt: at()
	},
	(t) => [
		// The nearby search: equality on state, a range on latitude, longitude checked in the index.
		index('listing_nearby_idx').on(t.state, t.lat, t.lng, t.availableUntil),
		index('listing_newest_idx').on(t.state, t.createdAt),
		index('listing_owner_idx').on(t.ownerId, t.state),
		index('listing_requester_idx').on(t.reservedRequesterId, t.state)
	]
);

/** Every change of a listing's state: who (null for the expiry job), when, from what to what. */
export const listingEvents = mysqlTable(
	'listing_event',
	{
		id: id(),
		listingId: ref()
			.notNull()
			.references(() => listings.id, { onDelete: 'cascade' }),
		/** 'create', or one of the state machine's actions. */
		action: varchar({ length: 32 }).notNull(),
		actorId: varchar({ length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		fromState: mysqlEnum(LISTING_STATES),
		toState: mysqlEnum(LISTING_STATES).notNull(),
		/** The member whose request the change concerns. */
		requesterId: varchar({ length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		/** A reason, e.g. an admin's for withdrawing. */
		note: varchar({ length: 300 }).notNull().default(''),
		at: at().notNull()
	},
	(t) => [index('listing_event_listing_idx').on(t.listingId, t.at)]
);

/**
 * A private conversation between a listing's owner and one other member: a request for an offer,
 * or an answer to a wanted post. Its status follows from the listing (see $lib/swaps/conversation).
 */
export const swapThreads = mysqlTable(
	'swap_thread',
	{
		id: id(),
		listingId: ref()
			.notNull()
			.references(() => listings.id, { onDelete: 'cascade' }),
		ownerId: userRef().notNull(),
		requesterId: userRef().notNull(),
		createdAt: createdAt(),
		lastMessageAt: at().notNull(),
		/** When each side was last mailed about this conversation (at most once an hour). */
		ownerMailedAt: at(),
		requesterMailedAt: at()
	},
	(t) => [
		uniqueIndex('swap_thread_pair_idx').on(t.listingId, t.requesterId),
		index('swap_thread_requester_idx').on(t.requesterId, t.lastMessageAt),
		index('swap_thread_owner_idx').on(t.ownerId, t.lastMessageAt)
	]
);

export const MESSAGE_KINDS = ['text', 'proposal', 'confirm', 'event'] as const;
export type MessageKind = (typeof MESSAGE_KINDS)[number];

/**
 * One message. A conversation has two members, so each message has exactly one recipient: the
 * header's unread count is one indexed COUNT on (recipient, read). `notifiedAt` is set when a mail
 * covered the message, or when it was settled that none will (mail off, or a note from the site).
 */
export const swapMessages = mysqlTable(
	'swap_message',
	{
		id: id(),
		threadId: ref()
			.notNull()
			.references(() => swapThreads.id, { onDelete: 'cascade' }),
		/** null for notes from the site ("the listing was withdrawn"). */
		senderId: varchar({ length: 255 }).references(() => users.id),
		recipientId: userRef().notNull(),
		kind: mysqlEnum(MESSAGE_KINDS).notNull(),
		body: text().notNull(),
		pickupOn: date({ mode: 'string' }),
		pickupFrom: varchar({ length: 5 }),
		pickupTo: varchar({ length: 5 }),
		pickupPlace: varchar({ length: 200 }),
		/** For a confirmation: the proposal it accepts. */
		refersTo: ref(),
		createdAt: createdAt(),
		readAt: at(),
		notifiedAt: at()
	},
	(t) => [
		index('swap_message_thread_idx').on(t.threadId, t.id),
		index('swap_message_unread_idx').on(t.recipientId, t.readAt),
		index('swap_message_mail_idx').on(t.notifiedAt, t.readAt)
	]
);

/** A member who will not hear from another: no requests or messages either way, their listings hidden. */
export const memberBlocks = mysqlTable(
	'member_block',
	{
		blockerId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		blockedId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		createdAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.blockerId, t.blockedId] }), index('member_block_blocked_idx').on(t.blockedId)]
);

export const REPORT_STATES = ['open', 'resolved', 'dismissed'] as const;
export type ReportState = (typeof REPORT_STATES)[number];

/** A member's report of a listing or of a message, for the admins. */
export const swapReports = mysqlTable(
	'swap_report',
	{
		id: id(),
		reporterId: userRef().notNull(),
		listingId: ref()
			.notNull()
			.references(() => listings.id, { onDelete: 'cascade' }),
		/** Set for a message report; the thread is then readable by admins while the report is open. */
		messageId: ref().references(() => swapMessages.id, { onDelete: 'set null' }),
		threadId: ref().references(() => swapThreads.id, { onDelete: 'set null' }),
		reason: varchar({ length: 1000 }).notNull(),
		/** What was reported, as it read when reported. */
		excerpt: text().notNull(),
		state: mysqlEnum(REPORT_STATES).notNull().default('open'),
		resolvedById: userRef(),
		resolvedAt: at(),
		resolution: varchar({ length: 500 }).notNull().default(''),
		createdAt: createdAt()
	},
	(t) => [index('swap_report_state_idx').on(t.state, t.createdAt), index('swap_report_thread_idx').on(t.threadId, t.state)]
);

/** Species the club restricts on the board, per jurisdiction, with the list each entry comes from. */
export const restrictedSpecies = mysqlTable(
	'restricted_species',
	{
		id: id(),
		speciesId: ref()
			.notNull()
			.references(() => species.id, { onDelete: 'cascade' }),
		jurisdiction: varchar({ length: 80 }).notNull(),
		level: mysqlEnum(RESTRICTION_LEVELS).notNull(),
		source: varchar({ length: 300 }).notNull(),
		note: varchar({ length: 500 }).notNull().default(''),
		checkedOn: date({ mode: 'string' }).notNull(),
		checkBasis: mysqlEnum(CHECK_BASES).notNull(),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('restricted_species_entry_idx').on(t.speciesId, t.jurisdiction), index('restricted_species_jurisdiction_idx').on(t.jurisdiction)]
);

/** The board's club-wide settings, e.g. `jurisdictions`: the ones whose restricted entries apply. */
export const swapSettings = mysqlTable('swap_setting', {
	name: varchar({ length: 64 }).primaryKey(),
	value: json().$type<unknown>().notNull()
});

/** When a member on daily summaries last got one. */
export const swapMailState = mysqlTable('swap_mail_state', {
	userId: varchar({ length: 255 })
		.primaryKey()
		.references(() => users.id, { onDelete: 'cascade' }),
	summaryMailedAt: at()
});

export type ListingRow = typeof listings.$inferSelect;
export type ThreadRow = typeof swapThreads.$inferSelect;
export type MessageRow = typeof swapMessages.$inferSelect;
export type ReportRow = typeof swapReports.$inferSelect;
