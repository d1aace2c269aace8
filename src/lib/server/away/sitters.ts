// Asking members to look in: who the keeper may ask (members near them who said they can look after
// tanks, or anyone by name), the request by mail, and the answer. A sitter sees the plan only after
// saying yes, and only until the keeper is back (./plans.ts decides).
import { and, eq, inArray } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as tanks from '../journals/tanks';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import { absoluteUrl } from '../config';
import { conflict, invalid, notFound } from '../../errors';
import { formatDate } from '../../format';
import { haversineDistance } from '../../swaps/distance';
import { labelOf, shownFigure } from '../../swaps/display';
import { distanceUnitOf, type UnitSystem } from '../../journals/calc/units';
import { awayHelpers, awayPlans, awaySitters } from './schema';
import { ownPlan, sitterMayRead, type AwayPlanRow } from './plans';
import { today } from '../../dates';

/** The distances the keeper may choose to look for helpers within, in their own unit (figures the board shows). */
export const HELPER_RADII_KM = [5, 10, 25, 50] as const;

export interface Candidate {
	id: string;
	name: string;
	/** The distance as members see it ("about 4 km"), or null when either has no place set. */
	distance: string | null;
}

/**
 * Members who said they can look after tanks, within `radiusKm` of the keeper by the shown figure
 * (the same coarse figure the swap board shows, so nothing finer is learnt), nearest first. Without
 * a place of the keeper's own, every helper, by name.
 */
export async function nearbyHelpers(viewer: Pick<Viewer, 'id'> & { units: UnitSystem }, radius: number, context: Context = {}): Promise<Candidate[]> {
	const unit = distanceUnitOf(viewer.units);
	const { db } = resolve(context);
	const helperIds = (await db.select({ id: awayHelpers.userId }).from(awayHelpers).limit(2000)).map((h) => h.id).filter((id) => id !== viewer.id);
	if (helperIds.length === 0) return [];
	const [people, points] = await Promise.all([directory.byIds(helperIds, context), directory.homePoints([viewer.id, ...helperIds], context)]);
	const home = points.get(viewer.id);
	const found: (Candidate & { shown: number })[] = [];
	for (const id of helperIds) {
		const person = people.get(id);
		if (!person || !person.email) continue;
		const point = points.get(id);
		if (!home) {
			found.push({ id, name: person.name, distance: null, shown: Number.POSITIVE_INFINITY });
			continue;
		}
		if (!point) continue;
		const shown = shownFigure(haversineDistance(home, point), unit);
		if (shown > radius) continue;
		found.push({ id, name: person.name, distance: labelOf(shown, unit).text, shown });
	}
	return found.sort((a, b) => a.shown - b.shown || a.name.localeCompare(b.name)).map(({ shown: _shown, ...c }) => c);
}

/** Any member by the start of their name, to ask someone who did not offer. */
export async function byName(viewer: Pick<Viewer, 'id'>, prefix: string, context: Context = {}): Promise<Candidate[]> {
	return (await directory.findByName(prefix, 10, context)).filter((m) => m.id !== viewer.id).map((m) => ({ id: m.id, name: m.name, distance: null }));
}

function requestMail(input: { memberId: string; keeperName: string; tankName: string; startsOn: string; endsOn: string; url: string }) {
	const { html, text } = renderMail({
		heading: `Could you look in on ${input.tankName}?`,
		paragraphs: [
			`${input.keeperName} is away from ${formatDate(input.startsOn)} until ${formatDate(input.endsOn)} and asks whether you could look in on their tank ${input.tankName}.`,
			'The page below has the dates. Say yes or no there; you see the care plan once you say yes.'
		],
		action: { label: 'Answer the request', url: input.url },
		footer: 'You get this because a club member asked you personally. Nothing more is sent unless you say yes.',
		to: { memberId: input.memberId, category: 'account' }
	});
	return { subject: `Could you look in on ${input.tankName}?`, html, text };
}

function answerMail(input: { memberId: string; sitterName: string; tankName: string; yes: boolean; url: string }) {
	const heading = input.yes ? `${input.sitterName} will look in on ${input.tankName}` : `${input.sitterName} cannot look in on ${input.tankName}`;
	const { html, text } = renderMail({
		heading,
		paragraphs: input.yes
			? [`${input.sitterName} said yes. They can read the care plan now, until the day you are back.`]
			: [`${input.sitterName} said no this time. You can ask someone else from the plan's page.`],
		action: { label: 'Open the care plan', url: input.url },
		footer: 'You get this because you asked a member to look after your tank.',
		to: { memberId: input.memberId, category: 'account' }
	});
	return { subject: heading, html, text };
}

