// How far the judges of a category agree: Kendall's coefficient of concordance W, from 0 (no
// agreement beyond chance) to 1 (every judge put the entries in the same order).

import { comparableScore } from './ranking';
import type { JudgedTotal } from './standardise';

/**
 * Ranks 1..n with ties given the mean of the places they span ("average ranks", as W assumes).
 * 'descending' gives rank 1 to the highest value, as a judge's best entry; W is the same either way.
 */
export function averageRanks(values: readonly number[], order: 'ascending' | 'descending' = 'ascending'): number[] {
	const sign = order === 'ascending' ? 1 : -1;
	const idx = values.map((_, i) => i).sort((a, b) => sign * (values[a]! - values[b]!));
	const ranks = new Array<number>(values.length);
	for (let start = 0; start < idx.length;) {
		let end = start;
		while (end + 1 < idx.length && values[idx[end + 1]!] === values[idx[start]!]) end++;
		const rank = (start + 1 + end + 1) / 2;
		for (let k = start; k <= end; k++) ranks[idx[k]!] = rank;
		start = end + 1;
	}
	return ranks;
}

/** Σ(t³ − t) over the groups of tied values in one judge's scores. */
export function tieTerm(values: readonly number[]): number {
	const counts = new Map<number, number>();
	for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
	let sum = 0;
	for (const t of counts.values()) sum += t ** 3 - t;
	return sum;
}

export interface KendallW {
	/** Judges. */
	m: number;
	/** Entries. */
	n: number;
	/** Rank sum per entry, in input column order (rank 1 = a judge's highest score). */
	rankSums: number[];
	/** S = Σ(Rⱼ − m(n + 1)/2)². */
	s: number;
	/** Σ over judges of Σ(t³ − t) over their groups of tied scores. */
	tieSum: number;
	/** 12S / (m²(n³ − n)). */
	w: number;
	/** 12S / (m²(n³ − n) − m·Σ(t³ − t)); null when every judge tied every entry (0/0). */
	wTieCorrected: number | null;
	/** Friedman's χ² with the same tie correction, = m(n − 1)·W (corrected); null with W. */
	friedmanChiSquare: number | null;
	degreesOfFreedom: number;
}

/**
 * W for a complete m × n table: `scores[j][i]` is judge j's score for entry i; every judge scored
 * every entry. Scores are compared exactly here; concordanceForCategory rounds card totals first.
 */
export function kendallW(scores: readonly (readonly number[])[]): KendallW {
	const m = scores.length;
	const n = scores[0]?.length ?? 0;
	if (m < 2 || n < 2) throw new RangeError('Kendall’s W needs at least two judges and two entries.');
	if (scores.some((row) => row.length !== n)) throw new RangeError('Every judge must score the same entries.');
	const rankSums = new Array<number>(n).fill(0);
	let tieSum = 0;
	for (const row of scores) {
		averageRanks(row, 'descending').forEach((r, i) => (rankSums[i]! += r));
		tieSum += tieTerm(row);
	}
	const meanSum = (m * (n + 1)) / 2;
	const s = rankSums.reduce((acc, r) => acc + (r - meanSum) ** 2, 0);
	const full = m * m * (n ** 3 - n);
	const corrected = full - m * tieSum;
	const w = (12 * s) / full;
	const wTieCorrected = corrected > 0 ? (12 * s) / corrected : null;
	return {
		m,
		n,
		rankSums,
		s,
		tieSum,
		w,
		wTieCorrected,
		friedmanChiSquare: wTieCorrected === null ? null : m * (n - 1) * wTieCorrected,
		degreesOfFreedom: n - 1
	};
}

export type ConcordanceResult =
	| ({
			ok: true;
			/** Judges and entries the coefficient was computed over, sorted by id. */
			judgeIds: string[];
			entryIds: string[];
			/** Entries left out because at least one of the judges did not score them (conflicts). */
			excludedEntryIds: string[];
	  } & KendallW)
	| {
			ok: false;
			reason: 'no-cards' | 'too-few-judges' | 'too-few-common-entries';
			message: string;
			judgeIds: string[];
			entryIds: string[];
			excludedEntryIds: string[];
	  };

/**
 * W for one category from its submitted card totals, over the entries that every judge of the set
 * scored (W needs a complete table; an entry a judge could not score has no rank from that judge).
 * The set is every judge with a card unless `judgeIds` names it.
 */
export function concordanceForCategory(cards: readonly JudgedTotal[], judgeIds?: readonly string[]): ConcordanceResult {
	const judges = [...new Set(judgeIds ?? cards.map((c) => c.judgeId))].sort();
	const allEntries = [...new Set(cards.map((c) => c.entryId))].sort();
	// Rounded as for ranking, so totals the judges made equal tie despite floating-point noise.
	const score = new Map(cards.map((c) => [JSON.stringify([c.judgeId, c.entryId]), comparableScore(c.total)]));
	const common = allEntries.filter((e) => judges.every((j) => score.has(JSON.stringify([j, e]))));
	const excluded = allEntries.filter((e) => !common.includes(e));
	const base = { judgeIds: judges, entryIds: common, excludedEntryIds: excluded };
	// Nothing scored yet (no entries, or no card submitted): nothing to compare, whoever is on the panel.
	if (allEntries.length === 0) {
		return { ok: false, reason: 'no-cards', message: 'No cards are in for this category yet, so there is nothing to compare.', ...base };
	}
	if (judges.length < 2) {
		return { ok: false, reason: 'too-few-judges', message: 'Only one judge has scored entries here; agreement needs at least two.', ...base };
	}
	if (common.length < 2) {
		return {
			ok: false,
			reason: 'too-few-common-entries',
			message: `Agreement needs at least two entries scored by all ${judges.length} judges; ${common.length === 0 ? 'none is' : 'only one is'}.`,
			...base
		};
	}
	const table = judges.map((j) => common.map((e) => score.get(JSON.stringify([j, e]))!));
	return { ok: true, ...base, ...kendallW(table) };
}
