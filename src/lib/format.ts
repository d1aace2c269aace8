// Dates and numbers as the club reads them. Dates render in UTC on the server and the client
// alike so hydration never disagrees; times carry "UTC" where they matter.

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', {
	day: 'numeric',
	month: 'short',
	year: 'numeric',
	hour: '2-digit',
	minute: '2-digit',
	timeZone: 'UTC'
});

export const formatDate = (d: Date | string | null | undefined) => (d ? dateFormat.format(new Date(d)) : '—');
export const formatDateTime = (d: Date | string | null | undefined) => (d ? `${dateTimeFormat.format(new Date(d))} UTC` : '—');

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
