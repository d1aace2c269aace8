// The first draft of a care plan for a tank while its keeper is away, from what the journal already
// knows: the upkeep schedule, the fertilisers, the lights, the equipment and the animals. The keeper
// edits the draft freely; nothing here is sent anywhere as it stands.
//
// The decisions below are rules of thumb keepers use, written down by us (common practice, no
// source): a task may wait for the keeper's return when it would be late by at most half its
// interval; CO2 gear is looked at on every visit; liquid fertiliser is paused on short trips and
// halved on longer ones because nobody trims; root tabs last for weeks.
import { dayNumber, isoDay } from '../journals/calc';
import { TASK_KIND_LABELS, type TaskKind } from '../journals/journal-vocabulary';
import type { Co2Method } from '../journals/tank-vocabulary';
import type { FeedingChoice, LightingChoice } from './vocabulary';

/** Hours of light a day suggested while nobody trims (the same short day keepers give a new tank). */
export const AWAY_PHOTOPERIOD_HOURS = 6;
/** Trips up to this many days pause liquid fertiliser; longer ones halve it. */
export const SHORT_TRIP_DAYS = 7;
/** The longest away period the site plans for. */
export const MAX_AWAY_DAYS = 60;

export interface PlanTask {
	label: string;
	kind: TaskKind;
	intervalDays: number;
	lastDoneOn: string | null;
}

export interface CarePlanInput {
	tankName: string;
	/** The first day nobody is home (YYYY-MM-DD). */
	leaving: string;
	/** The day the keeper is back (YYYY-MM-DD); the keeper does that day's work. */
	returning: string;
	tasks: readonly PlanTask[];
	fertilisers: readonly { item: string; amount: string; frequency: string }[];
	lights: readonly { label: string; watts: number; hoursPerDay: number }[];
	filters: readonly { label: string }[];
	livestock: readonly { name: string; count: number }[];
	co2: { method: Co2Method; bubblesPerSecond: number | null };
	heater: { watts: number | null; note: string };
	feeding: FeedingChoice;
	lighting: LightingChoice;
	/** Litres a day the tank loses, from logged top-ups or the keeper; null when unknown. */
	evaporationLitresPerDay: number | null;
	keeperPhone: string;
}

export interface TaskDecision {
	label: string;
	kind: TaskKind;
	/** The day it falls due. */
	dueOn: string;
	/** 'sitter' when it cannot wait for the keeper's return. */
	who: 'sitter' | 'waits';
}

export interface DoseDecision {
	item: string;
	amount: string;
	frequency: string;
	advice: 'pause' | 'halve' | 'leave';
}

export interface CarePlanDraft {
	days: number;
	tasks: TaskDecision[];
	doses: DoseDecision[];
	/** Total litres of top-up water for the period, or null when the keeper must say. */
	topUpLitres: number | null;
	photoperiodHours: number | null;
}

/** Days from leaving to returning (the nights away). */
export function daysAway(leaving: string, returning: string): number {
	return dayNumber(returning) - dayNumber(leaving);
}

/** When a task next falls due: its last day plus its interval, or the first day away if never done. */
export function dueOn(task: PlanTask, leaving: string): string {
	return task.lastDoneOn === null ? leaving : isoDay(dayNumber(task.lastDoneOn) + task.intervalDays);
}

/**
 * The tasks that fall due while the keeper is away, each either for the sitter or waiting for the
 * keeper's return. A task waits when, done on the day the keeper is back, it would be late by at
 * most half its interval; CO2 gear is always looked at.
 */
export function tasksInPeriod(tasks: readonly PlanTask[], leaving: string, returning: string): TaskDecision[] {
	const first = dayNumber(leaving);
	const back = dayNumber(returning);
	const decisions: TaskDecision[] = [];
	for (const task of tasks) {
		const due = Math.max(dayNumber(dueOn(task, leaving)), first);
		if (due >= back) continue;
		const lateAtReturn = back - due;
		const waits = task.kind !== 'co2-check' && lateAtReturn <= Math.floor(task.intervalDays / 2);
		decisions.push({ label: task.label || TASK_KIND_LABELS[task.kind], kind: task.kind, dueOn: isoDay(due), who: waits ? 'waits' : 'sitter' });
	}
	return decisions.sort((a, b) => a.dueOn.localeCompare(b.dueOn) || a.label.localeCompare(b.label));
}

