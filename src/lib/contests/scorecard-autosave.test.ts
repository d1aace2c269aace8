import { beforeEach, describe, expect, test } from 'vitest';
import { CardAutosave, refusalOf, retryDelayMs, type SaveState, type SendResult, type ServerCard } from './scorecard-autosave';
import type { CardFields, CardSave } from './card';

// A fake clock, storage and server, so every path of the autosave can be driven step by step.
class Clock {
	now = 0;
	timers: { at: number; run: () => void; id: number }[] = [];
	#next = 1;
	set = (run: () => void, ms: number) => {
		const id = this.#next++;
		this.timers.push({ at: this.now + ms, run, id });
		return id;
	};
	clear = (id: unknown) => {
		this.timers = this.timers.filter((t) => t.id !== id);
	};
	async advance(ms: number) {
		const until = this.now + ms;
		await settle();
		for (;;) {
			this.timers.sort((a, b) => a.at - b.at);
			const due = this.timers[0];
			if (!due || due.at > until) break;
			this.timers.shift();
			this.now = due.at;
			due.run();
			await settle();
		}
		this.now = until;
		await settle();
	}
}
const settle = async () => {
	for (let i = 0; i < 10; i++) await Promise.resolve();
};

class Memory {
	map = new Map<string, string>();
	getItem = (k: string) => this.map.get(k) ?? null;
	setItem = (k: string, v: string) => void this.map.set(k, v);
	removeItem = (k: string) => void this.map.delete(k);
}

/** A server that applies saves with the same version rule as the real endpoint. */
class FakeServer {
	card: ServerCard = { version: 0, fields: blank(), lastSaveId: null, updatedAt: null };
	requests: CardSave[] = [];
	/** Next answers to give instead of handling: 'network', a status, or 'apply-then-drop' (save lands, answer lost). */
	script: ('network' | 'apply-then-drop' | 500)[] = [];
	send = async (body: CardSave): Promise<SendResult> => {
		this.requests.push(structuredClone(body));
		const step = this.script.shift();
		if (step === 'network') return { kind: 'network' };
		if (step === 500) return { kind: 'refused', status: 500, code: 'server', message: 'Server error' };
		if (this.card.lastSaveId === body.saveId) return { kind: 'saved', version: this.card.version, updatedAt: 't' + this.card.version };
		if (body.baseVersion !== this.card.version) {
			return { kind: 'refused', status: 409, code: 'version-conflict', message: 'Newer version', current: structuredClone(this.card) };
		}
		this.card = { version: this.card.version + 1, fields: structuredClone(body.fields), lastSaveId: body.saveId, updatedAt: 't' + (this.card.version + 1) };
		if (step === 'apply-then-drop') return { kind: 'network' };
		return { kind: 'saved', version: this.card.version, updatedAt: this.card.updatedAt! };
	};
}

function blank(): CardFields {
	return { scores: { a: null, b: null }, comments: { a: '', b: '' }, entrantComment: '', panelNote: '' };
}
const withScore = (a: number | null, extra: Partial<CardFields> = {}): CardFields => ({ ...blank(), scores: { a, b: null }, ...extra });

let clock: Clock;
let storage: Memory;
let server: FakeServer;
let states: SaveState['kind'][];
let online: boolean;
let ids: number;

function make(initial: ServerCard = server.card) {
	return new CardAutosave(
		{
			send: server.send,
			storage,
			storageKey: 'card',
			setTimer: clock.set,
			clearTimer: clock.clear,
			newId: () => `save-${String(++ids).padStart(4, '0')}`,
			isOnline: () => online,
			onState: (s) => states.push(s.kind),
			debounceMs: 800
		},
		structuredClone(initial)
	);
}

beforeEach(() => {
	clock = new Clock();
	storage = new Memory();
	server = new FakeServer();
	states = [];
	online = true;
	ids = 0;
});

