// Can the results be published? Only when every judge has submitted a card for every entry they
// may judge. A judge may not judge their own entry or one they declared a conflict on; those cells
// are left out, and an entry that no judge may judge blocks publication until the panel changes.

export type CardState = 'empty' | 'draft' | 'submitted' | 'conflicted';

export interface JudgedEntry {
	entryId: string;
	/** The member who entered it: a judge who entered never judges their own entry. */
	entrantId: string;
}

export interface Conflict {
	entryId: string;
	judgeId: string;
}

/** One card that one judge owes for one entry. */
export interface JudgingDuty {
	entryId: string;
	judgeId: string;
}

export type ExclusionReason = 'self-entry' | 'conflict';

export interface JudgingDuties {
	/** Entry × judge cells that need a submitted card. */
	duties: JudgingDuty[];
	excluded: (JudgingDuty & { reason: ExclusionReason })[];
}

/** Every judge of the panel for every entry, minus self-entries and declared conflicts. */
export function judgingDuties(entries: readonly JudgedEntry[], judgeIds: readonly string[], conflicts: readonly Conflict[]): JudgingDuties {
	const conflicted = new Set(conflicts.map((c) => JSON.stringify([c.entryId, c.judgeId])));
	const duties: JudgingDuty[] = [];
	const excluded: JudgingDuties['excluded'] = [];
	for (const entry of entries) {
		for (const judgeId of new Set(judgeIds)) {
			const cell = { entryId: entry.entryId, judgeId };
			if (entry.entrantId === judgeId) excluded.push({ ...cell, reason: 'self-entry' });
			else if (conflicted.has(JSON.stringify([entry.entryId, judgeId]))) excluded.push({ ...cell, reason: 'conflict' });
			else duties.push(cell);
		}
	}
	return { duties, excluded };
}

export interface CardStatus {
	entryId: string;
	judgeId: string;
	state: CardState;
}

export interface ProgressCount {
	/** Cells that need a card (assigned and not marked conflicted on the card). */
	expected: number;
	submitted: number;
	draft: number;
	/** Assigned cells with no card yet, or an empty one. */
	empty: number;
	/** Assigned cells whose judge declared a conflict on the card itself. */
	conflicted: number;
}

export interface MissingCard {
	entryId: string;
	judgeId: string;
	state: 'empty' | 'draft';
}

export interface Readiness {
	/** Publication may go ahead: at least one entry, none unjudgeable, no card missing. */
	ready: boolean;
	overall: ProgressCount;
	byJudge: ({ judgeId: string } & ProgressCount)[];
	byEntry: ({ entryId: string } & ProgressCount)[];
	/** Non-conflicted cards not yet submitted, by entry then judge. */
	missing: MissingCard[];
	/** Entries with no judge left to score them: the panel must change before publishing. */
	unjudgeableEntryIds: string[];
	/** Cards for cells that are not a judging duty (e.g. a judge's own entry): ignored, and reported. */
	unexpectedCards: CardStatus[];
}

const zero = (): ProgressCount => ({ expected: 0, submitted: 0, draft: 0, empty: 0, conflicted: 0 });

/**
 * Progress of judging from the duties and the current card states. A card marked
 * 'conflicted' removes its cell from what is expected, like a conflict declared beforehand.
 * `entryIds` lists every entry of the contest, so an entry with no judging duty at all is caught.
 */
export function publicationReadiness(entryIds: readonly string[], duties: readonly JudgingDuty[], cards: readonly CardStatus[]): Readiness {
	const cell = (a: { entryId: string; judgeId: string }) => JSON.stringify([a.entryId, a.judgeId]);
	const stateOf = new Map(cards.map((c) => [cell(c), c.state]));
	const owed = new Set(duties.map(cell));
	const overall = zero();
	const byJudge = new Map<string, ProgressCount>();
	const byEntry = new Map<string, ProgressCount>(entryIds.map((id) => [id, zero()]));
	const missing: MissingCard[] = [];

	for (const a of [...new Map(duties.map((x) => [cell(x), x])).values()]) {
		const state = stateOf.get(cell(a)) ?? 'empty';
		if (!byJudge.has(a.judgeId)) byJudge.set(a.judgeId, zero());
		if (!byEntry.has(a.entryId)) byEntry.set(a.entryId, zero());
		for (const count of [overall, byJudge.get(a.judgeId)!, byEntry.get(a.entryId)!]) {
			count[state] += 1;
			if (state !== 'conflicted') count.expected += 1;
		}
		if (state === 'empty' || state === 'draft') missing.push({ entryId: a.entryId, judgeId: a.judgeId, state });
	}

	const sortBy = <T>(list: T[], ...keys: ((t: T) => string)[]) =>
		list.sort((x, y) => {
			for (const k of keys) if (k(x) !== k(y)) return k(x) < k(y) ? -1 : 1;
			return 0;
		});
	sortBy(
		missing,
		(m) => m.entryId,
		(m) => m.judgeId
	);
	const unjudgeableEntryIds = [...byEntry]
		.filter(([, c]) => c.expected === 0)
		.map(([id]) => id)
		.sort();
	const unexpectedCards = sortBy(
		cards.filter((c) => !owed.has(cell(c))),
		(c) => c.entryId,
		(c) => c.judgeId
	);
	return {
		ready: missing.length === 0 && unjudgeableEntryIds.length === 0 && byEntry.size > 0,
		overall,
		byJudge: sortBy(
			[...byJudge].map(([judgeId, c]) => ({ judgeId, ...c })),
			(j) => j.judgeId
		),
		byEntry: sortBy(
			[...byEntry].map(([entryId, c]) => ({ entryId, ...c })),
			(e) => e.entryId
		),
		missing,
		unjudgeableEntryIds,
		unexpectedCards
	};
}
