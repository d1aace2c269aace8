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
}
