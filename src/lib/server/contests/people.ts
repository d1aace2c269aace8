// The few facts about members that contests need: names for the admin's views and the results,
// and the addresses and unsubscribe tokens of those who take club announcements.
import { and, eq, inArray, isNotNull } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { users } from '../club/schema';

export interface Person {
	id: string;
	displayName: string;
	email: string;
	role: 'member' | 'judge' | 'admin';
	unsubscribeToken: string;
	announcements: boolean;
}

const columns = {
	id: users.id,
	displayName: users.displayName,
	email: users.email,
	role: users.role,
	unsubscribeToken: users.unsubscribeToken,
	announcements: users.announcements
};

const tidy = (r: {
	id: string;
	displayName: string | null;
	email: string | null;
	role: Person['role'];
	unsubscribeToken: string;
	announcements: boolean;
}): Person => ({
	...r,
	displayName: r.displayName ?? 'A member',
	email: r.email ?? ''
});

export async function byIds(ids: string[], tx: DbOrTx = appDb): Promise<Map<string, Person>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const rows = await tx.select(columns).from(users).where(inArray(users.id, unique));
	return new Map(rows.map((r) => [r.id, tidy(r)]));
}

export async function withRole(role: Person['role'], tx: DbOrTx = appDb): Promise<Person[]> {
	return (
		await tx
			.select(columns)
			.from(users)
			.where(and(eq(users.role, role), isNotNull(users.email)))
	)
		.map(tidy)
		.sort((a, b) => a.displayName.localeCompare(b.displayName));
}

/** Everyone who takes announcement mail. */
export async function announcementRecipients(tx: DbOrTx = appDb): Promise<Person[]> {
	return (
		await tx
			.select(columns)
			.from(users)
			.where(and(eq(users.announcements, true), isNotNull(users.email)))
	).map(tidy);
}