describe('debounced saving', () => {
	test('typing is saved once after a pause, and the kept copy is dropped when saved', async () => {
		const a = make();
		a.edit(withScore(1));
		await clock.advance(300);
		a.edit(withScore(7));
		expect(storage.map.has('card')).toBe(true);
		await clock.advance(799);
		expect(server.requests).toHaveLength(0);
		await clock.advance(1);
		expect(server.requests).toHaveLength(1);
		expect(server.requests[0]!.fields.scores.a).toBe(7);
		expect(a.state).toEqual({ kind: 'saved', at: 't1' });
		expect(storage.map.has('card')).toBe(false);
		expect(server.card.version).toBe(1);
	});
	test('edits made while a save is out go in the next save, based on the new version', async () => {
		const releases: (() => void)[] = [];
		const started: number[] = [];
		const direct = server.send;
		server.send = async (body) => {
			started.push(body.fields.scores.a!);
			await new Promise<void>((r) => releases.push(r));
			return direct(body);
		};
		const a = make();
		a.edit(withScore(5));
		await clock.advance(800);
		expect(a.state.kind).toBe('saving');
		a.edit(withScore(6));
		await clock.advance(800); // the pause is over while the first save is still out
		expect(started).toEqual([5]); // one request at a time
		releases.shift()!();
		await clock.advance(0);
		expect(started).toEqual([5, 6]);
		releases.shift()!();
		await clock.advance(0);
		expect(server.requests.map((r) => [r.baseVersion, r.fields.scores.a])).toEqual([
			[0, 5],
			[1, 6]
		]);
		expect(server.card.fields.scores.a).toBe(6);
		expect(a.state.kind).toBe('saved');
	});
});

describe('flaky connections', () => {
	test('a failed save is retried with growing pauses; edits are kept locally meanwhile', async () => {
		expect([1, 2, 3, 4, 5, 6, 7].map(retryDelayMs)).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000]);
		server.script = ['network', 'network', 500];
		online = false;
		const a = make();
		a.edit(withScore(3));
		await clock.advance(800);
		expect(a.state).toMatchObject({ kind: 'retrying', attempt: 1, inMs: 1000, offline: true });
		a.edit(withScore(4)); // typing on while offline
		expect(JSON.parse(storage.map.get('card')!).fields.scores.a).toBe(4);
		await clock.advance(1000);
		expect(a.state).toMatchObject({ kind: 'retrying', attempt: 2, inMs: 2000 });
		await clock.advance(2000);
		expect(a.state).toMatchObject({ kind: 'retrying', attempt: 3, inMs: 4000 });
		online = true;
		a.online(); // back online: no need to wait out the 4 s
		await settle();
		expect(server.card.fields.scores.a).toBe(4);
		expect(a.state.kind).toBe('saved');
		expect(server.requests).toHaveLength(4);
	});
	test('a save that landed but whose answer was lost is recognised, not repeated or reported as a conflict', async () => {
		server.script = ['apply-then-drop'];
		const a = make();
		a.edit(withScore(8));
		await clock.advance(800);
		expect(a.state.kind).toBe('retrying');
		expect(server.card.version).toBe(1);
		await clock.advance(1000);
		// The retry carries the same save id: the server answers with the version it already made.
		expect(server.requests[1]!.saveId).toBe(server.requests[0]!.saveId);
		expect(server.card.version).toBe(1);
		expect(a.state.kind).toBe('saved');
		a.edit(withScore(9));
		await clock.advance(800);
		expect(server.requests[2]!.baseVersion).toBe(1);
		expect(server.card).toMatchObject({ version: 2, fields: { scores: { a: 9 } } });
	});
	test('a lost answer followed by more typing: the 409 names our own save id, so it is not a conflict', async () => {
		server.script = ['apply-then-drop'];
		const a = make();
		a.edit(withScore(2));
		await clock.advance(800);
		a.edit(withScore(3)); // different content: a new save id, still based on version 0
		await clock.advance(1000);
		await clock.advance(0);
		expect(a.state.kind).toBe('saved');
		expect(server.card).toMatchObject({ version: 2, fields: { scores: { a: 3 } } });
	});
});

describe('an older save never overwrites a newer one', () => {
	test('another window saved in between: the judge is asked, and "mine" saves over it on the new version', async () => {
		const a = make();
		// Another tab saves version 1 first.
		server.card = { version: 1, fields: withScore(2, { panelNote: 'from the other tab' }), lastSaveId: 'other-tab-1', updatedAt: 't1' };
		a.edit(withScore(6));
		await clock.advance(800);
		expect(a.state).toMatchObject({ kind: 'conflict', theirVersion: 1 });
		expect(server.card.fields.scores.a).toBe(2); // refused, not overwritten
		a.resolve('mine');
		await clock.advance(0);
		expect(server.card).toMatchObject({ version: 2, fields: { scores: { a: 6 } } });
		expect(a.state.kind).toBe('saved');
	});
	test('"theirs" takes the other version and forgets the local edits', async () => {
		const a = make();
		server.card = { version: 1, fields: withScore(2), lastSaveId: 'other', updatedAt: 't1' };
		a.edit(withScore(6));
		await clock.advance(800);
		const taken = a.resolve('theirs');
		expect(taken.scores.a).toBe(2);
		expect(storage.map.has('card')).toBe(false);
		expect(server.card.version).toBe(1);
	});
});

