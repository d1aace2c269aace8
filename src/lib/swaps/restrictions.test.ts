import { describe, expect, test } from 'vitest';
import { assess, checkedLabel, CHECK_BASIS_LABELS, jurisdictionsOf, refusalMessage, warningMessage, type Restriction } from './restrictions';

// Which entries apply is our rule (no source); the entries here are made up for the test.
const entry = (over: Partial<Restriction>): Restriction => ({
	id: 1,
	speciesId: 1,
	scientificName: 'Examplea invasiva',
	commonName: 'example weed',
	jurisdiction: 'Northland',
	level: 'banned',
	source: 'Northland weed order 2030',
	note: 'Do not pass it on.',
	checkedOn: '2031-01-05',
	checkBasis: 'source',
	...over
});

describe('restricted species', () => {
	test('only the club’s jurisdictions apply, split by level', () => {
		const list = [
			entry({ id: 1 }),
			entry({ id: 2, jurisdiction: 'Southland', level: 'cautioned' }),
			entry({ id: 3, jurisdiction: 'Southland' }),
			entry({ id: 4, level: 'cautioned' })
		];
		expect(assess(list, ['Northland'])).toEqual({ banned: [list[0]], cautioned: [list[3]] });
		expect(assess(list, ['Southland', 'Northland']).banned.map((e) => e.id)).toEqual([1, 3]);
		expect(assess(list, [])).toEqual({ banned: [], cautioned: [] });
	});
	test('messages name the species, the jurisdiction and the list', () => {
		expect(refusalMessage(entry({}))).toBe(
			'Examplea invasiva (example weed) cannot be offered or asked for on the board: it is banned in Northland (Northland weed order 2030). Do not pass it on.'
		);
		expect(warningMessage(entry({ commonName: '', note: '' }))).toBe('Examplea invasiva is restricted in Northland (Northland weed order 2030).');
	});
	test('members see when an entry was checked; the basis is for the admins’ list, in plain words', () => {
		expect(checkedLabel({ checkedOn: '2031-01-05' })).toBe('last checked 5 Jan 2031');
		expect(CHECK_BASIS_LABELS).toEqual({ source: 'against the published list', memory: 'not yet against the published list' });
		expect(Object.values(CHECK_BASIS_LABELS).join(' ')).not.toMatch(/memory/);
	});
	test('distinct jurisdictions, sorted', () => {
		expect(jurisdictionsOf([{ jurisdiction: 'Southland' }, { jurisdiction: 'Northland' }, { jurisdiction: 'Southland' }])).toEqual(['Northland', 'Southland']);
	});
});
