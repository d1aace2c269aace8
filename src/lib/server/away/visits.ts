// A visit: the member looking in ticks what they did, adds a note and photos, and the visit lands on
// the tank's timeline as an entry of theirs. Ticked upkeep counts as done. The keeper is mailed.
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as tanks from '../journals/tanks';
import * as journalEntries from '../journals/journal-entries';
import * as upkeep from '../journals/upkeep';
import { enqueue } from '../mail/outbox';
import { absoluteUrl } from '../config';
import { conflict, invalid } from '../../errors';
import { today } from '../../dates';
import { zoneOf } from '../../club/viewer';
import { formatDate } from '../../format';
import { visitsMail } from './notices';
import type { PhotoField } from '../../media/form';
import { awayVisits } from './schema';
import { readable } from './plans';

export const VISIT_NOTE_MAX = 1000;
export const VISIT_TICKS_MAX = 40;

export interface VisitInput {
	/** Lines of the plan ticked, as they read. */
	done: string[];
	/** Schedule tasks done on this visit. */
	taskIds: number[];
	note: string;
}

/** The tasks of the tank's schedule a sitter may tick as done. */
export async function tasksOf(viewer: Pick<Viewer, 'id'>, planId: number, context: Context = {}) {
	const { plan } = await readable(viewer, planId, context);
	return (await upkeep.listForTank(plan.tankId, context)).map((t) => ({ id: t.id, label: t.label }));
}

/**
 * Logs today's visit (the sitter's today, in their zone) by a member who agreed to look in, while
 * the period runs. The entry on the tank is the sitter's; the keeper is mailed at once when they
 * chose a mail per visit, else the visit waits for the day's digest (./notices.ts).
 */
export async function log(
	viewer: Pick<Viewer, 'id' | 'timeZone'>,
	planId: number,
	input: VisitInput,
	photos: PhotoField[],
	context: Context = {}
): Promise<number> {
	const { db, now } = resolve(context);
	const { plan, role } = await readable(viewer, planId, context);
	if (role !== 'sitter') throw conflict('not-sitter', 'Visits are logged by the member looking in.');
	const day = today(zoneOf(viewer), now);
	if (day < plan.startsOn) throw conflict('not-yet', `The away period starts on ${formatDate(plan.startsOn)}.`);
	const note = input.note.replace(/\r\n/g, '\n').trim();
	if (note.length > VISIT_NOTE_MAX) throw invalid({ note: `Keep the note to ${VISIT_NOTE_MAX} characters.` });
	const done = [...new Set(input.done.map((d) => d.trim()).filter(Boolean))].slice(0, VISIT_TICKS_MAX).map((d) => d.slice(0, 300));
	if (done.length === 0 && !note && photos.length === 0) throw invalid({ _form: 'Tick what you did, add a note or a photo.' });
	const known = new Set((await upkeep.listForTank(plan.tankId, context)).map((t) => t.id));
	const taskIds = input.taskIds.filter((id) => known.has(id));
	const people = await directory.byIds([viewer.id, plan.keeperId], context);
	const sitterName = people.get(viewer.id)?.name ?? 'A member';
	const tankName = (await tanks.namesOf([plan.tankId], context)).get(plan.tankId) ?? 'your tank';
	const body = [done.length ? done.map((d) => `- ${d}`).join('\n') : '', note].filter(Boolean).join('\n\n');
	return db.transaction(async (tx) => {
		const inTx = { ...context, db: tx, now };
		const entryId = await journalEntries.createVisit(
			viewer,
			plan.tankId,
			{ entryOn: day, title: `Looked in by ${sitterName} (away care)`, body, taskIds },
			photos,
			inTx
		);
		const atOnce = plan.visitMail === 'each';
		const [result] = await tx
			.insert(awayVisits)
			.values({ planId: plan.id, sitterId: viewer.id, visitedOn: day, entryId, done, note, keeperMailedAt: atOnce ? now : null, createdAt: now });
		const keeper = people.get(plan.keeperId);
		if (atOnce && keeper?.email) {
			const mail = visitsMail({
				tankName,
				url: absoluteUrl(`/journals/${plan.tankId}/entries/${entryId}`),
				visits: [{ sitterName, day, done, note }]
			});
			await enqueue(
				{ to: keeper.email, ...mail, category: 'account', memberId: plan.keeperId, topic: `away:${plan.id}`, dedupeKey: `away-visit:${result.insertId}` },
				inTx
			);
		}
		return result.insertId;
	});
}