describe('coming back to the page', () => {
	test('edits kept from a visit whose save never went out are restored and saved', async () => {
		storage.setItem('card', JSON.stringify({ baseVersion: 0, fields: withScore(5) }));
		const a = make();
		expect(a.restore()).toBe('restored');
		expect(a.fields.scores.a).toBe(5);
		await clock.advance(0);
		expect(server.card.fields.scores.a).toBe(5);
	});
	test('kept edits based on an older version than the server’s are a conflict, not a silent overwrite', async () => {
		server.card = { version: 3, fields: withScore(1), lastSaveId: 'x', updatedAt: 't3' };
		storage.setItem('card', JSON.stringify({ baseVersion: 2, fields: withScore(9) }));
		const a = make();
		expect(a.restore()).toBe('conflict');
		await clock.advance(5000);
		expect(server.requests).toHaveLength(0);
		expect(server.card.fields.scores.a).toBe(1);
	});
	test('kept edits equal to the server copy are simply dropped', () => {
		storage.setItem('card', JSON.stringify({ baseVersion: 0, fields: blank() }));
		expect(make().restore()).toBe('nothing');
		expect(storage.map.has('card')).toBe(false);
	});
});

describe('refusals that retrying cannot fix', () => {
	test('a submitted or locked card stops the autosave and keeps the edits locally', async () => {
		server.send = async () => ({ kind: 'refused', status: 409, code: 'submitted', message: 'This card is submitted.' });
		const a = make();
		a.edit(withScore(4));
		await clock.advance(800);
		expect(a.state).toEqual({ kind: 'stopped', code: 'submitted', message: 'This card is submitted.' });
		await clock.advance(60_000);
		expect(storage.map.has('card')).toBe(true);
	});
	test('flush saves at once and says whether the server holds the latest edits', async () => {
		const a = make();
		a.edit(withScore(10));
		expect(await a.flush()).toBe(true);
		expect(server.card.fields.scores.a).toBe(10);
		server.script = ['network', 'network', 'network', 'network'];
		a.edit(withScore(1));
		expect(await a.flush()).toBe(false);
	});
});

test('a value the server refuses is not retried, but the next edit saves again', async () => {
	server.script = [];
	const real = server.send;
	let refuse = true;
	server.send = async (body) => (refuse ? { kind: 'refused', status: 400, code: 'invalid', message: 'Depth: 11 is above the maximum.' } : real(body));
	const a = make();
	a.edit(withScore(11));
	await clock.advance(800);
	expect(a.state.kind).toBe('stopped');
	await clock.advance(10_000);
	expect(server.card.version).toBe(0);
	refuse = false;
	a.edit(withScore(9));
	await clock.advance(800);
	expect(a.state.kind).toBe('saved');
	expect(server.card.fields.scores.a).toBe(9);
});

describe('reading a refusal from the card endpoints', () => {
	const card: ServerCard = { version: 3, fields: blank(), lastSaveId: 'x', updatedAt: '2026-03-01T10:00:00.000Z' };
	test('a version conflict keeps the stored card the endpoint sent beside code, message and fields', () => {
		expect(refusalOf(409, { code: 'version-conflict', message: 'Saved elsewhere.', fields: {}, current: card })).toEqual({
			kind: 'refused',
			status: 409,
			code: 'version-conflict',
			message: 'Saved elsewhere.',
			current: card
		});
	});
	test('a field refusal is one the next edit may fix', () => {
		expect(refusalOf(400, { code: 'invalid', message: 'Depth: 11 is above the maximum.', fields: { scores: 'Depth: 11 is above the maximum.' } })).toEqual({
			kind: 'refused',
			status: 400,
			code: 'invalid',
			message: 'Depth: 11 is above the maximum.'
		});
	});
	test('an answer that is not a refusal body (a proxy’s error page) still stops with a message', () => {
		expect(refusalOf(502, null)).toEqual({ kind: 'refused', status: 502, code: 'error', message: 'The save was refused (502).' });
	});
});
