import { describe, expect, test } from 'vitest';
import { evaporationPerDay } from './evaporation';

// Worked example by hand: top-ups of 1.0 L (1 June), 1.5 L (4 June), 2.0 L (8 June) and 1.1 L
// (11 June). The first replaced water lost before the log began; the other three, 4.6 L, replaced
// what evaporated in the 10 days from 1 to 11 June: 0.46 L a day.
describe('evaporation from logged top-ups', () => {
	const log = [
		{ on: '2026-06-08', litres: 2.0 },
		{ on: '2026-06-01', litres: 1.0 },
		{ on: '2026-06-11', litres: 1.1 },
		{ on: '2026-06-04', litres: 1.5 }
	];
	test('the worked example, in any order', () => {
		expect(evaporationPerDay(log, '2026-06-20')).toBeCloseTo(0.46, 10);
	});
	test('one top-up, or two on one day, say nothing', () => {
		expect(evaporationPerDay([{ on: '2026-06-01', litres: 1 }], '2026-06-20')).toBeNull();
		expect(
			evaporationPerDay(
				[
					{ on: '2026-06-01', litres: 1 },
					{ on: '2026-06-01', litres: 2 }
				],
				'2026-06-20'
			)
		).toBeNull();
	});
	test('old and future-dated top-ups and empty amounts are left out', () => {
		const withNoise = [...log, { on: '2026-01-01', litres: 30 }, { on: '2026-07-01', litres: 30 }, { on: '2026-06-05', litres: 0 }];
		expect(evaporationPerDay(withNoise, '2026-06-20')).toBeCloseTo(0.46, 10);
	});
});
