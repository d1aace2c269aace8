import { describe, expect, test } from 'vitest';
import { emptyEntryDraft, emptyEvent, entryDraftFrom, eventDraftFrom, parseEntryDraft, type EventDraft } from './journal-entry-form';

const today = '2026-03-20';
const ev = (kind: string, over: Partial<EventDraft> = {}): EventDraft => ({ ...emptyEvent(kind), ...over });

describe('entryDraftFrom', () => {
	test('reads the text and the event rows in index order, skipping rows without a kind', () => {
		const form = new FormData();
		form.set('entryOn', '2026-03-19');
		form.set('title', ' Week three ');
		form.set('body', 'Trimmed.');
		form.set('events[2][kind]', 'trim');
		form.set('events[0][kind]', 'water-change');
		form.set('events[0][percent]', '40');
		form.set('events[1][kind]', '');
		const draft = entryDraftFrom(form);
		expect(draft.events.map((e) => e.kind)).toEqual(['water-change', 'trim']);
		expect(draft.events[0]!.percent).toBe('40');
		expect(draft.title).toBe(' Week three ');
	});
});

describe('parseEntryDraft', () => {
	test('a text with a water change and a filter clean', () => {
		const parsed = parseEntryDraft(
			{
				...emptyEntryDraft('2026-03-19'),
				title: ' Week three ',
				body: 'Trimmed.\r\nAll good.',
				events: [ev('water-change', { percent: '40' }), ev('filter-clean', { filterPart: 'prefilter', note: 'brown' })]
			},
			{ today }
		);
		expect(parsed.ok).toBe(true);
		if (!parsed.ok) return;
		expect(parsed.input).toMatchObject({ entryOn: '2026-03-19', title: 'Week three', body: 'Trimmed.\nAll good.' });
		expect(parsed.input.events.map((e) => [e.kind, e.percent, e.filterPart, e.note])).toEqual([
			['water-change', 40, null, ''],
			['filter-clean', null, 'prefilter', 'brown']
		]);
	});

	test('each kind asks for what it needs', () => {
		const parsed = parseEntryDraft(
			{
				...emptyEntryDraft(today),
				body: 'x',
				events: [
					ev('water-change', { percent: '140' }),
					ev('filter-clean'),
					ev('media-change'),
					ev('dose', { amount: '2' }),
					ev('plant-added'),
					ev('livestock-added', { speciesName: 'Shrimp', count: '2.5' }),
					ev('plant-removed'),
					ev('algae', { algaeKind: 'purple' }),
					ev('note'),
					ev('upkeep')
				]
			},
			{ today }
		);
		expect(parsed.ok).toBe(false);
		if (parsed.ok) return;
		expect(parsed.errors).toEqual({
			'events.0.percent': 'Enter a number from 1 to 100.',
			'events.1.filterPart': 'Choose which part was cleaned.',
			'events.2.what': 'This is needed.',
			'events.3.what': 'This is needed.',
			'events.3.amountUnit': 'Choose the unit of the amount.',
			'events.4.speciesName': 'This is needed.',
			'events.5.count': 'Enter a whole number.',
			'events.6.rowId': 'Choose which plant came out.',
			'events.7.algaeKind': 'Choose what it looks like.',
			'events.8.note': 'This is needed.',
			'events.9.kind': 'Choose what happened.'
		});
	});

	test('a dose of a known salt takes the salt’s name; list events keep species and row ids', () => {
		const parsed = parseEntryDraft(
			{
				...emptyEntryDraft(today),
				events: [
					ev('dose', { saltId: 'KNO3', amount: '1.5', amountUnit: 'g' }),
					ev('plant-added', { speciesId: '12', speciesName: 'Rotala rotundifolia' }),
					ev('livestock-removed', { rowId: '7', count: '3' })
				]
			},
			{ today }
		);
		expect(parsed.ok && parsed.input.events.map((e) => [e.what, e.saltId, e.amount, e.amountUnit, e.speciesId, e.rowId, e.count])).toEqual([
			['Potassium nitrate', 'KNO3', 1.5, 'g', null, null, null],
			['', null, null, null, 12, null, null],
			['', null, null, null, null, 7, 3]
		]);
	});

	test('the day: not in the future, not before set-up; something must be recorded', () => {
		expect(parseEntryDraft({ ...emptyEntryDraft('2026-03-21'), body: 'x' }, { today })).toEqual({
			ok: false,
			errors: { entryOn: 'That day has not come yet.' }
		});
		expect(parseEntryDraft({ ...emptyEntryDraft('2026-01-01'), body: 'x' }, { today, setUpOn: '2026-02-01' })).toEqual({
			ok: false,
			errors: { entryOn: 'That is before the tank was set up.' }
		});
		expect(parseEntryDraft({ ...emptyEntryDraft('yesterday'), body: 'x' }, { today })).toEqual({
			ok: false,
			errors: { entryOn: 'Give the day as YYYY-MM-DD.' }
		});
		expect(parseEntryDraft(emptyEntryDraft(today), { today })).toEqual({ ok: false, errors: { body: 'Write something, add a photo or record what you did.' } });
		expect(parseEntryDraft(emptyEntryDraft(today), { today, hasPhotos: true }).ok).toBe(true);
	});

	test('a saved plant or animal event is kept as it is; only its note is read', () => {
		const parsed = parseEntryDraft({ ...emptyEntryDraft(today), events: [ev('plant-removed', { id: '31', note: 'melted' })] }, { today });
		expect(parsed.ok && parsed.input.events[0]).toMatchObject({ id: 31, kind: 'plant-removed', rowId: null, note: 'melted' });
	});

	test('a stored event comes back as the same form row', () => {
		const draft = eventDraftFrom({
			id: 4,
			kind: 'livestock-removed',
			percent: null,
			filterPart: null,
			what: '',
			amount: null,
			amountUnit: null,
			saltId: null,
			speciesId: 3,
			speciesName: 'Neocaridina davidi',
			count: 2,
			algaeKind: null,
			note: 'moved',
			tankPlantId: null,
			tankLivestockId: 9
		});
		expect(draft).toMatchObject({ id: '4', kind: 'livestock-removed', count: '2', rowId: '9', note: 'moved', percent: '' });
	});
});
