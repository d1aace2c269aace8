// Deleting a member's account, by the member (after typing their display name) or by an admin
// (with a reason). One transaction removes their private data from every feature (each feature
// decides what of the member it keeps: see journals/, swaps/ and contests/former-members.ts),
// every photo row they uploaded, the mail queued or sent to their address, their sessions and
// sign-in links, and turns their member row into a tombstone: the id stays (opaque: a random
// UUID), everything personal on it is cleared and `deletedAt` is set, so published contest
// results, the other side of swap conversations and audit rows still point at an id, shown as
// "Former member". The photos' objects are removed from the bucket once the rows are gone.
import { randomUUID } from 'node:crypto';
import { and, eq, isNull, ne } from 'drizzle-orm';
import { assertRole } from '../../club/roles';
import type { Viewer } from '../../club/viewer';
import { conflict, invalid, notFound } from '../../errors';
import { resolve, within, type Context } from '../context';
import * as audit from '../audit';
import * as media from '../media';
import { enqueue, forgetAddress } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import * as journals from '../journals/former-members';
import * as swaps from '../swaps/former-members';
import * as contests from '../contests/former-members';
import { accounts, sessions, users, verificationTokens } from './schema';

/** What the member types to confirm: their display name, or their address if they never set one. */
export const confirmationOf = (member: Pick<Viewer, 'displayName' | 'email'>) => member.displayName?.trim() || member.email;

const matches = (typed: string, expected: string) => typed.trim().toLocaleLowerCase() === expected.trim().toLocaleLowerCase();

/** The member deletes their own account; `typed` must be their display name (case aside). */
export async function deleteOwn(viewer: Viewer, typed: string, context: Context = {}): Promise<void> {
	if (!matches(typed, confirmationOf(viewer)))
		throw invalid({ confirm: `Type your display name, ${confirmationOf(viewer)}, exactly as it is shown to confirm.` });
	await erase(viewer.id, { actorId: viewer.id, by: 'member' }, context);
}

/**
 * An admin removes a member's account, with a reason, as if the member had deleted it (the admin
 * members page, behind a reason and a confirmation).
 */
export async function removeMember(admin: Viewer, memberId: string, reason: string, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	if (memberId === admin.id) throw conflict('own-account', 'Delete your own account from your account page, not from the member list.');
	if (!reason.trim()) throw invalid({ reason: 'Say why this member is removed; it goes into the audit log.' });
	await erase(memberId, { actorId: admin.id, by: 'admin', reason: reason.trim() }, context);
}

interface Deletion {
	actorId: string;
	by: 'member' | 'admin';
	reason?: string;
}

async function erase(memberId: string, deletion: Deletion, context: Context): Promise<void> {
	const { db, now } = resolve(context);
	const purge = await db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const [member] = await tx
			.select()
			.from(users)
			.where(and(eq(users.id, memberId), isNull(users.deletedAt)))
			.for('update');
		if (!member) throw notFound('We could not find that member.');
		if (member.role === 'admin') {
			const others = await tx
				.select({ id: users.id })
				.from(users)
				.where(and(eq(users.role, 'admin'), ne(users.id, memberId), isNull(users.deletedAt)))
				.for('update');
			if (others.length === 0) throw conflict('last-admin', 'The club needs at least one admin: make someone else an admin first.');
		}

		await journals.forget(memberId, inTx);
		await swaps.forget(memberId, inTx);
		await contests.forget(memberId, inTx);
		const keys = await media.deleteOwnedBy(memberId, inTx);

		const address = member.email ?? '';
		await forgetAddress(address, inTx);
		if (address) await tx.delete(verificationTokens).where(eq(verificationTokens.identifier, address));
		await tx.delete(sessions).where(eq(sessions.userId, memberId));
		await tx.delete(accounts).where(eq(accounts.userId, memberId));
		await tx
			.update(users)
			.set({
				name: null,
				email: null,
				emailVerified: null,
				image: null,
				displayName: null,
				role: 'member',
				homeLat: null,
				homeLng: null,
				homeAreaId: null,
				notifyMessages: 'off',
				weeklyDigest: false,
				announcements: false,
				unsubscribeToken: randomUUID().replaceAll('-', ''),
				lastSeenAt: null,
				deletedAt: now
			})
			.where(eq(users.id, memberId));

		// The audit row names the tombstone's id only; nothing in it says who the member was.
		await audit.record(
			{
				actorId: deletion.actorId,
				action: deletion.by === 'admin' ? 'member.remove' : 'member.delete-own',
				subject: { type: 'user', id: memberId },
				detail: deletion.reason ? { reason: deletion.reason } : {}
			},
			inTx
		);
		if (address) await enqueue(goodbye(address, deletion), inTx);
		return keys;
	});
	await media.purgeAfterCommit(purge, { what: 'photos of a deleted account' });
}

function goodbye(address: string, deletion: Deletion) {
	const { html, text } = renderMail({
		heading: 'Your Riparia account is deleted',
		paragraphs: [
			deletion.by === 'admin'
				? 'The club’s admins removed your account. If you think this is a mistake, write to the club.'
				: 'You deleted your account. We are sorry to see you go.',
			'Your profile, tanks and journals, photos, listings and your messages are gone. Published contest results keep your entries under “Former member”.',
			'You can join again at any time by signing in with this address; you would start as a new member.'
		]
	});
	return { to: address, subject: 'Your Riparia account is deleted', text, html, topic: 'account' };
}
