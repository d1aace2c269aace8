// Away care's mails that wait for a moment rather than an action (the `away-care` job): the
// keeper's daily digest of visits for those who chose it, a sitter's reminder of a visit day with
// nothing logged by evening in the sitter's zone (once per day: an away_reminder row records it),
// and the keeper's summary when the period is over (once: away_plan.summary_sent_at). Each is
// decided on the clock of the person it goes to ($lib/away/notices).
import { and, asc, eq, gte, inArray, isNull, lte } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import * as directory from '../club/directory';
import * as tanks from '../journals/tanks';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import { absoluteUrl } from '../config';
import { formatDate } from '../../format';
import { dayNumber, isoDay } from '../../journals/calc';
import { today } from '../../dates';
import { digestDay, missedVisitDay, periodOver } from '../../away/notices';
import { daysAway } from '../../away/care-plan';
import { awayPlans, awayReminders, awaySitters, awayVisits, type AwayPlanRow, type AwayVisitRow } from './schema';

/** Summaries go out for periods that ended this recently; older ones are left alone. */
const SUMMARY_WITHIN_DAYS = 14;
const zone = (member: directory.Member | undefined) => member?.timeZone ?? 'UTC';

/** The one mail about a visit, or about the day's visits, to the keeper. */
export function visitsMail(input: { tankName: string; url: string; visits: { sitterName: string; day: string; done: string[]; note: string }[] }) {
	const one = input.visits.length === 1 ? input.visits[0] : null;
	const heading = one ? `${one.sitterName} looked in on ${input.tankName}` : `${input.visits.length} visits to ${input.tankName}`;
	const paragraphs = input.visits.flatMap((v) => [
		`On ${formatDate(v.day)}, ${v.sitterName} looked in on ${input.tankName}.`,
		v.done.length ? `Done: ${v.done.join('; ')}.` : 'Nothing was ticked on the plan.',
		...(v.note ? [`Their note: “${v.note}”`] : [])
	]);
	const { html, text } = renderMail({
		heading,
		paragraphs,
		action: { label: one ? 'See the visit and its photos' : 'See the visits and their photos', url: input.url },
		footer:
			'You get this because you asked a member to look after your tank while you are away. Choose between a mail per visit and one a day on the care plan.'
	});
	return { subject: heading, html, text };
}

/**
 * The day's visits, in one mail per plan, for keepers who chose a daily mail; answers how many mails.
 * A visit on a later day than the keeper's (a sitter in a zone ahead) waits for the next one.
 */
export async function sendVisitDigests(context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const waiting = await db.selectDistinct({ planId: awayVisits.planId }).from(awayVisits).where(isNull(awayVisits.keeperMailedAt)).limit(500);
	if (waiting.length === 0) return 0;
	const planRows = await db
		.select()
		.from(awayPlans)
		.where(
			inArray(
				awayPlans.id,
				waiting.map((w) => w.planId)
			)
		);
	const keepers = await directory.byIds(
		planRows.map((p) => p.keeperId),
		context
	);
	let sent = 0;
	for (const plan of planRows) {
		const keeper = keepers.get(plan.keeperId);
		const day = digestDay({ now, zone: zone(keeper), sentOn: plan.digestSentOn });
		if (!day) continue;
		const done = await db.transaction(async (tx) => {
			const [locked] = await tx.select().from(awayPlans).where(eq(awayPlans.id, plan.id)).for('update');
			if (!locked || locked.digestSentOn === day) return false;
			const visits = await tx
				.select()
				.from(awayVisits)
				.where(and(eq(awayVisits.planId, plan.id), isNull(awayVisits.keeperMailedAt), lte(awayVisits.visitedOn, day)))
				.orderBy(asc(awayVisits.visitedOn), asc(awayVisits.id));
			if (visits.length === 0) return false;
			if (keeper?.email) {
				const [names, tankNames] = await Promise.all([
					directory.names(
						visits.map((v) => v.sitterId),
						{ db: tx }
					),
					tanks.namesOf([plan.tankId], { db: tx })
				]);
				const mail = visitsMail({
					tankName: tankNames.get(plan.tankId) ?? 'your tank',
					url: absoluteUrl(`/away/${plan.id}`),
					visits: visits.map((v: AwayVisitRow) => ({ sitterName: names.get(v.sitterId) ?? 'A member', day: v.visitedOn, done: v.done, note: v.note }))
				});
				await enqueue(
					{ to: keeper.email, ...mail, category: 'account', memberId: plan.keeperId, topic: `away:${plan.id}`, dedupeKey: `away-digest:${plan.id}:${day}` },
					{ db: tx, now }
				);
			}
			await tx
				.update(awayVisits)
				.set({ keeperMailedAt: now })
				.where(
					inArray(
						awayVisits.id,
						visits.map((v) => v.id)
					)
				);
			await tx.update(awayPlans).set({ digestSentOn: day }).where(eq(awayPlans.id, plan.id));
			return !!keeper?.email;
		});
		if (done) sent++;
	}
	return sent;
}

