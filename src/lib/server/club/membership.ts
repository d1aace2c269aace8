// Who is a member: the standing of a signed-in person, decided once per request where the viewer
// is resolved (hooks.server.ts), and the join requests of a club that admits by approval.
import { and, asc, desc, eq } from 'drizzle-orm';
import { firstState, type Account, type JoinPolicy, type MemberState } from '../../club/membership';
import { nameOf } from '../../club/names';
import { assertRole } from '../../club/roles';
import type { Viewer } from '../../club/viewer';
import { conflict, notFound } from '../../errors';
import * as audit from '../audit';
import { config } from '../config';
import { resolve, within, type Context } from '../context';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import * as settings from './settings';
import { joinRequests, users } from './schema';
import { toViewer, type UserRow } from './users';

export interface Standing {
	/** A member (active): what every members-only page reads. */
	user: Viewer | null;
	/** Anyone signed in who is not suspended, members included: their own status pages read this. */
	account: Account | null;
}

const SIGNED_OUT: Standing = { user: null, account: null };

/**
 * The one decision of who a session stands for. A suspended member is signed out (their sessions
 * are also deleted when they are suspended, so this holds for a session made in between); a
 * person not admitted (pending, declined) is signed in to their own status pages only, so
 * everything members-only treats them as a visitor.
 */
export function standingOf(row: UserRow): Standing {
	if (row.state === 'suspended') return SIGNED_OUT;
	const account: Account = { id: row.id, email: row.email ?? '', displayName: row.displayName, state: row.state };
	return { user: row.state === 'active' ? toViewer(row) : null, account };
}

/** The state a person signing in for the first time starts in, under the club's policy. */
export async function stateForNewcomer(context: Context = {}): Promise<MemberState> {
	return firstState(await settings.joinPolicy(context));
}

/** Whether this address may finish signing in: a suspended member may not (their data stays). */
export async function maySignIn(email: string, context: Context = {}): Promise<boolean> {
	const { db } = resolve(context);
	const [row] = await db.select({ state: users.state }).from(users).where(eq(users.email, email.trim().toLowerCase())).limit(1);
	return row?.state !== 'suspended';
}

export interface RequestView {
	id: number;
	note: string;
	state: 'pending' | 'approved' | 'declined';
	message: string | null;
	createdAt: Date;
	decidedAt: Date | null;
}

export interface StatusView {
	state: MemberState;
	policy: JoinPolicy;
	clubName: string;
	contactEmail: string;
	/** The person's latest request, if they made one. */
	request: RequestView | null;
	/** Whether they may send (or change) a request now. */
	mayRequest: boolean;
}

async function latestRequest(userId: string, context: Context): Promise<RequestView | null> {
	const { db } = resolve(context);
	const [row] = await db
		.select({
			id: joinRequests.id,
			note: joinRequests.note,
			state: joinRequests.state,
			message: joinRequests.message,
			createdAt: joinRequests.createdAt,
			decidedAt: joinRequests.decidedAt
		})
		.from(joinRequests)
		.where(eq(joinRequests.userId, userId))
		.orderBy(desc(joinRequests.id))
		.limit(1);
	return row ?? null;
}

/** What a signed-in person sees on their membership page. */
export async function status(account: Account, context: Context = {}): Promise<StatusView> {
	const club = await settings.get(context);
	const request = await latestRequest(account.id, context);
	return {
		state: account.state,
		policy: club.joinPolicy,
		clubName: club.name,
		contactEmail: club.contactEmail,
		request,
		mayRequest: account.state === 'pending' && club.joinPolicy === 'approval'
	};
}

/**
 * Sends the person's request to join, with their name and a short note, or changes the note of
 * the request still waiting. Only while the club admits by approval and they are waiting.
 */
