// Contests made through the contest functions for a test: a rubric, categories, a panel,
// entrants with tanks and a photo each, in whatever state the test needs.
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../src/lib/server/db';
import * as media from '../../src/lib/server/media';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as contests from '../../src/lib/server/contests/contests';
import * as entries from '../../src/lib/server/contests/contest-entries';
import * as judging from '../../src/lib/server/contests/judging';
import * as panel from '../../src/lib/server/contests/panel';
import { transition } from '../../src/lib/server/contests/review';
import { contestCards, contestEntries } from '../../src/lib/server/contests/schema';
import type { Viewer } from '../../src/lib/server/club/users';
import type { ContestInput } from '../../src/lib/contests/contest-form';
import type { CardFields } from '../../src/lib/contests/card';
import { dayOf } from '../../src/lib/dates';
import { makePerson, type TestPerson } from './people';
import { tankInput } from './tanks';

export const viewerOf = (p: TestPerson): Viewer => ({ id: p.id, email: p.email, displayName: p.displayName, role: p.role, units: 'metric' });

const day = (offset: number) => dayOf(new Date(Date.now() + offset * 86_400_000));

/** Two criteria: "Depth" out of 10 with weight 2 and "Finish" out of 5 with weight 1. */
export function contestInput(overrides: Partial<ContestInput> = {}): ContestInput {
	return {
		title: `Test contest ${crypto.randomUUID().slice(0, 6)}`,
		rules: 'Rules of the test contest.',
		entryOpensOn: day(-1),
		entryClosesOn: day(10),
		judgingOpensOn: day(11),
		judgingClosesOn: day(20),
		entriesPerMember: 2,
		aggregation: 'mean',
		criteria: [
			{ id: null, key: 'a', label: 'Depth', guidance: 'Front to back', maxPoints: 10, weight: 2 },
			{ id: null, key: 'b', label: 'Finish', guidance: '', maxPoints: 5, weight: 1 }
		],
		tieBreak: ['a', 'b'],
		categories: [
			{ id: null, name: 'Small', description: '', minLitres: null, maxLitres: 40, minAgeWeeks: null },
			{ id: null, name: 'Open', description: '', minLitres: null, maxLitres: null, minAgeWeeks: 2 }
		],
		...overrides
	};
}

export async function photoOf(owner: TestPerson, colour = '#2f7a58') {
	const jpeg = await sharp({ create: { width: 320, height: 200, channels: 3, background: colour } })
		.jpeg()
		.toBuffer();
	return media.upload(owner.id, jpeg);
}

/** A tank of `owner` that fits the "Open" category (60 × 30 × 36 cm, set up in January 2026). */
export async function openTank(owner: TestPerson, name: string) {
	return tanks.create({ id: owner.id }, tankInput({ name, setUpOn: '2026-01-15' }));
}

/** A 30 × 20 × 25 cm tank with a measured 12 L: fits "Small". */
export async function smallTank(owner: TestPerson, name: string) {
	return tanks.create({ id: owner.id }, tankInput({ name, lengthCm: 30, widthCm: 20, heightCm: 25, glassMm: 4, waterLitres: 12, setUpOn: '2026-01-15' }));
}

export interface Fixture {
	contestId: number;
	admin: TestPerson;
	judges: TestPerson[];
	entrants: TestPerson[];
	criteria: string[];
	categories: number[];
	/** In the order the entrants were given. */
	entries: { entryId: number; number: number | null; entrant: TestPerson; tankName: string }[];
}

/**
 * A contest with a panel and one entry in "Open" per entrant, left open for entries or moved on
 * to judging. An entrant may be a judge too (a self-entry).
 */