function reminderMail(input: { sitterName: string; keeperName: string; tankName: string; day: string; url: string }) {
	const heading = `No visit to ${input.tankName} logged today`;
	const { html, text } = renderMail({
		heading,
		paragraphs: [
			`Hello ${input.sitterName},`,
			`Nothing is logged yet for ${formatDate(input.day)} on ${input.keeperName}’s tank ${input.tankName}. If you looked in, log the visit so they know all is well; if you could not, tell them, so they can ask someone else.`,
			'If anything looks wrong near the tank, switch off and unplug at the wall with dry hands before you touch the water, and call the keeper.'
		],
		action: { label: 'Open the care plan', url: input.url },
		footer: 'You get this once for a day with no visit, because you said you would look in on this tank.'
	});
	return { subject: heading, html, text };
}

/** Reminds accepted sitters, once per day, of a visit day with nothing logged by evening in their zone; answers how many mails. */
export async function remindMissedVisits(context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	// Zones are at most 14 hours from UTC: a period running a day either side of today's UTC day may be on.
	const utcDay = dayNumber(today('UTC', now));
	const rows = await db
		.select({ plan: awayPlans, sitterId: awaySitters.sitterId, acceptedAt: awaySitters.answeredAt })
		.from(awaySitters)
		.innerJoin(awayPlans, eq(awayPlans.id, awaySitters.planId))
		.where(and(eq(awaySitters.state, 'accepted'), lte(awayPlans.startsOn, isoDay(utcDay + 1)), gte(awayPlans.endsOn, isoDay(utcDay - 1))))
		.limit(2000);
	if (rows.length === 0) return 0;
	const planIds = [...new Set(rows.map((r) => r.plan.id))];
	const [people, tankNames, visitRows] = await Promise.all([
		directory.byIds([...rows.map((r) => r.sitterId), ...rows.map((r) => r.plan.keeperId)], context),
		tanks.namesOf([...new Set(rows.map((r) => r.plan.tankId))], context),
		db
			.select({ planId: awayVisits.planId, visitedOn: awayVisits.visitedOn })
			.from(awayVisits)
			.where(and(inArray(awayVisits.planId, planIds), gte(awayVisits.visitedOn, isoDay(utcDay - 1))))
	]);
	const logged = new Map<number, Set<string>>();
	for (const v of visitRows) logged.set(v.planId, (logged.get(v.planId) ?? new Set()).add(v.visitedOn));
	let sent = 0;
	for (const { plan, sitterId, acceptedAt } of rows) {
		const sitter = people.get(sitterId);
		if (!sitter?.email || !acceptedAt) continue;
		const day = missedVisitDay(plan, { now, zone: zone(sitter), acceptedAt, loggedDays: logged.get(plan.id) ?? new Set() });
		if (!day) continue;
		const tankName = tankNames.get(plan.tankId) ?? 'a tank';
		const claimed = await db.transaction(async (tx) => {
			const [result] = await tx.insert(awayReminders).ignore().values({ planId: plan.id, sitterId, day, createdAt: now });
			if (result.affectedRows !== 1) return false;
			const mail = reminderMail({
				sitterName: sitter.name,
				keeperName: people.get(plan.keeperId)?.name ?? 'A member',
				tankName,
				day,
				url: absoluteUrl(`/away/${plan.id}`)
			});
			await enqueue(
				{
					to: sitter.email,
					...mail,
					category: 'account',
					memberId: sitterId,
					topic: `away:${plan.id}`,
					dedupeKey: `away-missed:${plan.id}:${sitterId}:${day}`
				},
				{ db: tx, now }
			);
			return true;
		});
		if (claimed) sent++;
	}
	return sent;
}

