import type { TankInput } from '../../src/lib/journals/tank-input';

/** A small, valid tank profile in metric, for tests that need a tank to exist. */
export function tankInput(overrides: Partial<TankInput> = {}): TankInput {
	return {
		name: 'Test tank',
		style: 'wood and stone',
		setUpOn: '2026-01-15',
		lengthCm: 60,
		widthCm: 30,
		heightCm: 36,
		glassMm: 6,
		substrateKind: 'nutrient-soil',
		substrateNote: 'Fired clay granules',
		substrateDepthCm: 5,
		hardscape: 'Two stones',
		hardscapeLitres: 3,
		heaterWatts: 100,
		heaterSetC: 24,
		heaterNote: '',
		co2Method: 'none',
		co2BubblesPerSecond: null,
		waterLitres: null,
		description: '',
		visibility: 'club',
		lights: [{ label: 'LED bar', watts: 30, hoursPerDay: 7 }],
		filters: [{ label: 'Canister', ratedFlow: 600, flowUnit: 'lph', mediaNotes: '' }],
		fertilisers: [],
		plants: [],
		livestock: [],
		...overrides
	};
}
