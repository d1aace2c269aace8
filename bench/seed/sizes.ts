// How large the benchmark's invented club is; bench/seed/large.ts writes it, bench/run.ts reports it.

export const BENCH_SEED_MARKER = 'bench-large';

export const SIZES = {
	members: 2000,
	judges: 6,
	tanks: 5000,
	entries: 50_000,
	busiestEntries: 500,
	waterTests: 100_000,
	comments: 20_000,
	listings: 10_000,
	conversations: 1500,
	longConversation: 300,
	contests: 30,
	entriesPerContest: 100,
	photos: 2000
} as const;
