// The viewer's time zone for components: the root layout provides it (the member's own zone, UTC
// for visitors) and every component that shows a moment formats it through `useTimes()`, on the
// server and in the browser alike, so both render the same text.
import { getContext, setContext } from 'svelte';
import { formatDate, formatDateTime } from '$lib/format';

const KEY = Symbol('time-zone');

/** Called once by the root layout with a getter of the viewer's zone. */
export function provideTimeZone(zone: () => string): void {
	setContext(KEY, zone);
}

export interface Times {
	/** The IANA name of the zone times are shown in. */
	readonly zone: string;
	/** "3 Dec 2026": a day as given, or the day a moment falls on in the viewer's zone. */
	date(d: Date | string | null | undefined): string;
	/** "3 Dec 2026, 14:05 GMT+13": a moment in the viewer's zone, the zone named. */
	dateTime(d: Date | string | null | undefined): string;
}

/** The viewer's zone and formatters bound to it; call while a component initialises. */
export function useTimes(): Times {
	const zone = getContext<(() => string) | undefined>(KEY) ?? (() => 'UTC');
	return {
		get zone() {
			return zone();
		},
		date: (d) => formatDate(d, zone()),
		dateTime: (d) => formatDateTime(d, zone())
	};
}
