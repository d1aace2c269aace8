// Tank age. Several suggestions (photoperiod, ammonia watch, first fish) depend on how long a tank
// has run; ages count whole UTC calendar days so a page shows the same age on server and client.

import { dayOf } from '../../dates';
import { CalcInputError } from './validate';

const DAY_MS = 86_400_000;

/** A calendar day as 'YYYY-MM-DD' or a Date (its UTC day is used). */
export type DayInput = Date | string;

const ISO_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Days since 1970-01-01 (UTC) of a calendar day; rejects malformed and impossible dates. */
export function dayNumber(day: DayInput, field = 'date'): number {
	if (day instanceof Date) {
		const ms = day.getTime();
		if (!Number.isFinite(ms)) throw new CalcInputError(field, `${field} is not a valid date`);
		return Math.floor(ms / DAY_MS);
	}
	const match = ISO_DAY.exec(day);
	if (!match) throw new CalcInputError(field, `${field} must be written YYYY-MM-DD (got "${day}")`);
	const [year, month, date] = [Number(match[1]), Number(match[2]), Number(match[3])];
	const ms = Date.UTC(year, month - 1, date);
	const check = new Date(ms);
	if (check.getUTCFullYear() !== year || check.getUTCMonth() !== month - 1 || check.getUTCDate() !== date) {
		throw new CalcInputError(field, `${field} is not a calendar date (got "${day}")`);
	}
	return ms / DAY_MS;
}

/** The calendar day of a day number, as 'YYYY-MM-DD'. */
export function isoDay(dayNo: number): string {
	return dayOf(new Date(dayNo * DAY_MS));
}

/** Under six weeks a tank is "young" (common practice, no source). */
export const YOUNG_TANK_DAYS = 42;

export interface TankAge {
	days: number;
	/** Whole weeks and the days left over: 45 days = 6 weeks 3 days. */
	weeks: number;
	extraDays: number;
	young: boolean;
	/** "3 days", "1 week 2 days", "14 weeks". */
	label: string;
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** Age of a tank on `now` from its set-up day; a set-up day in the future is refused. */
export function tankAge(setUpOn: DayInput, now: Date): TankAge {
	const days = dayNumber(now, 'today') - dayNumber(setUpOn, 'set-up date');
	if (days < 0) throw new CalcInputError('set-up date', 'the set-up date is in the future');
	const weeks = Math.floor(days / 7);
	const extraDays = days % 7;
	const label = weeks === 0 ? plural(days, 'day') : extraDays === 0 ? plural(weeks, 'week') : `${plural(weeks, 'week')} ${plural(extraDays, 'day')}`;
	return { days, weeks, extraDays, young: days < YOUNG_TANK_DAYS, label };
}