function summaryMail(input: { tankName: string; startsOn: string; endsOn: string; visitDays: number; days: number; url: string }) {
	const heading = `Welcome back: how ${input.tankName} fared`;
	const { html, text } = renderMail({
		heading,
		paragraphs: [
			`You were away from ${formatDate(input.startsOn)} until ${formatDate(input.endsOn)}.`,
			input.visitDays === 0
				? 'No visit was logged while you were away. Look the tank over before anything else, and unplug the equipment before your hands go in the water.'
				: `Someone looked in on ${input.visitDays} of the ${input.days} ${input.days === 1 ? 'day' : 'days'}. The summary shows what was done each day, the water tests against the last one before you left, and the tank then and now.`
		],
		action: { label: 'See the summary', url: input.url },
		footer: 'You get this once, because you planned care for this tank while you were away.'
	});
	return { subject: heading, html, text };
}

/** The keeper's summary, once per period, when their own day has reached the day they are back; answers how many mails. */
export async function sendSummaries(context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const utcDay = dayNumber(today('UTC', now));
	const ended: AwayPlanRow[] = await db
		.select()
		.from(awayPlans)
		.where(and(isNull(awayPlans.summarySentAt), lte(awayPlans.endsOn, isoDay(utcDay + 1)), gte(awayPlans.endsOn, isoDay(utcDay - SUMMARY_WITHIN_DAYS))))
		.limit(500);
	if (ended.length === 0) return 0;
	const keepers = await directory.byIds(
		ended.map((p) => p.keeperId),
		context
	);
	let sent = 0;
	for (const plan of ended) {
		const keeper = keepers.get(plan.keeperId);
		if (!periodOver(plan, now, zone(keeper))) continue;
		const [tankNames, visitDays] = await Promise.all([
			tanks.namesOf([plan.tankId], context),
			db.selectDistinct({ day: awayVisits.visitedOn }).from(awayVisits).where(eq(awayVisits.planId, plan.id))
		]);
		const claimed = await db.transaction(async (tx) => {
			const [result] = await tx
				.update(awayPlans)
				.set({ summarySentAt: now })
				.where(and(eq(awayPlans.id, plan.id), isNull(awayPlans.summarySentAt)));
			if (result.affectedRows !== 1 || !keeper?.email) return false;
			const mail = summaryMail({
				tankName: tankNames.get(plan.tankId) ?? 'your tank',
				startsOn: plan.startsOn,
				endsOn: plan.endsOn,
				visitDays: visitDays.length,
				days: daysAway(plan.startsOn, plan.endsOn),
				url: absoluteUrl(`/away/${plan.id}/summary`)
			});
			await enqueue(
				{ to: keeper.email, ...mail, category: 'account', memberId: plan.keeperId, topic: `away:${plan.id}`, dedupeKey: `away-summary:${plan.id}` },
				{ db: tx, now }
			);
			return true;
		});
		if (claimed) sent++;
	}
	return sent;
}

/** Everything the `away-care` job does in one round; answers how many mails were queued. */
export async function runDue(context: Context = {}): Promise<number> {
	return (await sendVisitDigests(context)) + (await remindMissedVisits(context)) + (await sendSummaries(context));
}
