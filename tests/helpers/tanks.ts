import type { TankInput } from '../../src/lib/journals/tank-input';
import type { WaterTestInput } from '../../src/lib/journals/water-tests';

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
		parAtSubstrate: null,
		parDepthCm: null,
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

/** A water test with no readings yet; spread it and set the ones a test needs. */
export const emptyTest: WaterTestInput = {
	testedOn: '2026-02-01',
	ph: null,
	kh: null,
	gh: null,
	no3: null,
	po4: null,
	k: null,
	fe: null,
	ammonia: null,
	ammoniaBasis: 'NH3',
	no2: null,
	temperatureC: null,
	tds: null,
	note: ''
};
