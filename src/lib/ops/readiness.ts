// What /readyz decides, apart from how the facts are gathered: each check gives ok and a short
// reason that names no host, address or credential (the answer is public).

export interface CheckResult {
	ok: boolean;
	/** A short, public reason: never an error message with hosts or credentials in it. */
	detail?: string;
}

/** One entry of drizzle/meta/_journal.json. */
export interface JournalEntry {
	idx: number;
	tag: string;
	/** The migration's timestamp, which Drizzle records as `created_at` when it applies it. */
	when: number;
}

/**
 * Compares the migrations this build was made with against the newest one applied to the database
 * (`MAX(created_at)` of Drizzle's `__drizzle_migrations`). Drizzle's migrator applies every journal
 * entry newer than that, so those are the pending ones. A database ahead of the build (a newer
 * release migrated it during a rolling upgrade) is fine: migrations only add.
 */
export function migrationCheck(journal: JournalEntry[], latestAppliedAt: number | null): CheckResult {
	const pending = journal.filter((entry) => latestAppliedAt === null || entry.when > latestAppliedAt);
	if (pending.length > 0) {
		return { ok: false, detail: `${pending.length} migration${pending.length === 1 ? '' : 's'} not applied (first: ${pending[0]!.tag})` };
	}
	const newest = Math.max(0, ...journal.map((entry) => entry.when));
	if (latestAppliedAt !== null && latestAppliedAt > newest) return { ok: true, detail: 'database has newer migrations than this build' };
	return { ok: true, detail: `${journal.length} applied` };
}

export interface WorkerFacts {
	/** This process runs an outbox worker. */
	runsHere: boolean;
	/** When this process's worker started (only when runsHere). */
	startedAt: number | null;
	/** Last finished delivery round: this process's own when runsHere, else any instance's, from the database. */
	lastTickAt: number | null;
	now: number;
	staleAfterMs: number;
}

/** The outbox worker is ticking: a round finished within `staleAfterMs` (a worker just started gets that long for its first). */
export function workerCheck(facts: WorkerFacts): CheckResult {
	const where = facts.runsHere ? 'this instance' : 'any instance';
	if (facts.lastTickAt !== null && facts.now - facts.lastTickAt <= facts.staleAfterMs) {
		return { ok: true, detail: `${where}: last round ${Math.round((facts.now - facts.lastTickAt) / 1000)} s ago` };
	}
	if (facts.runsHere && facts.startedAt !== null && facts.lastTickAt === null && facts.now - facts.startedAt <= facts.staleAfterMs) {
		return { ok: true, detail: 'this instance: starting' };
	}
	const since = facts.lastTickAt === null ? 'no round recorded' : `last round ${Math.round((facts.now - facts.lastTickAt) / 1000)} s ago`;
	return { ok: false, detail: `${where}: ${since}` };
}

export interface Readiness {
	status: 'ready' | 'not-ready';
	checks: Record<string, CheckResult>;
}

export function summarise(checks: Record<string, CheckResult>): Readiness {
	return { status: Object.values(checks).every((c) => c.ok) ? 'ready' : 'not-ready', checks };
}
