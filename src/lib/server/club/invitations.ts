// Invitations by e-mail: an admin pastes addresses, each gets a link that works once and expires
// (14 days by default). Accepting makes the person a member under any join policy and signs them in
// with a database session, as the sign-in link would: the link proves the address as a sign-in link
// does. The token is 32 random bytes; only its SHA-256 is stored, so the table cannot be used to
// accept anything.
import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, inArray } from 'drizzle-orm';
import { INVITATION_DAYS_DEFAULT, INVITATIONS_PER_PASTE, invitationState, parseAddresses, type InvitationState } from '../../club/membership';
import { assertRole } from '../../club/roles';
import type { Viewer } from '../../club/viewer';
import { conflict, invalid, notFound } from '../../errors';
import * as audit from '../audit';
import { config } from '../config';
import { resolve, within, type Context } from '../context';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import * as directory from './directory';
import * as sessions from './sessions';
import * as settings from './settings';
import { invitations, users } from './schema';

const DAY_MS = 86_400_000;
export const INVITATIONS_PAGE_SIZE = 25;

const hashOf = (token: string) => createHash('sha256').update(token).digest('hex');
const newToken = () => randomBytes(32).toString('base64url');

function invitationMail(to: string, token: string, clubName: string, inviter: string, expiresAt: Date) {
	const url = new URL(`/join/${token}`, config().ORIGIN).toString();
	const days = Math.round((expiresAt.getTime() - Date.now()) / DAY_MS);
	const { html, text } = renderMail({
		heading: `You are invited to join ${clubName}`,
		paragraphs: [
			`${inviter} has invited you to join ${clubName} on Riparia: tank journals, a swap board for trimmings and gear, and the club's contests.`,
			`The button below makes you a member and signs you in. It works once, for about ${days} days.`,
			'If you do not know the club, ignore this mail: nothing happens without the link.'
		],
		action: { label: 'Accept the invitation', url }
	});
	return { to, subject: `Invitation to join ${clubName}`, html, text };
}

export interface InviteOutcome {
	sent: string[];
	invalid: string[];
	duplicates: string[];
	/** Addresses of people who are members already (nothing sent). */
	members: string[];
}

/**
 * Invites every valid address pasted; invalid and repeated ones are reported, members already in
 * the club are left out. A new invitation to an address replaces its earlier unused one.
 */
export async function invite(admin: Viewer, pasted: string, context: Context = {}): Promise<InviteOutcome> {
	assertRole(admin, 'admin');
	const parsed = parseAddresses(pasted);
	if (parsed.valid.length === 0 && parsed.invalid.length === 0) throw invalid({ addresses: 'Paste at least one e-mail address.' });
	if (parsed.valid.length > INVITATIONS_PER_PASTE) throw invalid({ addresses: `Invite at most ${INVITATIONS_PER_PASTE} addresses at a time.` });
	const { db, now } = resolve(context);
	const club = await settings.get(context);
	const expiresAt = new Date(now.getTime() + INVITATION_DAYS_DEFAULT * DAY_MS);
	const outcome: InviteOutcome = { sent: [], invalid: parsed.invalid, duplicates: parsed.duplicates, members: [] };
	if (parsed.valid.length === 0) return outcome;
	await db.transaction(async (tx) => {
		const existing = await tx.select({ email: users.email, state: users.state }).from(users).where(inArray(users.email, parsed.valid));
		const members = new Set(existing.filter((u) => u.state === 'active').map((u) => u.email));
		for (const email of parsed.valid) {
			if (members.has(email)) {
				outcome.members.push(email);
				continue;
			}
			await tx
				.update(invitations)
				.set({ state: 'revoked', revokedAt: now })
				.where(and(eq(invitations.email, email), eq(invitations.state, 'pending')));
			const token = newToken();
			const [inserted] = await tx
				.insert(invitations)
				.values({ email, tokenHash: hashOf(token), invitedBy: admin.id, sentAt: now, expiresAt })
				.$returningId();
			await enqueue(invitationMail(email, token, club.name, admin.displayName ?? 'An admin', expiresAt), within(context, tx));
			await audit.record(
				{
					actorId: admin.id,
					action: 'invitation.send',
					subject: { type: 'invitation', id: inserted!.id },
					after: { email, expiresAt: expiresAt.toISOString() }
				},
				within(context, tx)
			);
			outcome.sent.push(email);
		}
	});
	return outcome;
}

export interface InvitationLine {
	id: number;
	email: string;
	state: InvitationState;
	invitedBy: string;
	sentAt: Date;
	expiresAt: Date;
	acceptedAt: Date | null;
}

