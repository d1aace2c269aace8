// The scorecard's autosave, without the browser: what to send when, what to do with each answer.
// The page (routes/judging/…/Scorecard.svelte) gives it a way to send (fetch), a timer, and
// localStorage; tests give it fakes.
//
// - Edits are saved after a pause in typing (debounced), one request at a time; edits made while
//   a request is out go in the next one.
// - Every edit is kept in localStorage until the server has confirmed it, so closing the tab, a
//   dead connection or a crash loses nothing; on the next visit the kept edits are restored.
// - Failed requests (no network, 5xx, 429) are retried with growing pauses (1 s doubling to 30 s),
//   at once when the browser says it is online again. A retry of the same content reuses its save
//   id, so a save that landed but whose answer was lost is recognised, not repeated.
// - Each save names the card version it was based on. The server refuses a save based on an older
//   version (another window or device saved in between); the judge then chooses which to keep,
//   so an older save never silently overwrites a newer one.

import { sameFields, type CardFields, type CardSave } from './card';

export interface ServerCard {
	version: number;
	fields: CardFields;
	lastSaveId: string | null;
	updatedAt: string | null;
}

/** A card as the card endpoints (/api/judging/<contest>/<number>/card, …/submit, …/reopen) answer it. */
export interface CardView extends ServerCard {
	status: 'draft' | 'submitted';
	submittedAt: string | null;
	/** A submitted card may be reopened now. */
	reopenable: boolean;
}

export type SendResult =
	| { kind: 'saved'; version: number; updatedAt: string | null }
	| { kind: 'network' }
	| { kind: 'refused'; status: number; code: string; message: string; current?: ServerCard };

export type SaveState =
	| { kind: 'saved'; at: string | null }
	| { kind: 'pending' }
	| { kind: 'saving' }
	| { kind: 'retrying'; attempt: number; inMs: number; offline: boolean }
	| { kind: 'conflict'; theirs: CardFields; theirVersion: number; theirUpdatedAt: string | null }
	| { kind: 'stopped'; code: string; message: string };

export interface StorageLike {
	getItem(key: string): string | null;
	setItem(key: string, value: string): void;
	removeItem(key: string): void;
}

export interface AutosaveDeps {
	send(body: CardSave): Promise<SendResult>;
	storage: StorageLike | null;
	storageKey: string;
	setTimer(run: () => void, ms: number): unknown;
	clearTimer(handle: unknown): void;
	newId(): string;
	isOnline(): boolean;
	onState(state: SaveState): void;
	debounceMs?: number;
}

export const DEBOUNCE_MS = 800;
/** Refusals the judge can fix by editing (a score out of range, a body the server could not read), so the next edit saves again. */
const RESUMABLE = new Set(['invalid']);
export const RETRY_BASE_MS = 1_000;
export const RETRY_MAX_MS = 30_000;

/** Pause before retry number `attempt` (1, 2, …): 1 s, 2 s, 4 s … at most 30 s. */
export const retryDelayMs = (attempt: number) => Math.min(RETRY_BASE_MS * 2 ** Math.max(0, attempt - 1), RETRY_MAX_MS);

/**
 * A card endpoint's refusal as the queue acts on it. Every JSON endpoint refuses with
 * { code, message, fields, ...details }; a version conflict carries the stored card as `current`.
 */
export function refusalOf(status: number, body: unknown): Extract<SendResult, { kind: 'refused' }> {
	const answer = (typeof body === 'object' && body !== null ? body : {}) as { code?: unknown; message?: unknown; current?: unknown };
	return {
		kind: 'refused',
		status,
		code: typeof answer.code === 'string' ? answer.code : 'error',
		message: typeof answer.message === 'string' ? answer.message : `The save was refused (${status}).`,
		...(typeof answer.current === 'object' && answer.current !== null ? { current: answer.current as ServerCard } : {})
	};
}

interface Kept {
	baseVersion: number;
	fields: CardFields;
}

export type RestoreOutcome = 'nothing' | 'restored' | 'conflict';

