// Care plans: a keeper starts an away period for one of their tanks, the site drafts the plan from
// the tank's own records, and the keeper edits it. Who may read a plan is decided here and only
// here (`readable`): the keeper always; a member who agreed to look in, until the day the keeper is
// back; anyone else is told it does not exist.
import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, gt, inArray } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as tanks from '../journals/tanks';
import * as upkeep from '../journals/upkeep';
import { renderMarkdown, storedHtml } from '../markdown';
import { conflict, invalid, notFound } from '../../errors';
import { today } from '../../dates';
import { carePlanMarkdown, daysAway, MAX_AWAY_DAYS, type CarePlanInput } from '../../away/care-plan';
import { evaporationPerDay } from '../../away/evaporation';
import type { AwayPlanInput } from '../../away/plan-form';
import type { VisitMailChoice } from '../../away/vocabulary';
import { awayHelpers, awayPlans, awaySitters, awayVisits, type AwayPlanRow, type AwaySitterRow, type AwayVisitRow } from './schema';

export type { AwayPlanRow };

const planNotFound = () => notFound('We could not find that care plan.');

/** How the viewer stands to a plan: its keeper, a member looking in, or nobody (null). */
export type PlanRole = 'keeper' | 'sitter';

/** Whether a sitter's access still runs on `day`: from saying yes until the day the keeper is back. */
export const sitterMayRead = (plan: Pick<AwayPlanRow, 'endsOn'>, day: string) => day < plan.endsOn;

async function roleOf(viewer: Pick<Viewer, 'id'> | null, plan: AwayPlanRow, context: Context): Promise<PlanRole | null> {
	if (!viewer) return null;
	if (plan.keeperId === viewer.id) return 'keeper';
	const { db, now } = resolve(context);
	if (!sitterMayRead(plan, today('UTC', now))) return null;
	const [row] = await db
		.select({ state: awaySitters.state })
		.from(awaySitters)
		.where(and(eq(awaySitters.planId, plan.id), eq(awaySitters.sitterId, viewer.id)))
		.limit(1);
	return row?.state === 'accepted' ? 'sitter' : null;
}

/** The plan and how the viewer stands to it; "not found" for anyone who may not read it. */
export async function readable(viewer: Pick<Viewer, 'id'> | null, planId: number, context: Context = {}): Promise<{ plan: AwayPlanRow; role: PlanRole }> {
	const { db } = resolve(context);
	const [plan] = await db.select().from(awayPlans).where(eq(awayPlans.id, planId)).limit(1);
	if (!plan) throw planNotFound();
	const role = await roleOf(viewer, plan, context);
	if (!role) throw planNotFound();
	return { plan, role };
}

/** The plan, for its keeper only. */
export async function ownPlan(viewer: Pick<Viewer, 'id'>, planId: number, context: Context = {}): Promise<AwayPlanRow> {
	const { plan, role } = await readable(viewer, planId, context);
	if (role !== 'keeper') throw planNotFound();
	return plan;
}

/** What the draft is made from: the tank's lists and schedule, and the evaporation of its logged top-ups. */
async function draftInput(tank: tanks.Tank, input: Omit<AwayPlanInput, 'visitMail'>, context: Context): Promise<CarePlanInput> {
	const { now } = resolve(context);
	const [tasks, topUps] = await Promise.all([upkeep.listForTank(tank.id, context), upkeep.topUpsOf(tank.id, context)]);
	const logged = evaporationPerDay(topUps, today('UTC', now));
	return {
		tankName: tank.name,
		leaving: input.startsOn,
		returning: input.endsOn,
		tasks: tasks.map((t) => ({ label: t.label, kind: t.kind, intervalDays: t.intervalDays, lastDoneOn: t.lastDoneOn })),
		fertilisers: tank.fertilisers.map((f) => ({ item: f.item, amount: f.amount, frequency: f.frequency })),
		lights: tank.lights.map((l) => ({ label: l.label, watts: l.watts, hoursPerDay: l.hoursPerDay })),
		filters: tank.filters.map((f) => ({ label: f.label })),
		livestock: tank.livestock.filter((a) => a.removedOn === null).map((a) => ({ name: a.commonName ?? a.name, count: a.count })),
		co2: { method: tank.co2Method, bubblesPerSecond: tank.co2BubblesPerSecond },
		heater: { watts: tank.heaterWatts, note: tank.heaterNote },
		feeding: input.feeding,
		lighting: input.lighting,
		// The keeper's own figure wins; else the logged top-ups; else the plan asks (never a number from nowhere).
		evaporationLitresPerDay: input.evaporationLitresPerDay ?? logged,
		keeperPhone: input.keeperPhone
	};
}

