// Calendar days. A day is a `YYYY-MM-DD` string in some time zone: the member's own where one
// is known, UTC otherwise. Every "today" in Riparia comes from here.

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
	let f = formatters.get(timeZone);
	if (!f) {
		// en-CA formats a date as YYYY-MM-DD.
		f = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
		formatters.set(timeZone, f);
	}
	return f;
}

/** The calendar day `at` falls on in `timeZone` (an IANA name such as 'Europe/Lisbon'), as YYYY-MM-DD. */
export function dayOf(at: Date, timeZone = 'UTC'): string {
	return formatterFor(timeZone).format(at);
}

/** Today, in `timeZone`. */
export const today = (timeZone = 'UTC', now: Date = new Date()) => dayOf(now, timeZone);

/** Whether a string names a real IANA time zone this runtime knows (the account's time zone setting). */
export function isTimeZone(name: string): boolean {
	try {
		new Intl.DateTimeFormat('en', { timeZone: name });
		return true;
	} catch {
		return false;
	}
}

const hourFormatters = new Map<string, Intl.DateTimeFormat>();

/** The hour of the day (0–23) `at` falls on in `timeZone`. */
export function hourOf(at: Date, timeZone = 'UTC'): number {
	let f = hourFormatters.get(timeZone);
	if (!f) {
		f = new Intl.DateTimeFormat('en-GB', { timeZone, hour: 'numeric', hourCycle: 'h23' });
		hourFormatters.set(timeZone, f);
	}
	return Number(f.format(at));
}