export class CardAutosave {
	#deps: AutosaveDeps;
	#version: number;
	/** What the server holds, as far as we know. */
	#confirmed: CardFields;
	/** What the judge sees. */
	#local: CardFields;
	#state: SaveState;
	#timer: unknown = null;
	#running: Promise<void> | null = null;
	#attempt = 0;
	#lastTry: { saveId: string; baseVersion: number; fields: CardFields } | null = null;
	#sentIds = new Set<string>();

	constructor(deps: AutosaveDeps, server: ServerCard) {
		this.#deps = deps;
		this.#version = server.version;
		this.#confirmed = server.fields;
		this.#local = server.fields;
		this.#state = { kind: 'saved', at: server.updatedAt };
	}

	get state(): SaveState {
		return this.#state;
	}
	get fields(): CardFields {
		return this.#local;
	}
	get version(): number {
		return this.#version;
	}
	get dirty(): boolean {
		return !sameFields(this.#local, this.#confirmed);
	}

	#set(state: SaveState) {
		this.#state = state;
		this.#deps.onState(state);
	}

	#keep() {
		const kept: Kept = { baseVersion: this.#version, fields: this.#local };
		try {
			this.#deps.storage?.setItem(this.#deps.storageKey, JSON.stringify(kept));
		} catch {
			// Storage full or disabled: the server copy is then the only one; saving still works.
		}
	}