/** The evaporation the keeper's top-ups show for a tank of theirs (litres a day), or null. */
export async function loggedEvaporation(viewer: Pick<Viewer, 'id'>, tankId: number, context: Context = {}): Promise<number | null> {
	const tank = await tanks.findOwn(viewer, tankId, context);
	if (!tank) throw tanks.tankNotFound();
	return evaporationPerDay(await upkeep.topUpsOf(tankId, context), today('UTC', resolve(context).now));
}

/**
 * Starts an away period for the keeper's tank with a drafted plan. Refuses dates in the past, a day
 * back that is not after the day of leaving, a period over two months, and a period that overlaps
 * another of the same tank.
 */
export async function start(
	viewer: Pick<Viewer, 'id'>,
	tankId: number,
	input: Omit<AwayPlanInput, 'visitMail'> & { visitMail?: VisitMailChoice },
	context: Context = {}
): Promise<number> {
	const { db, now } = resolve(context);
	const tank = await tanks.getOwn(viewer, tankId, context);
	if (!tank) throw tanks.tankNotFound();
	if (input.endsOn < today('UTC', now)) throw invalid({ endsOn: 'That day has passed.' });
	const days = daysAway(input.startsOn, input.endsOn);
	if (days < 1) throw invalid({ endsOn: 'The day you are back comes after the day you leave.' });
	if (days > MAX_AWAY_DAYS) throw invalid({ endsOn: `Plan at most ${MAX_AWAY_DAYS} days at a time.` });
	const body = carePlanMarkdown(await draftInput(tank, input, context));
	return db.transaction(async (tx) => {
		const overlapping = await tx
			.select({ id: awayPlans.id })
			.from(awayPlans)
			.where(and(eq(awayPlans.tankId, tankId), gt(awayPlans.endsOn, input.startsOn)))
			.for('update');
		const clash = (
			overlapping.length
				? await tx
						.select()
						.from(awayPlans)
						.where(
							inArray(
								awayPlans.id,
								overlapping.map((o) => o.id)
							)
						)
				: []
		).find((p) => p.startsOn < input.endsOn);
		if (clash) throw conflict('overlap', 'This tank already has a care plan for some of those days.', { planId: clash.id });
		const [result] = await tx.insert(awayPlans).values({
			tankId,
			keeperId: viewer.id,
			startsOn: input.startsOn,
			endsOn: input.endsOn,
			feeding: input.feeding,
			lighting: input.lighting,
			visitMail: input.visitMail ?? 'each',
			keeperPhone: input.keeperPhone,
			body,
			bodyHtml: renderMarkdown(body),
			createdAt: now,
			updatedAt: now
		});
		return result.insertId;
	});
}

export const PLAN_BODY_MAX = 20_000;

/** The keeper's edit of the plan's text. */
export async function saveBody(viewer: Pick<Viewer, 'id'>, planId: number, body: string, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const plan = await ownPlan(viewer, planId, context);
	const text = body.replace(/\r\n/g, '\n').trim();
	if (!text) throw invalid({ body: 'The plan needs some words for whoever looks in.' });
	if (text.length > PLAN_BODY_MAX) throw invalid({ body: `Keep the plan to ${PLAN_BODY_MAX.toLocaleString('en-GB')} characters.` });
	await db
		.update(awayPlans)
		.set({ body: text, bodyHtml: renderMarkdown(text), updatedAt: now })
		.where(eq(awayPlans.id, plan.id));
}

