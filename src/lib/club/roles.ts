export const ROLES = ['member', 'judge', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
	member: 'Member',
	judge: 'Judge',
	admin: 'Admin'
};

export const UNIT_SYSTEMS = ['metric', 'us', 'imperial'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = {
	metric: 'Metric (cm, litres, kg)',
	us: 'US (inches, US gallons, lb)',
	imperial: 'Imperial (inches, imperial gallons, lb)'
};

/** Display name rules shared by the form and the server. */
export const DISPLAY_NAME_MIN = 2;
export const DISPLAY_NAME_MAX = 60;
