import { forbidden } from '../errors';

export const ROLES = ['member', 'judge', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
	member: 'Member',
	judge: 'Judge',
	admin: 'Admin'
};

const ROLE_PLURALS: Record<Role, string> = { member: 'members', judge: 'judges', admin: 'admins' };

/** Whether someone (signed in) holds one of `roles`. */
export const hasRole = (viewer: { role: Role } | null | undefined, ...roles: Role[]): boolean => !!viewer && roles.includes(viewer.role);

/** The sentence for someone whose role does not open this part of Riparia. */
export const onlyFor = (roles: readonly Role[]) => `This part of Riparia is for ${roles.map((r) => ROLE_PLURALS[r]).join(' and ')} only.`;

/**
 * Refuses with a 403 DomainError unless `viewer` holds one of `roles`. Every domain command that
 * needs a role starts with this, whatever its route already checked.
 */
export function assertRole(viewer: { role: Role }, ...roles: Role[]): void {
	if (!hasRole(viewer, ...roles)) throw forbidden(onlyFor(roles));
}

export const UNIT_SYSTEMS = ['metric', 'us', 'imperial'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = {
	metric: 'Metric (cm, mm of glass, litres, kg, °C, km)',
	us: 'US (inches, US gallons, lb, °F, miles)',
	imperial: 'Imperial (inches, imperial gallons, lb, °C, miles)'
};

/** Display name rules shared by the form and the server. */
export const DISPLAY_NAME_MIN = 2;
export const DISPLAY_NAME_MAX = 60;
