// What other features may know of members and club areas, read in batches (one query for any
// number of ids, so a page of cards costs the same as one card): the name others see, where to
// mail them, their role, and areas' names. Features never
// read the member or area tables themselves.
import { and, asc, eq, inArray, isNotNull, like, type SQL } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { nameOf } from '../../club/names';
import type { Role } from '../../club/roles';
import { clubAreas, users } from './schema';

export interface Member {
	id: string;
	/** As others see it (nameOf). */
	name: string;
	/** Empty when nothing may be sent: the member has no address, or is not an active member
	 * (suspended, or an applicant not admitted), so no feature mails them by accident. */
	email: string;
	role: Role;
	unsubscribeToken: string;
	/** The member's IANA zone, or null while none is known (their days are then UTC days). */
	timeZone: string | null;
}

const columns = {
	id: users.id,
	displayName: users.displayName,
	email: users.email,
	role: users.role,
	unsubscribeToken: users.unsubscribeToken,
	timeZone: users.timeZone,
	deletedAt: users.deletedAt,
	state: users.state
};

/** Only members in good standing are listed, found by name or mailed. */
const active = eq(users.state, 'active');

async function select(where: SQL | undefined, context: Context): Promise<Member[]> {
	const { db } = resolve(context);
	const rows = await db.select(columns).from(users).where(where);
	return rows.map(({ displayName, email, deletedAt, state, ...r }) => ({
		...r,
		name: nameOf(displayName, deletedAt !== null),
		email: state === 'active' ? (email ?? '') : ''
	}));
}

const byName = (a: Member, b: Member) => a.name.localeCompare(b.name);

/** The members with these ids, by id; a former member is named FORMER_MEMBER and has no address. */
export async function byIds(ids: Iterable<string>, context: Context = {}): Promise<Map<string, Member>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	return new Map((await select(inArray(users.id, unique), context)).map((m) => [m.id, m]));
}

/** The name each member is shown under, by id. */
export async function names(ids: Iterable<string>, context: Context = {}): Promise<Map<string, string>> {
	return new Map([...(await byIds(ids, context))].map(([id, m]) => [id, m.name]));
}

/** Members with a role and an address, by name. */
export async function withRole(role: Role, context: Context = {}): Promise<Member[]> {
	return (await select(and(eq(users.role, role), isNotNull(users.email), active), context)).sort(byName);
}

/** Every active member with an address (a club-wide mailing; the outbox drops those who turned its category off). */
export async function everyone(context: Context = {}): Promise<Member[]> {
	return select(and(isNotNull(users.email), active), context);
}

/** Club areas' names, by id. An id of no area (e.g. one removed since) is not in the map. */
export async function areaNames(ids: Iterable<number>, context: Context = {}): Promise<Map<number, string>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const { db } = resolve(context);
	const rows = await db.select({ id: clubAreas.id, name: clubAreas.name }).from(clubAreas).where(inArray(clubAreas.id, unique));
	return new Map(rows.map((r) => [r.id, r.name]));
}

export interface DigestReader {
	id: string;
	email: string;
	displayName: string | null;
	unsubscribeToken: string;
}

/** These members, as the weekly digest needs them, in id order; those without an address are left out. */
export async function digestReaders(ids: string[], context: Context = {}): Promise<DigestReader[]> {
	if (ids.length === 0) return [];
	const { db } = resolve(context);
	const rows = await db
		.select({ id: users.id, email: users.email, displayName: users.displayName, unsubscribeToken: users.unsubscribeToken })
		.from(users)
		.where(and(inArray(users.id, ids), isNotNull(users.email), active))
		.orderBy(asc(users.id));
	return rows.map((r) => ({ ...r, email: r.email ?? '' }));
}

/** Members' home points (rounded to about a kilometre, as stored), by id; members without one are missing. */
export async function homePoints(ids: Iterable<string>, context: Context = {}): Promise<Map<string, { lat: number; lng: number }>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const { db } = resolve(context);
	const rows = await db.select({ id: users.id, lat: users.homeLat, lng: users.homeLng }).from(users).where(inArray(users.id, unique));
	return new Map(rows.flatMap((r) => (r.lat === null || r.lng === null ? [] : [[r.id, { lat: r.lat, lng: r.lng }] as const])));
}

/** Members whose shown name starts with `prefix` (at least two characters), by name, at most `limit`. */
export async function findByName(prefix: string, limit = 10, context: Context = {}): Promise<Member[]> {
	const typed = prefix.trim();
	if (typed.length < 2) return [];
	const escaped = typed.replace(/[\\%_]/g, (c) => `\\${c}`);
	const found = await select(and(like(users.displayName, `${escaped}%`), isNotNull(users.email), active), context);
	return found.sort(byName).slice(0, limit);
}
