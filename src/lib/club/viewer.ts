import type { Role, UnitSystem } from './roles';

/**
 * What the rest of the app knows about the signed-in person (`event.locals.user`). A view type:
 * every domain's functions take it, and none needs the club's tables to read it.
 */
export interface Viewer {
	id: string;
	email: string;
	displayName: string | null;
	role: Role;
	units: UnitSystem;
	/**
	 * The IANA time zone the member chose, or their browser's as it first reported it; null (or
	 * absent) until either is known, and times are then shown in UTC. See `zoneOf`.
	 */
	timeZone?: string | null;
}

/** The zone to show a viewer's times and "today" in: theirs when known, UTC otherwise (and for visitors). */
export const zoneOf = (viewer: Pick<Viewer, 'timeZone'> | null | undefined): string => viewer?.timeZone ?? 'UTC';
