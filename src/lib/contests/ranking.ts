// Places within a category. The contest uses standard competition ranking ("1224"); the other
// common styles are here too so the results page can offer them and tests can compare.

export type RankingStyle =
	/** "1224": tied items share the best place, the next item skips the places they used. */
	| 'competition'
	/** "1334": tied items share the worst place they span. */
	| 'modified-competition'
	/** "1223": tied items share a place, the next item takes the next number. */
	| 'dense'
	/** "1 2.5 2.5 4": tied items share the mean of the places they span. */
	| 'fractional';

/**
 * Scores are compared after rounding to this many decimals. Card totals are weighted
 * percentages computed in floating point, so two entries the judges scored identically can differ
 * in the 13th decimal (0.1 + 0.2 ≠ 0.3); rounding at 1e-9 percentage points absorbs that noise
 * and nothing else: real differences between half-point scores are many orders larger. Rounding
 * to a grid (rather than "within a tolerance") keeps equality transitive, so tie groups are well
 * defined. The results page should show enough decimals to tell different places apart, or
 * rank with `decimals` equal to its display precision so what readers see is what is compared.
 */
export const SCORE_DECIMALS = 9;

/** The value used for comparison: `value` rounded to `decimals` places (−0 becomes 0). */
export function comparableScore(value: number, decimals: number = SCORE_DECIMALS): number {
	const factor = 10 ** decimals;
	return Math.round(value * factor) / factor + 0;
}

/** The shared place of each consecutive tie group of the given sizes (best group first). */
export function placesForGroups(groupSizes: readonly number[], style: RankingStyle): number[] {
	const places: number[] = [];
	let before = 0;
	groupSizes.forEach((size, groupIndex) => {
		const first = before + 1;
		const last = before + size;
		places.push(style === 'competition' ? first : style === 'modified-competition' ? last : style === 'dense' ? groupIndex + 1 : (first + last) / 2);
		before += size;
	});
	return places;
}

export interface RankableEntry {
	entryId: string;
	/** The entry's aggregated score; null when no card was submitted (the entry gets no place). */
	score: number | null;
	/** Aggregated score per criterion, in that criterion's points, for tie-breaks. */
	criteria: Readonly<Record<string, number | null | undefined>>;
}

export interface RankedEntry {
	entryId: string;
	score: number | null;
	/** null for an unscored entry. */
	place: number | null;
	/** Other entries at the same place after every tie-break. */
	sharedWith: string[];
	/** Other entries with the same score before tie-breaks. */
	levelOnScoreWith: string[];
	/** When this entry was level on score with the entry listed just above it and a criterion put it below. */
	separatedFromAbove: { entryId: string; criterionId: string } | null;
}

export interface RankOptions {
	/** Default 'competition', the contest's rule. */
	style?: RankingStyle;
	decimals?: number;
}

/**
 * Ranks one category: higher score first; entries level on score are ordered by the higher
 * aggregated score on each criterion of `tieBreakOrder` in turn; entries still level share the
 * place. A missing criterion score counts below any score. Unscored entries come last, unplaced,
 * in entry-id order; placed ties are listed in entry-id order too.
 */
export function rankCategory(entries: readonly RankableEntry[], tieBreakOrder: readonly string[], options: RankOptions = {}): RankedEntry[] {
	const style = options.style ?? 'competition';
	const decimals = options.decimals ?? SCORE_DECIMALS;
	const key = (e: RankableEntry): number[] => [
		comparableScore(e.score!, decimals),
		...tieBreakOrder.map((id) => {
			const v = e.criteria[id];
			return v === null || v === undefined ? -Infinity : comparableScore(v, decimals);
		})
	];
	const byId = (a: RankableEntry, b: RankableEntry) => (a.entryId < b.entryId ? -1 : a.entryId > b.entryId ? 1 : 0);
	/** Index of the first differing component, or -1 when equal. */
	const firstDifference = (a: number[], b: number[]) => a.findIndex((v, i) => v !== b[i]);

	const scored = entries.filter((e) => e.score !== null).map((e) => ({ entry: e, key: key(e) }));
	scored.sort((a, b) => {
		const i = firstDifference(a.key, b.key);
		return i === -1 ? byId(a.entry, b.entry) : b.key[i]! - a.key[i]!;
	});

	const groups: (typeof scored)[] = [];
	for (const item of scored) {
		const last = groups[groups.length - 1];
		if (last && firstDifference(last[0]!.key, item.key) === -1) last.push(item);
		else groups.push([item]);
	}
	const places = placesForGroups(
		groups.map((g) => g.length),
		style
	);

	const ranked: RankedEntry[] = [];
	groups.forEach((group, g) => {
		for (const item of group) {
			const above = ranked[ranked.length - 1];
			const aboveItem = above ? scored.find((s) => s.entry.entryId === above.entryId)! : null;
			const diff = aboveItem ? firstDifference(aboveItem.key, item.key) : -1;
			ranked.push({
				entryId: item.entry.entryId,
				score: item.entry.score,
				place: places[g]!,
				sharedWith: group.filter((o) => o !== item).map((o) => o.entry.entryId),
				levelOnScoreWith: scored.filter((o) => o !== item && o.key[0] === item.key[0]).map((o) => o.entry.entryId),
				separatedFromAbove: aboveItem && diff > 0 ? { entryId: aboveItem.entry.entryId, criterionId: tieBreakOrder[diff - 1]! } : null
			});
		}
	});
	for (const e of entries.filter((x) => x.score === null).sort(byId)) {
		ranked.push({ entryId: e.entryId, score: null, place: null, sharedWith: [], levelOnScoreWith: [], separatedFromAbove: null });
	}
	return ranked;
}
