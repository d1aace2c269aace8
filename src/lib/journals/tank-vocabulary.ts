// Words of the tank profile shared by the form, the page and the schema.

export const TANK_VISIBILITIES = ['public', 'club', 'private'] as const;
export type TankVisibility = (typeof TANK_VISIBILITIES)[number];
export const TANK_VISIBILITY_LABELS: Record<TankVisibility, string> = {
	public: 'Anyone, signed in or not',
	club: 'Club members only',
	private: 'Only me'
};
export const TANK_VISIBILITY_SHORT: Record<TankVisibility, string> = { public: 'Public', club: 'Club', private: 'Private' };

export const CO2_METHODS = ['none', 'liquid', 'pressurised'] as const;
export type Co2Method = (typeof CO2_METHODS)[number];
export const CO2_METHOD_LABELS: Record<Co2Method, string> = {
	none: 'None',
	liquid: 'Liquid carbon',
	pressurised: 'Pressurised CO2'
};

export const FLOW_UNITS = ['lph', 'usgph'] as const;
export type FlowUnit = (typeof FLOW_UNITS)[number];
export const FLOW_UNIT_LABELS: Record<FlowUnit, string> = { lph: 'L/h', usgph: 'US gal/h' };

/** Suggestions for the free-text style field; a keeper may type anything. */
export const STYLE_SUGGESTIONS = ['iwagumi', 'wood and stone', 'stem garden', 'jungle', 'biotope', 'nano'] as const;

/** The most photos a tank profile keeps (its cover). */
export const TANK_COVER_MAX = 1;
