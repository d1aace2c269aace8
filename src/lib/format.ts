// Dates and numbers as the club reads them. A moment (a message sent, a pickup, a deadline's
// instant) is shown in the viewer's time zone, named after the time ("14:05 GMT+13"); the server
// and the browser render with the same zone (the member's, from the layout's data; UTC for
// visitors), so hydration never disagrees. A day (a contest closes on, a tank set up on, as
// YYYY-MM-DD) stays that day in every zone.

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const formats = new Map<string, Intl.DateTimeFormat>();

function formatFor(kind: 'date' | 'dateTime' | 'zone', timeZone: string): Intl.DateTimeFormat {
	const key = `${kind} ${timeZone}`;
	let f = formats.get(key);
	if (!f) {
		const options: Intl.DateTimeFormatOptions =
			kind === 'date'
				? { day: 'numeric', month: 'short', year: 'numeric' }
				: kind === 'dateTime'
					? { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }
					: { timeZoneName: 'short' };
		f = new Intl.DateTimeFormat('en-GB', { ...options, timeZone });
		formats.set(key, f);
	}
	return f;
}

/** The zone's short name at a moment, as the club reads it: "UTC", "GMT", "BST", "GMT+13", "GMT-5". */
export function zoneName(at: Date | string, timeZone = 'UTC'): string {
	return (
		formatFor('zone', timeZone)
			.formatToParts(new Date(at))
			.find((p) => p.type === 'timeZoneName')?.value ?? timeZone
	);
}

/** "3 Dec 2026": a day as given, or the day a moment falls on in `timeZone`. */
export function formatDate(d: Date | string | null | undefined, timeZone = 'UTC'): string {
	if (!d) return '—';
	if (typeof d === 'string' && DAY.test(d)) return formatFor('date', 'UTC').format(new Date(`${d}T00:00:00Z`));
	return formatFor('date', timeZone).format(new Date(d));
}

/** "3 Dec 2026, 14:05 GMT+13": a moment in `timeZone`, the zone named. */
export function formatDateTime(d: Date | string | null | undefined, timeZone = 'UTC'): string {
	if (!d) return '—';
	const at = new Date(d);
	return `${formatFor('dateTime', timeZone).format(at)} ${zoneName(at, timeZone)}`;
}

/** "1 unread message", "3 unread messages": a count with its noun in the right number (`many` when not the noun + s). */
export function counted(n: number, one: string, many = `${one}s`): string {
	return `${n.toLocaleString('en-GB')} ${n === 1 ? one : many}`;
}

/** "3 days ago", "in 2 hours": coarse, for lists. */
export function relativeTime(d: Date | string, now: Date = new Date()): string {
	const seconds = Math.round((new Date(d).getTime() - now.getTime()) / 1000);
	const units: [Intl.RelativeTimeFormatUnit, number][] = [
		['year', 31_536_000],
		['month', 2_592_000],
		['week', 604_800],
		['day', 86_400],
		['hour', 3_600],
		['minute', 60]
	];
	const rtf = new Intl.RelativeTimeFormat('en', { numeric: 'auto' });
	for (const [unit, size] of units) {
		if (Math.abs(seconds) >= size) return rtf.format(Math.round(seconds / size), unit);
	}
	return 'just now';
}

/** A short description of a browser from its user-agent string, for the sessions list. */
export function describeUserAgent(ua: string | null): string {
	if (!ua) return 'Unknown device';
	const browser = /Firefox\//.test(ua)
		? 'Firefox'
		: /Edg\//.test(ua)
			? 'Edge'
			: /Chrome\/|Chromium\//.test(ua)
				? 'Chrome or Chromium'
				: /Safari\//.test(ua)
					? 'Safari'
					: 'A browser';
	const system = /Android/.test(ua)
		? 'Android'
		: /iPhone|iPad/.test(ua)
			? 'iOS'
			: /Windows/.test(ua)
				? 'Windows'
				: /Mac OS X/.test(ua)
					? 'macOS'
					: /Linux/.test(ua)
						? 'Linux'
						: 'an unknown system';
	return `${browser} on ${system}`;
}

/** "m…a@kettlewater.test": enough for someone to recognise their own address, not to harvest it. */
export function maskEmail(email: string): string {
	const [local = '', domain = ''] = email.split('@');
	if (local.length <= 2) return `${local[0] ?? ''}…@${domain}`;
	return `${local[0]}…${local.at(-1)}@${domain}`;
}
