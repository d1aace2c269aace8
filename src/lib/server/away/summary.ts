// Coming back: what happened to a tank while its keeper was away, for the keeper only (a sitter's
// access ends with the period, and this page is not theirs even before). Each day of the period
// with its visits (what was ticked, the upkeep logged, the note and the photos), the newest water
// test since leaving beside the last one before, and the tank then and now: the last photo before
// leaving beside the newest one.
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as tanks from '../journals/tanks';
import * as journalEntries from '../journals/journal-entries';
import * as tankPhotos from '../journals/tank-photos';
import * as upkeep from '../journals/upkeep';
import * as water from '../journals/water';
import { asc, eq } from 'drizzle-orm';
import { dayOf } from '../../dates';
import { zoneOf } from '../../club/viewer';
import { dayNumber, isoDay } from '../../journals/calc';
import { periodOver } from '../../away/notices';
import { awayVisits } from './schema';
import { ownPlan } from './plans';

export interface SummaryVisit {
	id: number;
	sitterName: string;
	done: string[];
	/** Upkeep tasks of the schedule the visit logged as done. */
	upkeep: string[];
	note: string;
	entryId: number | null;
	photos: { id: number; alt: string; width: number; height: number; thumb: string; large: string }[];
}

export interface AwaySummary {
	plan: { id: number; startsOn: string; endsOn: string };
	tank: { id: number; name: string };
	/** Whether the keeper's own day has reached the day they are back. */
	over: boolean;
	days: { day: string; visits: SummaryVisit[] }[];
	readings: { before: water.WaterTestRow | null; since: water.WaterTestRow | null };
	photos: { then: tankPhotos.DatedPhoto | null; now: tankPhotos.DatedPhoto | null };
}

/** The summary of an away period; "not found" for anyone but its keeper. */
export async function get(viewer: Pick<Viewer, 'id' | 'timeZone'>, planId: number, context: Context = {}): Promise<AwaySummary> {
	const { db, now } = resolve(context);
	const plan = await ownPlan(viewer, planId, context);
	const todayHere = dayOf(now, zoneOf(viewer));
	const [visitRows, tests, tasks, names, then, latest] = await Promise.all([
		db.select().from(awayVisits).where(eq(awayVisits.planId, plan.id)).orderBy(asc(awayVisits.visitedOn), asc(awayVisits.id)),
		water.latestOf(plan.tankId, 400, context),
		upkeep.listForTank(plan.tankId, context),
		tanks.namesOf([plan.tankId], context),
		tankPhotos.newestUpTo(plan.tankId, plan.startsOn, { before: true }, context),
		tankPhotos.newestUpTo(plan.tankId, todayHere, {}, context)
	]);
	const [entries, sitters] = await Promise.all([
		journalEntries.many(
			visitRows.flatMap((v) => (v.entryId === null ? [] : [v.entryId])),
			context
		),
		directory.names(
			visitRows.map((v) => v.sitterId),
			context
		)
	]);
	const entryById = new Map(entries.map((e) => [e.id, e]));
	const taskLabel = new Map(tasks.map((t) => [t.id, t.label]));
	const visitsOn = new Map<string, SummaryVisit[]>();
	for (const v of visitRows) {
		const entry = v.entryId === null ? undefined : entryById.get(v.entryId);
		const shown: SummaryVisit = {
			id: v.id,
			sitterName: sitters.get(v.sitterId) ?? 'A member',
			done: v.done,
			upkeep: (entry?.events ?? []).flatMap((e) => (e.taskId !== null && taskLabel.has(e.taskId) ? [taskLabel.get(e.taskId)!] : [])),
			note: v.note,
			entryId: entry ? entry.id : null,
			photos: (entry?.photos ?? []).map((p) => ({ id: p.id, alt: p.alt, width: p.width, height: p.height, thumb: p.urls.thumb, large: p.urls.large }))
		};
		visitsOn.set(v.visitedOn, [...(visitsOn.get(v.visitedOn) ?? []), shown]);
	}
	const days: AwaySummary['days'] = [];
	for (let n = dayNumber(plan.startsOn); n < dayNumber(plan.endsOn); n++) days.push({ day: isoDay(n), visits: visitsOn.get(isoDay(n)) ?? [] });
	return {
		plan: { id: plan.id, startsOn: plan.startsOn, endsOn: plan.endsOn },
		tank: { id: plan.tankId, name: names.get(plan.tankId) ?? 'Your tank' },
		over: periodOver(plan, now, zoneOf(viewer)),
		days,
		readings: { before: tests.find((t) => t.testedOn < plan.startsOn) ?? null, since: tests.find((t) => t.testedOn >= plan.startsOn) ?? null },
		photos: { then, now: latest && then && latest.id === then.id ? null : latest }
	};
}