/** The invitations, newest first, a page at a time, optionally of one state (admins only). */
export async function list(admin: Viewer, filter: { state?: InvitationState; page: number }, context: Context = {}) {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	// Expired is decided on the clock, so the state filter is applied after reading (pages of this
	// list stay small: a club sends tens of invitations, not thousands).
	const rows = await db.select().from(invitations).orderBy(desc(invitations.createdAt), desc(invitations.id));
	const names = await directory.names(
		rows.map((r) => r.invitedBy),
		context
	);
	const all: InvitationLine[] = rows.map((r) => ({
		id: r.id,
		email: r.email,
		state: invitationState(r, now),
		invitedBy: names.get(r.invitedBy) ?? 'former member',
		sentAt: r.sentAt,
		expiresAt: r.expiresAt,
		acceptedAt: r.acceptedAt
	}));
	const counts = { pending: 0, accepted: 0, expired: 0, revoked: 0 } satisfies Record<InvitationState, number>;
	for (const line of all) counts[line.state]++;
	const matching = filter.state ? all.filter((l) => l.state === filter.state) : all;
	const pages = Math.max(1, Math.ceil(matching.length / INVITATIONS_PAGE_SIZE));
	return { rows: matching.slice((filter.page - 1) * INVITATIONS_PAGE_SIZE, filter.page * INVITATIONS_PAGE_SIZE), counts, pages };
}

/** Sends a pending or expired invitation again with a new link and a new end; the old link stops working. */
export async function resend(admin: Viewer, id: number, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	const club = await settings.get(context);
	await db.transaction(async (tx) => {
		const [row] = await tx.select().from(invitations).where(eq(invitations.id, id)).for('update');
		if (!row) throw notFound('We could not find that invitation.');
		if (row.state !== 'pending') throw conflict('not-pending', `That invitation was ${row.state}: send a new one instead.`);
		const token = newToken();
		const expiresAt = new Date(now.getTime() + INVITATION_DAYS_DEFAULT * DAY_MS);
		await tx
			.update(invitations)
			.set({ tokenHash: hashOf(token), sentAt: now, expiresAt })
			.where(eq(invitations.id, id));
		await enqueue(invitationMail(row.email, token, club.name, admin.displayName ?? 'An admin', expiresAt), within(context, tx));
		await audit.record(
			{
				actorId: admin.id,
				action: 'invitation.resend',
				subject: { type: 'invitation', id },
				before: { expiresAt: row.expiresAt.toISOString() },
				after: { expiresAt: expiresAt.toISOString() }
			},
			within(context, tx)
		);
	});
}

/** Withdraws a pending invitation: its link stops working. */
export async function revoke(admin: Viewer, id: number, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	await db.transaction(async (tx) => {
		const [row] = await tx.select().from(invitations).where(eq(invitations.id, id)).for('update');
		if (!row) throw notFound('We could not find that invitation.');
		if (row.state !== 'pending') throw conflict('not-pending', `That invitation was already ${row.state}.`);
		await tx.update(invitations).set({ state: 'revoked', revokedAt: now }).where(eq(invitations.id, id));
		await audit.record(
			{ actorId: admin.id, action: 'invitation.revoke', subject: { type: 'invitation', id }, before: { state: 'pending' }, after: { state: 'revoked' } },
			within(context, tx)
		);
	});
}

export const UNUSABLE = 'This invitation link no longer works: it was used, withdrawn or has expired. Ask the club for a new one.';

/** What the invitation page shows before the person accepts; null for a link that cannot be used. */
export async function preview(token: string, context: Context = {}): Promise<{ clubName: string; email: string; expiresAt: Date } | null> {
	const { db, now } = resolve(context);
	const [row] = await db
		.select()
		.from(invitations)
		.where(eq(invitations.tokenHash, hashOf(token)))
		.limit(1);
	if (!row || invitationState(row, now) !== 'pending') return null;
	return { clubName: (await settings.get(context)).name, email: row.email, expiresAt: row.expiresAt };
}

/**
 * Accepts an invitation once: the person (made now if they never signed in) becomes a member and
 * gets a new session. A used, withdrawn or expired link is not found; a suspended member's is refused.
 */
export async function accept(token: string, context: Context = {}): Promise<{ session: { token: string; expires: Date }; needsName: boolean }> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const [row] = await tx
			.select()
			.from(invitations)
			.where(eq(invitations.tokenHash, hashOf(token)))
			.for('update');
		if (!row || invitationState(row, now) !== 'pending') throw notFound(UNUSABLE);
		let [person] = await tx.select().from(users).where(eq(users.email, row.email)).for('update');
		if (person?.state === 'suspended') throw conflict('suspended', 'This invitation cannot be used: write to the club.');
		if (!person) {
			const id = crypto.randomUUID();
			await tx.insert(users).values({ id, email: row.email, emailVerified: now, state: 'active' });
			[person] = await tx.select().from(users).where(eq(users.id, id));
		} else if (person.state !== 'active') {
			await tx
				.update(users)
				.set({ state: 'active', emailVerified: person.emailVerified ?? now })
				.where(eq(users.id, person.id));
		}
		const used = await tx
			.update(invitations)
			.set({ state: 'accepted', acceptedAt: now, acceptedBy: person!.id })
			.where(and(eq(invitations.id, row.id), eq(invitations.state, 'pending')));
		if (used[0].affectedRows !== 1) throw notFound(UNUSABLE);
		const session = await sessions.start(person!.id, within(context, tx));
		return { session, needsName: !person!.displayName };
	});
}
