// What other members do with a tank: admire it (one each, a toggle), follow it (mail on a new
// entry, at most one a day per tank and follower). Both need the viewer to be able to see it.
import { and, count, eq, isNull, lte, ne, or, sql } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import { absoluteUrl } from '../config';
import { invalid } from '../../errors';
import { UNNAMED_MEMBER } from '../../club/names';
import { today } from '../../dates';
import { formatDate } from '../../format';
import { tankAdmires, tankFollows, type TankRow } from './schema';
import * as tanks from './tanks';

/** A tank the viewer may see and does not keep: "not found", or a refusal saying `ownTank`. */
async function visibleOther(viewer: Pick<Viewer, 'id'>, tankId: number, ownTank: string, context: Context): Promise<TankRow> {
	const tank = await tanks.findVisible(viewer, tankId, context);
	if (!tank) throw tanks.tankNotFound();
	if (tank.ownerId === viewer.id) throw invalid({}, ownTank, 'own-tank');
	return tank;
}

/** Admires the tank, or takes the admiration back; returns whether the viewer now admires it. */
export async function toggleAdmire(viewer: Pick<Viewer, 'id'>, tankId: number, want?: boolean, context: Context = {}): Promise<boolean> {
	return resolve(context).db.transaction(async (tx) => {
		await visibleOther(viewer, tankId, 'You cannot admire your own tank.', within(context, tx));
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
export async function toggleFollow(viewer: Pick<Viewer, 'id'>, tankId: number, want?: boolean, context: Context = {}): Promise<boolean> {
	return resolve(context).db.transaction(async (tx) => {
		await visibleOther(viewer, tankId, 'You keep this tank; there is nothing to follow.', within(context, tx));
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
export async function standingOf(viewer: Pick<Viewer, 'id'> | null, tankId: number, context: Context = {}): Promise<Standing> {
	const { db: tx } = resolve(context);
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

export function followMail(input: {
	memberId: string;
	tankName: string;
	ownerName: string;
	entryTitle: string;
	entryOn: string;
	entryUrl: string;
	tankUrl: string;
}) {
	const title = input.entryTitle || `Entry of ${formatDate(input.entryOn)}`;
	const { html, text } = renderMail({
		heading: `New in ${input.tankName}`,
		paragraphs: [
			`${input.ownerName} wrote in the journal of ${input.tankName}: “${title}”.`,
			'You hear from us at most once a day about this tank, however often it is written in.'
		],
		action: { label: 'Read the entry', url: input.entryUrl },
		footer: `You get this because you follow ${input.tankName}. To stop, open ${input.tankUrl} and choose “Stop following”.`,
		to: { memberId: input.memberId, category: 'follows' }
	});
	return { subject: `New in ${input.tankName}: ${title}`.slice(0, 200), html, text };
}

/**
 * Queues the "new entry" mail for each follower who may still see the tank and has not had one
 * about it in the last day. The claim is one conditional UPDATE per follower, so two entries
 * written at once cannot both mail the same person. Call it in the entry's transaction.
 */
export async function notifyFollowers(tank: TankRow, entry: { id: number; title: string; entryOn: string }, context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const followerIds = (
		await db
			.select({ userId: tankFollows.userId })
			.from(tankFollows)
			.where(and(eq(tankFollows.tankId, tank.id), ne(tankFollows.userId, tank.ownerId)))
	).map((f) => f.userId);
	if (followerIds.length === 0) return 0;
	const people = await directory.byIds([tank.ownerId, ...followerIds], context);
	let queued = 0;
	for (const userId of followerIds) {
		const email = people.get(userId)?.email;
		if (!email || !tanks.canView({ id: userId }, tank)) continue;
		const [claimed] = await db
			.update(tankFollows)
			.set({ lastMailedAt: now })
			.where(
				and(
					eq(tankFollows.tankId, tank.id),
					eq(tankFollows.userId, userId),
					or(isNull(tankFollows.lastMailedAt), lte(tankFollows.lastMailedAt, new Date(now.getTime() - FOLLOW_MAIL_GAP_MS)))
				)
			);
		if (claimed.affectedRows !== 1) continue;
		const mail = followMail({
			memberId: userId,
			tankName: tank.name,
			ownerName: people.get(tank.ownerId)?.name ?? UNNAMED_MEMBER,
			entryTitle: entry.title,
			entryOn: entry.entryOn,
			entryUrl: absoluteUrl(`/journals/${tank.id}/entries/${entry.id}`),
			tankUrl: absoluteUrl(`/journals/${tank.id}`)
		});
		await enqueue(
			{
				to: email,
				...mail,
				category: 'follows',
				memberId: userId,
				topic: `tank-follow:${tank.id}`,
				dedupeKey: `tank-follow:${tank.id}:${userId}:${today('UTC', now)}`
			},
			{ db, now }
		);
		queued++;
	}
	return queued;
}
