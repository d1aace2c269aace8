import { and, asc, count, eq, like, ne, or, sql } from 'drizzle-orm';
import { db, type Database, type DbOrTx } from '../db';
import type { Role, UnitSystem } from '../../club/roles';
import { roundToKilometre } from '../../club/location';
import { users } from './schema';
import * as audit from '../audit';

export type UserRow = typeof users.$inferSelect;

/** What the rest of the app knows about the signed-in person (`event.locals.user`). */
export interface Viewer {
	id: string;
	email: string;
	displayName: string | null;
	role: Role;
	units: UnitSystem;
}

export function toViewer(row: UserRow): Viewer {
	return {
		id: row.id,
		email: row.email ?? '',
		displayName: row.displayName,
		role: row.role,
		units: row.units
	};
}

export async function getById(id: string, tx: DbOrTx = db): Promise<UserRow | undefined> {
	const [row] = await tx.select().from(users).where(eq(users.id, id)).limit(1);
	return row;
}

export async function getByEmail(email: string, tx: DbOrTx = db): Promise<UserRow | undefined> {
	const [row] = await tx.select().from(users).where(eq(users.email, email.toLowerCase())).limit(1);
	return row;
}

export async function setDisplayName(id: string, displayName: string): Promise<void> {
	await db.update(users).set({ displayName }).where(eq(users.id, id));
}

export interface ProfileUpdate {
	displayName: string;
	units: UnitSystem;
	homeAreaId: number | null;
	home: { lat: number; lng: number } | null;
	notifyMessages: 'each' | 'hourly' | 'off';
	weeklyDigest: boolean;
	announcements: boolean;
}

export async function updateProfile(id: string, update: ProfileUpdate): Promise<void> {
	const home = update.home ? roundToKilometre(update.home) : null;
	await db
		.update(users)
		.set({
			displayName: update.displayName,
			units: update.units,
			homeAreaId: update.homeAreaId,
			homeLat: home?.lat ?? null,
			homeLng: home?.lng ?? null,
			notifyMessages: update.notifyMessages,
			weeklyDigest: update.weeklyDigest,
			announcements: update.announcements
		})
		.where(eq(users.id, id));
}

export const MEMBERS_PAGE_SIZE = 20;

export async function listMembers(options: { search?: string; role?: Role; page: number }) {
	const conditions = [];
	if (options.search) {
		const pattern = `%${options.search.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
		conditions.push(or(like(users.displayName, pattern), like(users.email, pattern)));
	}
	if (options.role) conditions.push(eq(users.role, options.role));
	const where = conditions.length ? and(...conditions) : undefined;
	const [{ total }] = (await db.select({ total: count() }).from(users).where(where)) as [{ total: number }];
	const rows = await db
		.select({
			id: users.id,
			email: users.email,
			displayName: users.displayName,
			role: users.role,
			createdAt: users.createdAt,
			lastSeenAt: users.lastSeenAt
		})
		.from(users)
		.where(where)
		.orderBy(sql`${users.displayName} IS NULL`, asc(users.displayName), asc(users.email))
		.limit(MEMBERS_PAGE_SIZE)
		.offset((options.page - 1) * MEMBERS_PAGE_SIZE);
	return { rows, total, pages: Math.max(1, Math.ceil(total / MEMBERS_PAGE_SIZE)) };
}

export class LastAdminError extends Error {
	constructor() {
		super('The club needs at least one admin: make someone else an admin first.');
	}
}

/**
 * Changes a member's role and records who did it. Locks the admin rows so two admins demoting
 * each other at once cannot leave the club without one.
 */
export async function changeRole(actor: Viewer, targetId: string, role: Role, database: Database = db): Promise<void> {
	await database.transaction(async (tx) => {
		const [target] = await tx.select().from(users).where(eq(users.id, targetId)).for('update');
		if (!target) throw new Error('No such member.');
		if (target.role === role) return;
		if (target.role === 'admin') {
			const others = await tx
				.select({ id: users.id })
				.from(users)
				.where(and(eq(users.role, 'admin'), ne(users.id, targetId)))
				.for('update');
			if (others.length === 0) throw new LastAdminError();
		}
		await tx.update(users).set({ role }).where(eq(users.id, targetId));
		await audit.record(
			{ actorId: actor.id, action: 'role.change', subject: { type: 'user', id: targetId }, detail: { from: target.role, to: role } },
			{ db: tx }
		);
	});
}

/** ADMIN_EMAIL names the first admin: whoever signs in with it is made admin. */
export async function promoteConfiguredAdmin(email: string | undefined, tx: DbOrTx = db): Promise<void> {
	if (!email) return;
	await tx.update(users).set({ role: 'admin' }).where(eq(users.email, email.toLowerCase()));
}