/** The keeper's choice between a mail after each visit and one a day. */
export async function setVisitMail(viewer: Pick<Viewer, 'id'>, planId: number, choice: VisitMailChoice, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const plan = await ownPlan(viewer, planId, context);
	await db.update(awayPlans).set({ visitMail: choice, updatedAt: now }).where(eq(awayPlans.id, plan.id));
}

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * A private link to the plan for someone who is not a member (a neighbour with a key): a new
 * unguessable token each time, stored only as its hash, so making a new link ends the old one.
 * Returns the path; it works until the keeper is back.
 */
export async function makeShareLink(viewer: Pick<Viewer, 'id'>, planId: number, context: Context = {}): Promise<string> {
	const { db, now } = resolve(context);
	const plan = await ownPlan(viewer, planId, context);
	const token = randomBytes(24).toString('base64url');
	await db
		.update(awayPlans)
		.set({ shareTokenHash: hashToken(token), updatedAt: now })
		.where(eq(awayPlans.id, plan.id));
	return `/away/shared/${token}`;
}

/** The keeper ends the private link. */
export async function endShareLink(viewer: Pick<Viewer, 'id'>, planId: number, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const plan = await ownPlan(viewer, planId, context);
	await db.update(awayPlans).set({ shareTokenHash: null, updatedAt: now }).where(eq(awayPlans.id, plan.id));
}

/** The plan behind a private link, while it runs; "not found" for a wrong, ended or expired one. */
export async function byShareToken(token: string, context: Context = {}): Promise<PlanView> {
	const { db, now } = resolve(context);
	if (!/^[A-Za-z0-9_-]{32}$/.test(token)) throw planNotFound();
	const [plan] = await db
		.select()
		.from(awayPlans)
		.where(eq(awayPlans.shareTokenHash, hashToken(token)))
		.limit(1);
	if (!plan || !sitterMayRead(plan, today('UTC', now))) throw planNotFound();
	return view(plan, null, context);
}

export interface SitterView {
	id: number;
	sitterId: string;
	name: string;
	state: AwaySitterRow['state'];
}

export interface VisitView {
	id: number;
	visitedOn: string;
	sitterName: string;
	done: string[];
	note: string;
	entryId: number | null;
}

export interface PlanView {
	plan: Omit<AwayPlanRow, 'shareTokenHash' | 'bodyHtml'> & { hasShareLink: boolean };
	html: string;
	tank: { id: number; name: string; coverUrl: string | null; coverAlt: string };
	keeperName: string;
}

async function view(plan: AwayPlanRow, _role: PlanRole | null, context: Context): Promise<PlanView> {
	const [tank, names] = await Promise.all([tanks.getOwn({ id: plan.keeperId }, plan.tankId, context), directory.names([plan.keeperId], context)]);
	if (!tank) throw planNotFound();
	const { shareTokenHash, bodyHtml: _html, ...rest } = plan;
	return {
		plan: { ...rest, hasShareLink: shareTokenHash !== null },
		html: storedHtml(plan.bodyHtml, plan.body),
		tank: { id: tank.id, name: tank.name, coverUrl: tank.cover?.urls.medium ?? null, coverAlt: tank.cover?.alt ?? '' },
		keeperName: names.get(plan.keeperId) ?? ''
	};
}

