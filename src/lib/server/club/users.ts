// Members: who they are, their profile and settings, and their role in the club.
import { and, asc, count, eq, isNull, like, ne, or, sql, type SQL } from 'drizzle-orm';
import { assertRole, type Role } from '../../club/roles';
import type { MemberState } from '../../club/membership';
import { timeZoneSchema, type ProfileInput } from '../../club/profile';
import { roundToKilometre, type LatLng } from '../../club/location';
import type { Viewer } from '../../club/viewer';
import { conflict, invalid, notFound, parseOrThrow } from '../../errors';
import { resolve, within, type Context } from '../context';
import * as audit from '../audit';
import * as areas from './areas';
import { users } from './schema';

export type { Viewer };
export type UserRow = typeof users.$inferSelect;

export function toViewer(row: UserRow): Viewer {
	return {
		id: row.id,
		email: row.email ?? '',
		displayName: row.displayName,
		role: row.role,
		units: row.units,
		timeZone: row.timeZone
	};
}

export async function getById(id: string, context: Context = {}): Promise<UserRow | undefined> {
	const { db } = resolve(context);
	const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
	return row;
}

export async function setDisplayName(id: string, displayName: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	await db.update(users).set({ displayName }).where(eq(users.id, id));
}

/**
 * Saves a member's own profile. A home area stands for its centre point; a point of their own is
 * kept rounded to about a kilometre. An area that no longer exists is refused at its field.
 */
export async function saveProfile(viewer: Viewer, input: ProfileInput, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	let home: LatLng | null = null;
	let homeAreaId: number | null = null;
	if (input.locationMode === 'area' && input.homeAreaId) {
		const area = await areas.get(input.homeAreaId, context);
		if (!area) throw invalid({ homeAreaId: 'That area no longer exists; choose another.' });
		homeAreaId = area.id;
		home = { lat: area.lat, lng: area.lng };
	} else if (input.locationMode === 'point' && input.homeLat !== null && input.homeLng !== null) {
		home = { lat: input.homeLat, lng: input.homeLng };
	}
	if (home) home = roundToKilometre(home);
	await db
		.update(users)
		.set({
			displayName: input.displayName,
			units: input.units,
			...(input.timeZone === undefined ? {} : { timeZone: input.timeZone }),
			homeAreaId,
			homeLat: home?.lat ?? null,
			homeLng: home?.lng ?? null,
			notifyMessages: input.notifyMessages,
			weeklyDigest: input.weeklyDigest,
			announcements: input.announcements
		})
		.where(eq(users.id, viewer.id));
}

/**
 * The zone the member's browser reports, kept only while the member has none: sent once after
 * sign-in so that times are theirs from then on; a zone chosen on the account page is never
 * replaced. Whether it was kept.
 */
export async function adoptTimeZone(viewer: Pick<Viewer, 'id'>, timeZone: string, context: Context = {}): Promise<boolean> {
	const { db } = resolve(context);
	const zone = parseOrThrow(timeZoneSchema, timeZone);
	const [result] = await db
		.update(users)
		.set({ timeZone: zone })
		.where(and(eq(users.id, viewer.id), isNull(users.timeZone)));
	return result.affectedRows === 1;
}

export const MEMBERS_PAGE_SIZE = 20;

/** The member list as admins see it (addresses included), searched by name or address, by role and state, one page at a time. */
export async function listMembers(admin: Viewer, filter: { search?: string; role?: Role; state?: MemberState; page: number }, context: Context = {}) {
	assertRole(admin, 'admin');
	const { db } = resolve(context);
	const conditions: (SQL | undefined)[] = [isNull(users.deletedAt)];
	if (filter.search) {
		const pattern = `%${filter.search.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
		conditions.push(or(like(users.displayName, pattern), like(users.email, pattern)));
	}
	if (filter.role) conditions.push(eq(users.role, filter.role));
	if (filter.state) conditions.push(eq(users.state, filter.state));
	const where = and(...conditions);
	const [{ total }] = (await db.select({ total: count() }).from(users).where(where)) as [{ total: number }];
	const rows = await db
		.select({
			id: users.id,
			email: users.email,
			displayName: users.displayName,
			role: users.role,
			state: users.state,
			stateReason: users.stateReason,
			createdAt: users.createdAt,
			lastSeenAt: users.lastSeenAt
		})
		.from(users)
		.where(where)
		.orderBy(sql`${users.displayName} IS NULL`, asc(users.displayName), asc(users.email))
		.limit(MEMBERS_PAGE_SIZE)
		.offset((filter.page - 1) * MEMBERS_PAGE_SIZE);
	return { rows, total, pages: Math.max(1, Math.ceil(total / MEMBERS_PAGE_SIZE)) };
}

/**
 * Changes a member's role and records who did it; only an admin may. Locks the admin rows so
 * two admins demoting each other at once cannot leave the club without one.
 */
export async function changeRole(actor: Viewer, targetId: string, role: Role, context: Context = {}): Promise<void> {
	assertRole(actor, 'admin');
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		const [target] = await tx.select().from(users).where(eq(users.id, targetId)).for('update');
		if (!target) throw notFound('We could not find that member.');
		if (target.role === role) return;
		if (target.role === 'admin') {
			const others = await tx
				.select({ id: users.id })
				.from(users)
				.where(and(eq(users.role, 'admin'), ne(users.id, targetId)))
				.for('update');
			if (others.length === 0) throw conflict('last-admin', 'The club needs at least one admin: make someone else an admin first.');
		}
		await tx.update(users).set({ role }).where(eq(users.id, targetId));
		await audit.record(
			{ actorId: actor.id, action: 'role.change', subject: { type: 'user', id: targetId }, before: { role: target.role }, after: { role } },
			within(context, tx)
		);
	});
}

/** ADMIN_EMAIL names the first admin: whoever signs in with it is made admin. */
export async function promoteConfiguredAdmin(email: string | undefined, context: Context = {}): Promise<void> {
	if (!email) return;
	const { db } = resolve(context);
	await db.update(users).set({ role: 'admin' }).where(eq(users.email, email.toLowerCase()));
}