	#forget() {
		try {
			this.#deps.storage?.removeItem(this.#deps.storageKey);
		} catch {
			// As above.
		}
	}

	/**
	 * Looks for edits kept from an earlier visit. Edits based on the version the server still
	 * holds are restored and saved; edits based on an older version are a conflict for the judge.
	 */
	restore(): RestoreOutcome {
		let kept: Kept | null = null;
		try {
			const raw = this.#deps.storage?.getItem(this.#deps.storageKey);
			kept = raw ? (JSON.parse(raw) as Kept) : null;
		} catch {
			kept = null;
		}
		if (!kept || typeof kept.baseVersion !== 'number' || !kept.fields?.scores) return 'nothing';
		if (sameFields(kept.fields, this.#confirmed)) {
			this.#forget();
			return 'nothing';
		}
		this.#local = kept.fields;
		if (kept.baseVersion === this.#version) {
			this.#schedule(0);
			return 'restored';
		}
		this.#set({ kind: 'conflict', theirs: this.#confirmed, theirVersion: this.#version, theirUpdatedAt: this.#state.kind === 'saved' ? this.#state.at : null });
		return 'conflict';
	}

	/** The judge changed something. */
	edit(fields: CardFields) {
		this.#local = fields;
		this.#keep();
		if (this.#state.kind === 'conflict') return;
		// A refused value (out of range) may be fixed by the next edit; other refusals stand.
		if (this.#state.kind === 'stopped' && !RESUMABLE.has(this.#state.code)) return;
		if (this.#state.kind === 'retrying') return; // the pending retry sends the latest edits
		if (!this.dirty && !this.#running) {
			this.#forget();
			this.#set({ kind: 'saved', at: null });
			return;
		}
		this.#schedule(this.#deps.debounceMs ?? DEBOUNCE_MS);
	}

	#schedule(ms: number) {
		if (this.#timer !== null) this.#deps.clearTimer(this.#timer);
		if (this.#state.kind !== 'retrying') this.#set({ kind: 'pending' });
		this.#timer = this.#deps.setTimer(() => {
			this.#timer = null;
			void this.#run();
		}, ms);
	}

	/** The browser is online again: retry now instead of waiting out the pause. */
	online() {
		if (this.#state.kind === 'retrying') {
			if (this.#timer !== null) this.#deps.clearTimer(this.#timer);
			this.#timer = null;
			void this.#run();
		}
	}

	/** Saves whatever is unsaved now; true when the server holds the judge's latest edits. */
	async flush(): Promise<boolean> {
		if (this.#timer !== null) {
			this.#deps.clearTimer(this.#timer);
			this.#timer = null;
		}
		for (let i = 0; i < 3; i++) {
			if (this.#running) await this.#running;
			if (!this.dirty) return true;
			if (this.#state.kind === 'conflict' || this.#state.kind === 'stopped') return false;
			await this.#run();
			if (this.#state.kind === 'retrying') {
				if (this.#timer !== null) this.#deps.clearTimer(this.#timer);
				this.#timer = null;
			}
		}
		return !this.dirty;
	}

	/** After a conflict: keep the judge's version (saved over the other) or take the other one. */
	resolve(choice: 'mine' | 'theirs'): CardFields {
		if (this.#state.kind !== 'conflict') return this.#local;
		const { theirs, theirVersion, theirUpdatedAt } = this.#state;
		this.#version = theirVersion;
		this.#confirmed = theirs;
		if (choice === 'theirs') {
			this.#local = theirs;
			this.#forget();
			this.#set({ kind: 'saved', at: theirUpdatedAt });
		} else {
			this.#keep();
			this.#set({ kind: 'pending' });
			this.#schedule(0);
		}
		return this.#local;
	}

	/** The card was submitted or reopened elsewhere on the page: take the server's word. */
	reset(server: ServerCard) {
		if (this.#timer !== null) this.#deps.clearTimer(this.#timer);
		this.#timer = null;
		this.#version = server.version;
		this.#confirmed = server.fields;
		this.#local = server.fields;
		this.#attempt = 0;
		this.#forget();
		this.#set({ kind: 'saved', at: server.updatedAt });
	}

	#run(): Promise<void> {
		// One request at a time; edits made meanwhile are sent when it is back (see #landed).
		if (this.#running) return this.#running;
		this.#running = this.#once().finally(() => {
			this.#running = null;
		});
		return this.#running;
	}

	async #once(): Promise<void> {
		if (this.#state.kind === 'conflict') return;
		if (this.#state.kind === 'stopped' && !RESUMABLE.has(this.#state.code)) return;
		const fields = this.#local;
		if (sameFields(fields, this.#confirmed)) {
			this.#attempt = 0;
			this.#forget();
			this.#set({ kind: 'saved', at: null });
			return;
		}
		const baseVersion = this.#version;
		const retry = this.#lastTry && this.#lastTry.baseVersion === baseVersion && sameFields(this.#lastTry.fields, fields);
		const saveId = retry ? this.#lastTry!.saveId : this.#deps.newId();
		this.#lastTry = { saveId, baseVersion, fields };
		this.#sentIds.add(saveId);
		if (this.#state.kind !== 'retrying') this.#set({ kind: 'saving' });

		const result = await this.#deps.send({ baseVersion, saveId, fields });

		if (result.kind === 'saved') return this.#landed(result.version, fields, result.updatedAt);
		if (result.kind === 'network' || result.status >= 500 || result.status === 429 || result.status === 408) {
			this.#attempt += 1;
			const inMs = retryDelayMs(this.#attempt);
			this.#set({ kind: 'retrying', attempt: this.#attempt, inMs, offline: !this.#deps.isOnline() });
			if (this.#timer !== null) this.#deps.clearTimer(this.#timer);
			this.#timer = this.#deps.setTimer(() => {
				this.#timer = null;
				void this.#run();
			}, inMs);
			return;
		}
		if (result.status === 409 && result.code === 'version-conflict' && result.current) {
			const current = result.current;
			if (current.lastSaveId && this.#sentIds.has(current.lastSaveId)) {
				// One of our own saves landed and only its answer was lost.
				return this.#landed(current.version, current.fields, current.updatedAt);
			}
			this.#attempt = 0;
			this.#set({ kind: 'conflict', theirs: current.fields, theirVersion: current.version, theirUpdatedAt: current.updatedAt });
			return;
		}
		this.#attempt = 0;
		this.#set({ kind: 'stopped', code: result.code, message: result.message });
	}

	#landed(version: number, fields: CardFields, updatedAt: string | null) {
		this.#attempt = 0;
		this.#version = version;
		this.#confirmed = fields;
		if (this.dirty) {
			this.#keep();
			this.#schedule(0);
		} else {
			this.#forget();
			this.#set({ kind: 'saved', at: updatedAt });
		}
	}
}