export async function contestFixture(
	options: { judges?: number; entrants?: TestPerson[]; state?: 'open' | 'judging'; input?: Partial<ContestInput>; entrantNames?: string[] } = {}
): Promise<Fixture> {
	const admin = await makePerson({ role: 'admin', label: 'contest-admin' });
	const judges = await Promise.all(
		Array.from({ length: options.judges ?? 3 }, (_, i) =>
			makePerson({ role: 'judge', label: `judge${i}`, displayName: `Judge Panelist ${i} ${crypto.randomUUID().slice(0, 4)}` })
		)
	);
	const entrants =
		options.entrants ??
		(await Promise.all(
			(options.entrantNames ?? ['Entrant Alpha', 'Entrant Beta', 'Entrant Gamma']).map((n) =>
				makePerson({ label: 'entrant', displayName: `${n} ${crypto.randomUUID().slice(0, 4)}` })
			)
		));
	const contestId = await contests.create(viewerOf(admin), contestInput(options.input));
	for (const j of judges) await panel.assign(viewerOf(admin), contestId, j.id);
	await transition(viewerOf(admin), contestId, 'open-entries');
	const contest = (await contests.load(contestId))!;
	const open = contest.categories.find((c) => c.name === 'Open')!;
	const made: Fixture['entries'] = [];
	for (const entrant of entrants) {
		const tankName = `Tank of ${entrant.displayName} ${crypto.randomUUID().slice(0, 4)}`;
		const tankId = await openTank(entrant, tankName);
		const photo = await photoOf(entrant);
		const entryId = await entries.create(viewerOf(entrant), contestId, {
			categoryId: open.id,
			tankId,
			statement: 'Stems at the back, a lawn in front.',
			photos: [{ id: photo.id, alt: 'The whole tank from the front', caption: '' }]
		});
		made.push({ entryId, number: null, entrant, tankName });
	}
	if ((options.state ?? 'judging') === 'judging') {
		await transition(viewerOf(admin), contestId, 'start-judging');
		const rows = await db.select({ id: contestEntries.id, number: contestEntries.number }).from(contestEntries).where(eq(contestEntries.contestId, contestId));
		for (const m of made) m.number = rows.find((r) => r.id === m.entryId)!.number;
	}
	return {
		contestId,
		admin,
		judges,
		entrants,
		criteria: contest.criteria.map((c) => String(c.id)),
		categories: contest.categories.map((c) => c.id),
		entries: made
	};
}

export function fields(criteria: string[], scores: (number | null)[], extra: Partial<CardFields> = {}): CardFields {
	return {
		scores: Object.fromEntries(criteria.map((id, i) => [id, scores[i] ?? null])),
		comments: Object.fromEntries(criteria.map((id) => [id, ''])),
		entrantComment: '',
		panelNote: '',
		...extra
	};
}

/** Every judge saves a card for every entry they owe, and submits it when every score is given. */
export async function scoreAll(
	f: Fixture,
	scoresFor: (judgeIndex: number, entryIndex: number) => (number | null)[],
	extra: (j: number, e: number) => Partial<CardFields> = () => ({})
) {
	for (const [j, judge] of f.judges.entries()) {
		for (const [e, entry] of f.entries.entries()) {
			if (entry.entrant.id === judge.id) continue;
			const scores = scoresFor(j, e);
			try {
				const saved = await judging.saveCard(viewerOf(judge), f.contestId, entry.number!, {
					baseVersion: 0,
					saveId: crypto.randomUUID(),
					fields: fields(f.criteria, scores, extra(j, e))
				});
				// A card with a score missing stays a draft.
				if (scores.every((s) => s !== null)) await judging.submitCard(viewerOf(judge), f.contestId, entry.number!, saved.version);
			} catch (error) {
				if ((error as { status?: number }).status === 404) continue; // a conflicted entry
				throw error;
			}
		}
	}
}

export async function cardIdOf(entryId: number, judgeId: string): Promise<number> {
	const [row] = await db
		.select({ id: contestCards.id })
		.from(contestCards)
		.where(and(eq(contestCards.entryId, entryId), eq(contestCards.judgeId, judgeId)));
	if (!row) throw new Error(`No card of ${judgeId} for entry ${entryId}.`);
	return row.id;
}
