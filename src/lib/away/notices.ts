// When away care's mails are due, decided on the clock of the person they go to: the sitter's
// reminder of a missed visit day, the keeper's daily digest of visits, and the summary when the
// keeper is back. Every visit day is a day of the period (from the first day away to the day
// before the keeper is back); the care plan asks for a look every day.
import { dayOf, hourOf } from '../dates';

/** From this hour in the sitter's zone, a visit day with nothing logged counts as missed (our choice). */
export const EVENING_HOUR = 18;
/** From this hour in the keeper's zone, the day's digest of visits goes out (our choice). */
export const DIGEST_HOUR = 20;

export interface PeriodDays {
	/** The first day away (YYYY-MM-DD). */
	startsOn: string;
	/** The day the keeper is back; no visit is due on it. */
	endsOn: string;
}

/** Whether `day` is a day someone should look in. */
export const isVisitDay = (period: PeriodDays, day: string) => day >= period.startsOn && day < period.endsOn;

/**
 * The visit day to remind a sitter of at `now`, or null: it is evening on a visit day in the
 * sitter's zone, nothing was logged that day, and the sitter had said yes before that evening.
 */
export function missedVisitDay(period: PeriodDays, input: { now: Date; zone: string; acceptedAt: Date; loggedDays: ReadonlySet<string> }): string | null {
	const day = dayOf(input.now, input.zone);
	if (!isVisitDay(period, day) || hourOf(input.now, input.zone) < EVENING_HOUR) return null;
	if (input.loggedDays.has(day)) return null;
	const acceptedOn = dayOf(input.acceptedAt, input.zone);
	if (acceptedOn > day || (acceptedOn === day && hourOf(input.acceptedAt, input.zone) >= EVENING_HOUR)) return null;
	return day;
}

/** The keeper's day whose digest is due at `now`, or null (before the hour, or already sent that day). */
export function digestDay(input: { now: Date; zone: string; sentOn: string | null }): string | null {
	const day = dayOf(input.now, input.zone);
	if (hourOf(input.now, input.zone) < DIGEST_HOUR || input.sentOn === day) return null;
	return day;
}

/** Whether the period is over for the keeper at `now`: their own day has reached the day they are back. */
export const periodOver = (period: PeriodDays, now: Date, zone: string) => dayOf(now, zone) >= period.endsOn;