/** The keeper asks a member to look in; they are mailed. Asking the same member again does nothing new. */
export async function ask(viewer: Pick<Viewer, 'id'>, planId: number, sitterId: string, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const plan = await ownPlan(viewer, planId, context);
	if (!sitterMayRead(plan, today('UTC', now))) throw conflict('ended', 'This away period is over.');
	if (sitterId === viewer.id) throw invalid({ sitterId: 'Ask another member.' });
	const people = await directory.byIds([viewer.id, sitterId], context);
	const sitter = people.get(sitterId);
	if (!sitter || !sitter.email) throw invalid({ sitterId: 'Choose a member of the club.' });
	const tankName = (await tanks.namesOf([plan.tankId], context)).get(plan.tankId) ?? 'a tank';
	await db.transaction(async (tx) => {
		const [existing] = await tx
			.select()
			.from(awaySitters)
			.where(and(eq(awaySitters.planId, plan.id), eq(awaySitters.sitterId, sitterId)))
			.for('update');
		if (existing && (existing.state === 'asked' || existing.state === 'accepted')) return;
		if (existing) await tx.update(awaySitters).set({ state: 'asked', askedAt: now, answeredAt: null }).where(eq(awaySitters.id, existing.id));
		else await tx.insert(awaySitters).values({ planId: plan.id, sitterId, state: 'asked', askedAt: now });
		const mail = requestMail({
			memberId: sitterId,
			keeperName: people.get(viewer.id)?.name ?? 'A member',
			tankName,
			startsOn: plan.startsOn,
			endsOn: plan.endsOn,
			url: absoluteUrl('/away')
		});
		await enqueue(
			{
				to: sitter.email,
				...mail,
				category: 'account',
				memberId: sitterId,
				topic: `away:${plan.id}`,
				dedupeKey: `away-ask:${plan.id}:${sitterId}:${now.getTime()}`
			},
			{ db: tx, now }
		);
	});
}

/** The keeper takes a request back (or ends a sitter's access early). */
export async function withdraw(viewer: Pick<Viewer, 'id'>, planId: number, sitterRowId: number, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const plan = await ownPlan(viewer, planId, context);
	const [result] = await db
		.update(awaySitters)
		.set({ state: 'withdrawn', answeredAt: now })
		.where(and(eq(awaySitters.id, sitterRowId), eq(awaySitters.planId, plan.id), inArray(awaySitters.state, ['asked', 'accepted'])));
	if (result.affectedRows === 0) throw notFound('We could not find that request.');
}

/** The member asked says yes or no; the keeper is told. Only a request still waiting can be answered. */
export async function answer(viewer: Pick<Viewer, 'id'>, sitterRowId: number, yes: boolean, context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const [row] = await tx.select().from(awaySitters).where(eq(awaySitters.id, sitterRowId)).for('update');
		if (!row || row.sitterId !== viewer.id) throw notFound('We could not find that request.');
		if (row.state !== 'asked')
			throw conflict('answered', row.state === 'withdrawn' ? 'The keeper took this request back.' : 'You have answered this request already.');
		const plan = await planRow(row.planId, { db: tx });
		if (!sitterMayRead(plan, today('UTC', now))) throw conflict('ended', 'This away period is over.');
		await tx
			.update(awaySitters)
			.set({ state: yes ? 'accepted' : 'declined', answeredAt: now })
			.where(eq(awaySitters.id, row.id));
		const people = await directory.byIds([viewer.id, plan.keeperId], { db: tx });
		const keeper = people.get(plan.keeperId);
		if (keeper?.email) {
			const tankName = (await tanks.namesOf([plan.tankId], { db: tx })).get(plan.tankId) ?? 'your tank';
			const mail = answerMail({
				memberId: plan.keeperId,
				sitterName: people.get(viewer.id)?.name ?? 'A member',
				tankName,
				yes,
				url: absoluteUrl(`/away/${plan.id}`)
			});
			await enqueue(
				{
					to: keeper.email,
					...mail,
					category: 'account',
					memberId: plan.keeperId,
					topic: `away:${plan.id}`,
					dedupeKey: `away-answer:${row.id}:${now.getTime()}`
				},
				{ db: tx, now }
			);
		}
		return plan.id;
	});
}

async function planRow(planId: number, context: Context): Promise<AwayPlanRow> {
	const [plan] = await resolve(context).db.select().from(awayPlans).where(eq(awayPlans.id, planId)).limit(1);
	if (!plan) throw notFound('We could not find that care plan.');
	return plan;
}