/** Everything the plan's page shows the viewer: the plan, its tank, who was asked, the visits. */
export async function get(
	viewer: Pick<Viewer, 'id'>,
	planId: number,
	context: Context = {}
): Promise<PlanView & { role: PlanRole; sitters: SitterView[]; visits: VisitView[] }> {
	const { db } = resolve(context);
	const { plan, role } = await readable(viewer, planId, context);
	const [shown, sitterRows, visitRows] = await Promise.all([
		view(plan, role, context),
		db.select().from(awaySitters).where(eq(awaySitters.planId, plan.id)).orderBy(awaySitters.askedAt),
		db.select().from(awayVisits).where(eq(awayVisits.planId, plan.id)).orderBy(desc(awayVisits.visitedOn), desc(awayVisits.id))
	]);
	const names = await directory.names([...sitterRows.map((s) => s.sitterId), ...visitRows.map((v) => v.sitterId)], context);
	// A sitter sees the plan and the visits, not who else the keeper asked.
	const sitters = (role === 'keeper' ? sitterRows : sitterRows.filter((s) => s.sitterId === viewer.id)).map((s) => ({
		id: s.id,
		sitterId: s.sitterId,
		name: names.get(s.sitterId) ?? '',
		state: s.state
	}));
	const visits = visitRows.map((v: AwayVisitRow) => ({
		id: v.id,
		visitedOn: v.visitedOn,
		sitterName: names.get(v.sitterId) ?? '',
		done: v.done,
		note: v.note,
		entryId: v.entryId
	}));
	return { ...shown, role, sitters, visits };
}

export interface MyAway {
	keeping: { id: number; tankName: string; startsOn: string; endsOn: string }[];
	asked: { sitterRowId: number; planId: number; tankName: string; keeperName: string; startsOn: string; endsOn: string; state: AwaySitterRow['state'] }[];
	helper: boolean;
}

/** The viewer's plans as keeper, what they were asked to do for others, and their "can look in" setting. */
export async function mine(viewer: Pick<Viewer, 'id'>, context: Context = {}): Promise<MyAway> {
	const { db, now } = resolve(context);
	const since = today('UTC', now);
	const [keeping, asked, helper] = await Promise.all([
		db.select().from(awayPlans).where(eq(awayPlans.keeperId, viewer.id)).orderBy(desc(awayPlans.startsOn)).limit(50),
		db
			.select({ row: awaySitters, plan: awayPlans })
			.from(awaySitters)
			.innerJoin(awayPlans, eq(awayPlans.id, awaySitters.planId))
			.where(and(eq(awaySitters.sitterId, viewer.id), gt(awayPlans.endsOn, since)))
			.orderBy(awayPlans.startsOn)
			.limit(50),
		db.select().from(awayHelpers).where(eq(awayHelpers.userId, viewer.id)).limit(1)
	]);
	const [tankNames, keepers] = await Promise.all([
		tanks.namesOf([...keeping.map((p) => p.tankId), ...asked.map((a) => a.plan.tankId)], context),
		directory.names(
			asked.map((a) => a.plan.keeperId),
			context
		)
	]);
	return {
		keeping: keeping.map((p) => ({ id: p.id, tankName: tankNames.get(p.tankId) ?? 'A tank', startsOn: p.startsOn, endsOn: p.endsOn })),
		asked: asked.map((a) => ({
			sitterRowId: a.row.id,
			planId: a.plan.id,
			tankName: tankNames.get(a.plan.tankId) ?? 'A tank',
			keeperName: keepers.get(a.plan.keeperId) ?? '',
			startsOn: a.plan.startsOn,
			endsOn: a.plan.endsOn,
			state: a.row.state
		})),
		helper: helper.length > 0
	};
}

/** The viewer's "I can look after tanks near me" setting. */
export async function setHelper(viewer: Pick<Viewer, 'id'>, on: boolean, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	if (on)
		await db
			.insert(awayHelpers)
			.values({ userId: viewer.id, createdAt: now })
			.onDuplicateKeyUpdate({ set: { userId: viewer.id } });
	else await db.delete(awayHelpers).where(eq(awayHelpers.userId, viewer.id));
}
