// A proposed pickup: a day, a time window and a meeting point, agreed in the conversation. Times
// are the members' local clock time as they type it (the club meets in one place), so they are
// kept as text and never converted between time zones.
import { zoneName } from '../format';
import { DAY_MS } from './listing';

export interface PickupProposal {
	/** YYYY-MM-DD */
	on: string;
	/** HH:MM, 24-hour */
	from: string;
	to: string;
	place: string;
}

export const PICKUP_PLACE_MAX = 200;
/** How far ahead a pickup may be proposed (our choice, no source): cuttings do not keep for long. */
export const PICKUP_MAX_DAYS_AHEAD = 60;

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const TIME = /^([01]\d|2[0-3]):([0-5]\d)$/;

function dayNumber(text: string): number | null {
	const m = DATE.exec(text);
	if (!m) return null;
	const t = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
	const d = new Date(t);
	// Refuses 2026-02-30 and the like, which Date.UTC would roll over into March.
	if (d.getUTCFullYear() !== Number(m[1]) || d.getUTCMonth() !== Number(m[2]) - 1 || d.getUTCDate() !== Number(m[3])) return null;
	return Math.floor(t / DAY_MS);
}

const minutes = (time: string) => {
	const m = TIME.exec(time);
	return m ? Number(m[1]) * 60 + Number(m[2]) : null;
};

/**
 * Field errors for a proposal (empty when it is fine). The day may be yesterday by UTC, since the
 * members' own day may not have turned yet; it may be at most PICKUP_MAX_DAYS_AHEAD days ahead.
 */
export function checkPickup(p: PickupProposal, now: Date): Partial<Record<keyof PickupProposal, string>> {
	const errors: Partial<Record<keyof PickupProposal, string>> = {};
	const day = dayNumber(p.on);
	const today = Math.floor(now.getTime() / DAY_MS);
	if (day === null) errors.on = 'Give the day as YYYY-MM-DD.';
	else if (day < today - 1) errors.on = 'Choose a day that has not passed.';
	else if (day > today + PICKUP_MAX_DAYS_AHEAD) errors.on = `Choose a day within ${PICKUP_MAX_DAYS_AHEAD} days.`;
	const from = minutes(p.from);
	const to = minutes(p.to);
	if (from === null) errors.from = 'Give a time such as 10:30.';
	if (to === null) errors.to = 'Give a time such as 11:00.';
	else if (from !== null && to <= from) errors.to = 'The window ends after it starts.';
	const place = p.place.trim();
	if (place.length < 3) errors.place = 'Say where to meet, e.g. the library entrance.';
	else if (place.length > PICKUP_PLACE_MAX) errors.place = `Keep the meeting point to ${PICKUP_PLACE_MAX} characters.`;
	return errors;
}

const dayFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** "Sat 14 Mar 2026, 10:00–11:00, at the library entrance". */
export function describePickup(p: PickupProposal, timeZone?: string): string {
	const day = dayNumber(p.on);
	const when = day === null ? p.on : dayFormat.format(new Date(day * DAY_MS)).replace(',', '');
	// The zone as on that day (noon UTC), so a pickup after a change of clocks names the right one.
	const zone = timeZone && day !== null ? ` local time (${zoneName(new Date(day * DAY_MS + DAY_MS / 2), timeZone)})` : '';
	return `${when}, ${p.from}–${p.to}${zone}, at ${p.place.trim()}`;
}