/** Root tabs and capsules sit in the substrate for weeks; everything else is dosed into the water. */
const isRootDose = (item: string) => /\b(root|tab|tabs|capsule|capsules)\b/i.test(item);

export function doseAdvice(fertilisers: CarePlanInput['fertilisers'], days: number): DoseDecision[] {
	return fertilisers.map((f) => ({ ...f, advice: isRootDose(f.item) ? 'leave' : days <= SHORT_TRIP_DAYS ? 'pause' : 'halve' }));
}

/** Litres of top-up water for the period, rounded up to the half litre; null when the rate is unknown. */
export function topUpFor(days: number, litresPerDay: number | null): number | null {
	if (litresPerDay === null || !Number.isFinite(litresPerDay) || litresPerDay < 0) return null;
	return Math.ceil(litresPerDay * days * 2) / 2;
}

export function draftCarePlan(input: CarePlanInput): CarePlanDraft {
	const days = daysAway(input.leaving, input.returning);
	if (!(days > 0)) throw new RangeError('The day back must come after the day of leaving.');
	const longest = input.lights.reduce((max, l) => Math.max(max, l.hoursPerDay), 0);
	return {
		days,
		tasks: tasksInPeriod(input.tasks, input.leaving, input.returning),
		doses: doseAdvice(input.fertilisers, days),
		topUpLitres: topUpFor(days, input.evaporationLitresPerDay),
		photoperiodHours: input.lights.length === 0 ? null : input.lighting === 'shorten' ? Math.min(longest, AWAY_PHOTOPERIOD_HOURS) : longest
	};
}

const formatDay = (day: string) =>
	new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${day}T00:00:00Z`));
const litres = (value: number) => `${value.toLocaleString('en-GB', { maximumFractionDigits: 1 })} L`;
/** Markdown special characters in what the keeper typed elsewhere are shown as written. */
const md = (text: string) => text.replace(/([\\`*_[\]#<>|])/g, '\\$1');

/**
 * The draft as the markdown the keeper edits: a checklist per visit, the doses, feeding, light,
 * equipment, what to do if something is wrong, and how to reach the keeper.
 */
