// The weekly digest: what upkeep is due on a member's tanks in the coming week and what was
// written in the tanks they follow. Pure: the server fills it in and renders it as mail.
import { dayNumber, isoDay } from './calc';
import { formatDate } from '../format';

/** The Monday (UTC) of the week `now` falls in, 'YYYY-MM-DD': one digest per member per such week. */
export function weekOf(now: Date): string {
	const day = dayNumber(now);
	// 1970-01-01 was a Thursday: day 0 → weekday index 3 when Monday is 0.
	const weekday = (((day + 3) % 7) + 7) % 7;
	return isoDay(day - weekday);
}

export interface DigestTask {
	tankName: string;
	label: string;
	statusLabel: string;
	overdue: boolean;
}

export interface DigestEntry {
	tankName: string;
	title: string;
	entryOn: string;
	url: string;
}

export interface DigestContent {
	subject: string;
	heading: string;
	paragraphs: string[];
	action: { label: string; url: string };
	footer: string;
}

/** The digest's words, or null when there is nothing to tell (no mail is sent then). */
export function digestContent(input: {
	name: string | null;
	weekOf: string;
	tasks: DigestTask[];
	followed: DigestEntry[];
	homeUrl: string;
}): DigestContent | null {
	if (!input.tasks.length && !input.followed.length) return null;
	const paragraphs: string[] = [`Hello ${input.name ?? 'there'}, here is your week at the tanks from ${formatDate(input.weekOf)}.`];
	if (input.tasks.length) {
		const overdue = input.tasks.filter((t) => t.overdue).length;
		paragraphs.push(overdue ? `Upkeep due this week (${input.tasks.length}, of which ${overdue} overdue):` : `Upkeep due this week (${input.tasks.length}):`);
		for (const t of input.tasks) paragraphs.push(`• ${t.tankName}: ${t.label} — ${t.statusLabel}`);
	} else {
		paragraphs.push('Nothing on your schedules is due this week.');
	}
	if (input.followed.length) {
		paragraphs.push(`New in the tanks you follow (${input.followed.length}):`);
		for (const e of input.followed) paragraphs.push(`• ${e.tankName}: ${e.title || `entry of ${formatDate(e.entryOn)}`} — ${e.url}`);
	}
	paragraphs.push('Before hands go in the water, unplug the heater, lights and filter.');
	const due = input.tasks.length;
	return {
		subject: due ? `Your tanks this week: ${due} task${due === 1 ? '' : 's'} due` : 'Your tanks this week: news from tanks you follow',
		heading: 'Your tanks this week',
		paragraphs,
		action: { label: 'Open your dashboard', url: input.homeUrl },
		footer: 'You get this weekly digest because you asked for upkeep reminders in your notification settings.'
	};
}
