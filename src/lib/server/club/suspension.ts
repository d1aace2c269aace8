// Suspending a member: they are signed out everywhere at once (their sessions deleted), cannot
// sign in again (auth.ts asks maySignIn), their swap listings leave the board, and everything they
// made is kept for when an admin reinstates them.
import { eq, inArray } from 'drizzle-orm';
import { assertRole } from '../../club/roles';
import type { Viewer } from '../../club/viewer';
import { conflict, notFound } from '../../errors';
import * as audit from '../audit';
import { resolve, within, type Context } from '../context';
import { sessions, users } from './schema';

/** Suspends an active member with a reason (admins only; an admin must be made a member first). */
export async function suspend(admin: Viewer, userId: string, reason: string, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		const [target] = await tx.select().from(users).where(eq(users.id, userId)).for('update');
		if (!target) throw notFound('We could not find that member.');
		if (target.id === admin.id) throw conflict('self', 'You cannot suspend yourself.');
		if (target.role === 'admin') throw conflict('admin', 'Admins cannot be suspended: change their role to member first.');
		if (target.state !== 'active') throw conflict('not-active', 'Only an active member can be suspended.');
		await tx.update(users).set({ state: 'suspended', stateReason: reason }).where(eq(users.id, userId));
		const ended = await tx.delete(sessions).where(eq(sessions.userId, userId));
		await audit.record(
			{
				actorId: admin.id,
				action: 'member.suspend',
				subject: { type: 'user', id: userId },
				detail: { reason, sessionsEnded: ended[0].affectedRows },
				before: { state: target.state },
				after: { state: 'suspended' }
			},
			within(context, tx)
		);
	});
}

/** Lifts a suspension: the member may sign in again and their listings return. */
export async function reinstate(admin: Viewer, userId: string, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		const [target] = await tx.select().from(users).where(eq(users.id, userId)).for('update');
		if (!target) throw notFound('We could not find that member.');
		if (target.state !== 'suspended') throw conflict('not-suspended', 'That member is not suspended.');
		await tx.update(users).set({ state: 'active', stateReason: null }).where(eq(users.id, userId));
		await audit.record(
			{
				actorId: admin.id,
				action: 'member.reinstate',
				subject: { type: 'user', id: userId },
				detail: { suspendedFor: target.stateReason },
				before: { state: 'suspended' },
				after: { state: 'active' }
			},
			within(context, tx)
		);
	});
}

/** Of these members, the ones suspended now: other features leave their work out of shared lists. */
export async function suspendedAmong(ids: Iterable<string>, context: Context = {}): Promise<Set<string>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Set();
	const { db } = resolve(context);
	const rows = await db.select({ id: users.id, state: users.state }).from(users).where(inArray(users.id, unique));
	return new Set(rows.filter((r) => r.state === 'suspended').map((r) => r.id));
}

/** Every suspended member's id (few at any time): the swap board leaves their listings out. */
export async function suspendedIds(context: Context = {}): Promise<string[]> {
	const { db } = resolve(context);
	const rows = await db.select({ id: users.id }).from(users).where(eq(users.state, 'suspended'));
	return rows.map((r) => r.id);
}