export function carePlanMarkdown(input: CarePlanInput, draft: CarePlanDraft = draftCarePlan(input)): string {
	const lines: string[] = [];
	const push = (...more: string[]) => lines.push(...more);
	push(`## ${md(input.tankName)}: away from ${formatDay(input.leaving)} to ${formatDay(input.returning)}`, '');
	push(`Thank you for looking in. ${draft.days} day${draft.days === 1 ? '' : 's'} away; please tick what you did on each visit.`, '');

	push('### Every visit', '');
	push(
		'- [ ] The heater is on and the water feels as warm as usual' +
			(input.heater.watts ? ` (${input.heater.watts} W heater${input.heater.note ? `, ${md(input.heater.note)}` : ''})` : '')
	);
	if (input.filters.length === 0) push('- [ ] The filter is running (water moving at the outlet)');
	for (const f of input.filters) push(`- [ ] ${f.label ? md(f.label) : 'The filter'} is running (water moving at the outlet)`);
	if (input.co2.method === 'pressurised')
		push(
			`- [ ] CO2: the cylinder gauge reads as before and the bubble counter shows about ${input.co2.bubblesPerSecond ?? 'the usual'} bubble${input.co2.bubblesPerSecond === 1 ? '' : 's'} a second`
		);
	if (input.lights.length > 0) push('- [ ] The light timer switches the light on and off at the times below');
	push('- [ ] Count the fish you can see; look for anything lying on the bottom or gasping at the surface', '');

	const sitterTasks = draft.tasks.filter((t) => t.who === 'sitter');
	const waiting = draft.tasks.filter((t) => t.who === 'waits');
	if (sitterTasks.length > 0) {
		push('### Upkeep that cannot wait', '');
		for (const t of sitterTasks) push(`- [ ] ${md(t.label)} (due ${formatDay(t.dueOn)})`);
		push('');
	}
	if (waiting.length > 0) {
		push('### Can wait until I am back', '');
		for (const t of waiting) push(`- ${md(t.label)} (due ${formatDay(t.dueOn)})`);
		push('');
	}

	if (draft.doses.length > 0) {
		push('### Fertiliser', '');
		for (const d of draft.doses) {
			const what = `${md(d.item)}${d.amount ? `, ${md(d.amount)}` : ''}${d.frequency ? ` ${md(d.frequency)}` : ''}`;
			if (d.advice === 'leave') push(`- ${what}: nothing to do; root tabs last for weeks.`);
			else if (d.advice === 'pause') push(`- ${what}: none while I am away; with nobody trimming, the plants need less.`);
			else push(`- [ ] ${what}: half the usual amount; with nobody trimming, the plants need less.`);
		}
		push('');
	}

	push('### Feeding', '');
	if (input.livestock.length === 0) push('- No animals to feed.');
	else {
		push(`- Animals: ${input.livestock.map((a) => `${a.count} × ${md(a.name)}`).join(', ')}.`);
		// Common practice, no source: healthy adult fish are commonly left unfed for several days.
		if (input.feeding === 'none')
			push('- No food while I am away. Healthy adult fish commonly go several days without food; uneaten food spoils the water faster.');
		else if (input.feeding === 'reduced') push('- [ ] A small pinch every other visit, no more than they finish in a minute.');
		else push('- [ ] Feed as on the note by the tank, no more than they finish in a minute.');
		push('- Fry, shrimplets and some species cannot go without food for long: if there are any, I have said how to feed them here.');
	}
	push('');

	if (draft.photoperiodHours !== null) {
		push('### Light', '');
		push(
			input.lighting === 'shorten'
				? `- The timer is set to ${draft.photoperiodHours} hours a day while I am away, to hold back algae while nobody trims. Please leave it so.`
				: `- The timer runs ${draft.photoperiodHours} hours a day as usual. Please leave it so.`
		);
		push('');
	}

	push('### Top-up water', '');
	push(
		draft.topUpLitres === null
			? '- Top up to the line on the glass with the water I have left ready; I will say how much the tank usually needs.'
			: `- About ${litres(draft.topUpLitres)} over the whole period, from what I usually top up. Top up to the line on the glass with the water I have left ready.`
	);
	push('');

	push('### If something is wrong', '');
	push('- **A leak or water near a socket:** switch off and unplug everything at the wall first, with dry hands, before you touch the tank. Then call me.');
	push('- **The heater is off or the water is cold:** check the plug and the switch with dry hands; do not lift a heater out while it is plugged in.');
	push('- **A dead fish:** take it out with the net, put it in the bin (never down the drain or outside), and note it.');
	push('- **Fish gasping at the surface:** close the CO2 valve at the cylinder, air the room, and call me.');
	push('- **Cloudy or smelly water:** do not feed; note it with a photo and tell me.');
	push('- Never pour plants, animals or tank water into a pond, stream or drain outside.');
	push('');
	push(`### Reaching me`, '');
	push(input.keeperPhone ? `- ${md(input.keeperPhone)}` : '- Through the club site’s messages.');
	return lines.join('\n') + '\n';
}

/** The tick-box lines of a plan ("- [ ] …"), as the sitter ticks them on a visit, without markdown escapes. */
export function checklistOf(body: string): string[] {
	const lines: string[] = [];
	for (const line of body.split('\n')) {
		const match = /^\s*[-*]\s+\[\s?\]\s+(.+)$/.exec(line);
		if (match?.[1]) lines.push(match[1].replace(/\\([\\`*_[\]#<>|])/g, '$1').trim());
	}
	return [...new Set(lines)];
}
