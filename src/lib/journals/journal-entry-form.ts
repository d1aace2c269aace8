// The journal entry form: a dated text with photos and a list of events. What was typed stays a
// draft of strings (kept on error); parseEntryDraft turns it into the validated EntryInput.
import { SALT_IDS, SALTS, dayNumber, type SaltId } from './calc';
import {
	ALGAE_KINDS,
	DOSE_UNITS,
	ENTRY_BODY_MAX,
	ENTRY_EVENTS_MAX,
	FILTER_PARTS,
	FORM_EVENT_KINDS,
	isListEvent,
	type AlgaeKind,
	type DoseUnit,
	type EventKind,
	type FilterPart
} from './journal-vocabulary';

export const EVENT_FIELDS = [
	'id',
	'kind',
	'percent',
	'filterPart',
	'what',
	'amount',
	'amountUnit',
	'saltId',
	'speciesId',
	'speciesName',
	'count',
	'algaeKind',
	'note',
	'rowId'
] as const;
export type EventField = (typeof EVENT_FIELDS)[number];
export type EventDraft = Record<EventField, string>;

export interface EntryDraft {
	entryOn: string;
	title: string;
	body: string;
	events: EventDraft[];
}

export const eventFieldName = (index: number, field: EventField) => `events[${index}][${field}]`;

export function emptyEvent(kind: string = 'water-change'): EventDraft {
	const row = Object.fromEntries(EVENT_FIELDS.map((f) => [f, ''])) as EventDraft;
	row.kind = kind;
	if (kind === 'livestock-added') row.count = '1';
	return row;
}

export const emptyEntryDraft = (today: string): EntryDraft => ({ entryOn: today, title: '', body: '', events: [] });