export async function sendRequest(account: Account, input: { displayName: string; note: string }, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	if (account.state !== 'pending') throw conflict('not-waiting', 'There is no request to send: your membership has already been decided.');
	if ((await settings.joinPolicy(context)) !== 'approval') {
		throw conflict('not-by-approval', 'The club does not take requests at the moment: it admits members by invitation.');
	}
	await db.transaction(async (tx) => {
		await tx.update(users).set({ displayName: input.displayName }).where(eq(users.id, account.id));
		const [open] = await tx
			.select({ id: joinRequests.id })
			.from(joinRequests)
			.where(and(eq(joinRequests.userId, account.id), eq(joinRequests.state, 'pending')))
			.for('update');
		if (open) await tx.update(joinRequests).set({ note: input.note }).where(eq(joinRequests.id, open.id));
		else await tx.insert(joinRequests).values({ userId: account.id, note: input.note });
	});
}

export interface PendingRequest {
	id: number;
	userId: string;
	name: string;
	email: string;
	note: string;
	createdAt: Date;
}

/** Requests waiting for an answer, oldest first (admins only). */
export async function pendingRequests(admin: Viewer, context: Context = {}): Promise<PendingRequest[]> {
	assertRole(admin, 'admin');
	const { db } = resolve(context);
	const rows = await db
		.select({
			id: joinRequests.id,
			userId: joinRequests.userId,
			note: joinRequests.note,
			createdAt: joinRequests.createdAt,
			displayName: users.displayName,
			email: users.email
		})
		.from(joinRequests)
		.innerJoin(users, eq(users.id, joinRequests.userId))
		.where(and(eq(joinRequests.state, 'pending'), eq(users.state, 'pending')))
		.orderBy(asc(joinRequests.createdAt), asc(joinRequests.id));
	return rows.map(({ displayName, email, ...r }) => ({ ...r, name: nameOf(displayName), email: email ?? '' }));
}

function decisionMail(to: string, approved: boolean, clubName: string, message: string) {
	const url = new URL(approved ? '/' : '/membership', config().ORIGIN).toString();
	const { html, text } = renderMail({
		heading: approved ? `Welcome to ${clubName}` : `Your request to join ${clubName}`,
		paragraphs: [
			approved
				? 'An admin has accepted your request: you are now a member, and every part of Riparia is open to you.'
				: 'An admin has looked at your request and has not accepted it.',
			...(message ? [`Their message: ${message}`] : [])
		],
		action: { label: approved ? 'Open Riparia' : 'See your request', url }
	});
	return { to, subject: approved ? `You are now a member of ${clubName}` : `Your request to join ${clubName}`, html, text };
}

/**
 * An admin's answer to a request: approve (the person becomes a member) or decline, with a
 * message; the applicant is mailed either way. A request already answered is a conflict.
 */
export async function decide(admin: Viewer, requestId: number, decision: 'approve' | 'decline', message: string, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	const club = await settings.get(context);
	await db.transaction(async (tx) => {
		const [request] = await tx.select().from(joinRequests).where(eq(joinRequests.id, requestId)).for('update');
		if (!request) throw notFound('We could not find that request.');
		const [person] = await tx.select().from(users).where(eq(users.id, request.userId)).for('update');
		if (!person) throw notFound('We could not find that request.');
		if (request.state !== 'pending' || person.state !== 'pending') {
			throw conflict('already-decided', 'That request has already been answered.');
		}
		const approved = decision === 'approve';
		const state: MemberState = approved ? 'active' : 'declined';
		await tx
			.update(joinRequests)
			.set({ state: approved ? 'approved' : 'declined', message: message || null, decidedBy: admin.id, decidedAt: now })
			.where(eq(joinRequests.id, requestId));
		await tx.update(users).set({ state }).where(eq(users.id, person.id));
		await audit.record(
			{
				actorId: admin.id,
				action: approved ? 'membership.approve' : 'membership.decline',
				subject: { type: 'user', id: person.id },
				detail: { request: requestId, ...(message ? { message } : {}) },
				before: { state: person.state },
				after: { state }
			},
			within(context, tx)
		);
		if (person.email) await enqueue(decisionMail(person.email, approved, club.name, message), within(context, tx));
	});
}
