// What other members do with a tank: admire it (one each, a toggle), follow it (mail on a new
// entry, at most one a day per tank and follower). Both need the viewer to be able to see it.
import { and, count, eq, isNull, lte, ne, or, sql } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import type { Viewer } from '../club/users';
import { users } from '../club/schema';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import { absoluteUrl } from '../config';
import { formatDate } from '../../format';
import { tankAdmires, tankFollows, type TankRow } from './schema';
import * as tanks from './tanks';

/** Thrown for an admire or follow of one's own tank. */
export class OwnTankError extends Error {
	constructor() {
		super('This is your own tank.');
	}
}

async function visibleOther(viewer: Viewer, tankId: number, tx: DbOrTx): Promise<TankRow> {
	const tank = await tanks.findVisible(viewer, tankId, tx);
	if (!tank) throw new tanks.TankNotFound();
	if (tank.ownerId === viewer.id) throw new OwnTankError();
	return tank;
}

/** Admires the tank, or takes the admiration back; returns whether the viewer now admires it. */
export async function toggleAdmire(viewer: Viewer, tankId: number, want?: boolean, database: DbOrTx = appDb): Promise<boolean> {
	return database.transaction(async (tx) => {
		await visibleOther(viewer, tankId, tx);
		const [existing] = await tx
			.select()
			.from(tankAdmires)
			.where(and(eq(tankAdmires.tankId, tankId), eq(tankAdmires.userId, viewer.id)))
			.for('update');
		const next = want ?? !existing;
		if (next && !existing)
			await tx
				.insert(tankAdmires)
				.values({ tankId, userId: viewer.id })
				.onDuplicateKeyUpdate({ set: { tankId: sql`tank_id` } });
		if (!next && existing) await tx.delete(tankAdmires).where(and(eq(tankAdmires.tankId, tankId), eq(tankAdmires.userId, viewer.id)));
		return next;
	});
}

/** Follows the tank, or stops; returns whether the viewer now follows it. */
export async function toggleFollow(viewer: Viewer, tankId: number, want?: boolean, database: DbOrTx = appDb): Promise<boolean> {
	return database.transaction(async (tx) => {
		await visibleOther(viewer, tankId, tx);
		const [existing] = await tx
			.select()
			.from(tankFollows)
			.where(and(eq(tankFollows.tankId, tankId), eq(tankFollows.userId, viewer.id)))
			.for('update');
		const next = want ?? !existing;
		if (next && !existing)
			await tx
				.insert(tankFollows)
				.values({ tankId, userId: viewer.id })
				.onDuplicateKeyUpdate({ set: { tankId: sql`tank_id` } });
		if (!next && existing) await tx.delete(tankFollows).where(and(eq(tankFollows.tankId, tankId), eq(tankFollows.userId, viewer.id)));
		return next;
	});
}

export interface Standing {
	admirers: number;
	followers: number;
	admired: boolean;
	following: boolean;
}

/** Counts for a tank page, and what the viewer has done. */
export async function standingOf(viewer: Pick<Viewer, 'id'> | null, tankId: number, tx: DbOrTx = appDb): Promise<Standing> {
	const [[admirers], [followers], mine, follows] = await Promise.all([
		tx.select({ n: count() }).from(tankAdmires).where(eq(tankAdmires.tankId, tankId)),
		tx.select({ n: count() }).from(tankFollows).where(eq(tankFollows.tankId, tankId)),
		viewer
			? tx
					.select({ id: tankAdmires.userId })
					.from(tankAdmires)
					.where(and(eq(tankAdmires.tankId, tankId), eq(tankAdmires.userId, viewer.id)))
			: [],
		viewer
			? tx
					.select({ id: tankFollows.userId })
					.from(tankFollows)
					.where(and(eq(tankFollows.tankId, tankId), eq(tankFollows.userId, viewer.id)))
			: []
	]);
	return { admirers: admirers?.n ?? 0, followers: followers?.n ?? 0, admired: mine.length > 0, following: follows.length > 0 };
}

/** The least time between two "new entry" mails to one follower about one tank. */
export const FOLLOW_MAIL_GAP_MS = 24 * 60 * 60_000;

export function followMail(input: { tankName: string; ownerName: string; entryTitle: string; entryOn: string; entryUrl: string; tankUrl: string }) {
	const title = input.entryTitle || `Entry of ${formatDate(input.entryOn)}`;
	const { html, text } = renderMail({
		heading: `New in ${input.tankName}`,
		paragraphs: [
			`${input.ownerName} wrote in the journal of ${input.tankName}: “${title}”.`,
			'You hear from us at most once a day about this tank, however often it is written in.'
		],
		action: { label: 'Read the entry', url: input.entryUrl },
		footer: `You get this because you follow ${input.tankName}. To stop, open ${input.tankUrl} and choose “Stop following”.`
	});
	return { subject: `New in ${input.tankName}: ${title}`.slice(0, 200), html, text };
}

/**
 * Queues the "new entry" mail for each follower who may still see the tank and has not had one
 * about it in the last day. The claim is one conditional UPDATE per follower, so two entries
 * written at once cannot both mail the same person. Call it in the entry's transaction.
 */
export async function notifyFollowers(tx: DbOrTx, tank: TankRow, entry: { id: number; title: string; entryOn: string }, now = new Date()): Promise<number> {
	const followers = await tx
		.select({ userId: tankFollows.userId, email: users.email })
		.from(tankFollows)
		.innerJoin(users, eq(users.id, tankFollows.userId))
		.where(and(eq(tankFollows.tankId, tank.id), ne(tankFollows.userId, tank.ownerId)));
	const [owner] = await tx.select({ name: users.displayName }).from(users).where(eq(users.id, tank.ownerId));
	let queued = 0;
	for (const follower of followers) {
		if (!follower.email || !tanks.canView({ id: follower.userId }, tank)) continue;
		const [claimed] = await tx
			.update(tankFollows)
			.set({ lastMailedAt: now })
			.where(
				and(
					eq(tankFollows.tankId, tank.id),
					eq(tankFollows.userId, follower.userId),
					or(isNull(tankFollows.lastMailedAt), lte(tankFollows.lastMailedAt, new Date(now.getTime() - FOLLOW_MAIL_GAP_MS)))
				)
			);
		if (claimed.affectedRows !== 1) continue;
		const mail = followMail({
			tankName: tank.name,
			ownerName: owner?.name ?? 'A member',
			entryTitle: entry.title,
			entryOn: entry.entryOn,
			entryUrl: absoluteUrl(`/journals/${tank.id}/entries/${entry.id}`),
			tankUrl: absoluteUrl(`/journals/${tank.id}`)
		});
		await enqueue(
			{
				to: follower.email,
				...mail,
				topic: `tank-follow:${tank.id}`,
				dedupeKey: `tank-follow:${tank.id}:${follower.userId}:${now.toISOString().slice(0, 10)}`
			},
			{ db: tx, now }
		);
		queued++;
	}
	return queued;
}

/** Ids of the tanks the viewer follows. */
export async function followedBy(viewer: Pick<Viewer, 'id'>, tx: DbOrTx = appDb): Promise<number[]> {
	return (await tx.select({ id: tankFollows.tankId }).from(tankFollows).where(eq(tankFollows.userId, viewer.id))).map((r) => r.id);
}