export function entryDraftFrom(form: FormData): EntryDraft {
	const text = (key: string) => String(form.get(key) ?? '');
	const indexes = new Set<number>();
	for (const key of form.keys()) {
		const match = /^events\[(\d{1,3})\]\[/.exec(key);
		if (match) indexes.add(Number(match[1]));
	}
	const events = [...indexes]
		.sort((a, b) => a - b)
		.map((i) => Object.fromEntries(EVENT_FIELDS.map((f) => [f, text(eventFieldName(i, f)).trim()])) as EventDraft)
		.filter((e) => e.kind !== '');
	return { entryOn: text('entryOn').trim(), title: text('title'), body: text('body'), events };
}

/** One event as the domain takes it. List events name the species (added) or the list row (taken out). */
export interface EventInput {
	/** An event of this entry being kept or edited. */
	id?: number;
	kind: EventKind;
	percent: number | null;
	filterPart: FilterPart | null;
	what: string;
	amount: number | null;
	amountUnit: DoseUnit | null;
	saltId: SaltId | null;
	speciesId: number | null;
	speciesName: string;
	count: number | null;
	algaeKind: AlgaeKind | null;
	note: string;
	/** plant-removed / livestock-removed: the tank_plant or tank_livestock row. */
	rowId: number | null;
}

export interface EntryInput {
	entryOn: string;
	title: string;
	body: string;
	events: EventInput[];
}

export type EntryParse = { ok: true; input: EntryInput } | { ok: false; errors: Record<string, string> };

const positiveId = (value: string) => (/^[1-9]\d{0,14}$/.test(value) ? Number(value) : null);

/**
 * Validates the draft. `hasPhotos` lets an entry that is only photos through; `setUpOn` keeps the
 * day from going before the tank existed.
 */
export function parseEntryDraft(draft: EntryDraft, options: { today: string; setUpOn?: string | null; hasPhotos?: boolean }): EntryParse {
	const errors: Record<string, string> = {};
	const fail = (key: string, message: string) => {
		errors[key] ??= message;
		return null;
	};
	let entryOn = draft.entryOn;
	try {
		if (dayNumber(entryOn) > dayNumber(options.today)) fail('entryOn', 'That day has not come yet.');
		else if (options.setUpOn && entryOn < options.setUpOn) fail('entryOn', 'That is before the tank was set up.');
	} catch {
		fail('entryOn', 'Give the day as YYYY-MM-DD.');
		entryOn = '';
	}
	const title = draft.title.trim();
	if (title.length > 120) fail('title', 'Keep the title to 120 characters.');
	const body = draft.body.replace(/\r\n/g, '\n').trim();
	if (body.length > ENTRY_BODY_MAX) fail('body', `Keep the text to ${ENTRY_BODY_MAX.toLocaleString('en-GB')} characters.`);
	if (draft.events.length > ENTRY_EVENTS_MAX) fail('events', `Record at most ${ENTRY_EVENTS_MAX} events in one entry.`);

	const events = draft.events.map((e, i): EventInput => {
		const key = (field: string) => `events.${i}.${field}`;
		const kind = (FORM_EVENT_KINDS as readonly string[]).includes(e.kind)
			? (e.kind as EventKind)
			: (fail(key('kind'), 'Choose what happened.'), 'note' as const);
		const number = (field: EventField, min: number, max: number, required: boolean, whole = false): number | null => {
			const raw = e[field].replace(',', '.');
			if (!raw) return required ? fail(key(field), 'This is needed.') : null;
			const n = Number(raw);
			if (!Number.isFinite(n) || (whole && !Number.isInteger(n))) return fail(key(field), whole ? 'Enter a whole number.' : 'Enter a number.');
			if (n < min || n > max) return fail(key(field), `Enter a number from ${min} to ${max}.`);
			return n;
		};
		const words = (field: EventField, max: number, required: boolean) => {
			const v = e[field].trim();
			if (required && !v) fail(key(field), 'This is needed.');
			if (v.length > max) fail(key(field), `Keep it to ${max} characters.`);
			return v;
		};
		const choice = <T extends string>(field: EventField, allowed: readonly T[], required: boolean, message: string): T | null => {
			const v = e[field];
			if (!v) return required ? fail(key(field), message) : null;
			return (allowed as readonly string[]).includes(v) ? (v as T) : fail(key(field), message);
		};
		const input: EventInput = {
			id: positiveId(e.id) ?? undefined,
			kind,
			percent: null,
			filterPart: null,
			what: '',
			amount: null,
			amountUnit: null,
			saltId: null,
			speciesId: null,
			speciesName: '',
			count: null,
			algaeKind: null,
			note: words('note', 1000, e.kind === 'note'),
			rowId: null
		};
		// A saved list event keeps what it did; only its note can change.
		if (input.id !== undefined && isListEvent(kind)) return input;
		switch (kind) {
			case 'water-change':
				input.percent = number('percent', 1, 100, true);
				break;
			case 'top-up':
				// Litres of water added to make up for evaporation (the away care plan reads the rate from these).
				input.amount = number('amount', 0.05, 2000, true);
				break;
			case 'trim':
				input.what = words('what', 160, false);
				break;
			case 'filter-clean':
				input.filterPart = choice('filterPart', FILTER_PARTS, true, 'Choose which part was cleaned.');
				break;
			case 'media-change':
				input.what = words('what', 160, true);
				break;
			case 'dose': {
				input.saltId = choice('saltId', SALT_IDS, false, 'Choose a salt from the list, or none.');
				input.what = words('what', 160, !input.saltId) || (input.saltId ? SALTS[input.saltId].name : '');
				input.amount = number('amount', 0.001, 100_000, false);
				input.amountUnit = choice('amountUnit', DOSE_UNITS, input.amount !== null, 'Choose the unit of the amount.');
				break;
			}
			case 'plant-added':
			case 'livestock-added':
				input.speciesId = positiveId(e.speciesId);
				input.speciesName = words('speciesName', 160, true);
				input.count = kind === 'livestock-added' ? number('count', 1, 10_000, true, true) : null;
				break;
			case 'plant-removed':
			case 'livestock-removed':
				input.rowId = positiveId(e.rowId) ?? fail(key('rowId'), kind === 'plant-removed' ? 'Choose which plant came out.' : 'Choose which animals.');
				input.count = kind === 'livestock-removed' ? number('count', 1, 10_000, false, true) : null;
				break;
			case 'algae':
				input.algaeKind = choice('algaeKind', ALGAE_KINDS, true, 'Choose what it looks like.');
				break;
		}
		return input;
	});

	if (!Object.keys(errors).length && !body && events.length === 0 && !options.hasPhotos) {
		fail('body', 'Write something, add a photo or record what you did.');
	}
	if (Object.keys(errors).length) return { ok: false, errors };
	return { ok: true, input: { entryOn, title, body, events } };
}

/** A stored event as a form row, for the edit form. */
export function eventDraftFrom(e: {
	id: number;
	kind: string;
	percent: number | null;
	filterPart: string | null;
	what: string;
	amount: number | null;
	amountUnit: string | null;
	saltId: string | null;
	speciesId: number | null;
	speciesName: string;
	count: number | null;
	algaeKind: string | null;
	note: string;
	tankPlantId: number | null;
	tankLivestockId: number | null;
}): EventDraft {
	const s = (v: number | string | null) => (v === null ? '' : String(v));
	return {
		id: String(e.id),
		kind: e.kind,
		percent: s(e.percent),
		filterPart: s(e.filterPart),
		what: e.what,
		amount: s(e.amount),
		amountUnit: s(e.amountUnit),
		saltId: s(e.saltId),
		speciesId: s(e.speciesId),
		speciesName: e.speciesName,
		count: s(e.count),
		algaeKind: s(e.algaeKind),
		note: e.note,
		rowId: s(e.tankPlantId ?? e.tankLivestockId)
	};
}
