// Three demo contests, run through the real contest functions: one published (three categories,
// 19 entries, four judges, one declared conflict, one judge who entered a tank himself), one
// being judged with some cards still open, and one just opened for entries. Entries are made on dates in the past by passing
// `now`, scores come from a small model of judges (each entry has an underlying quality per
// criterion, each judge a leniency and a steadiness), and the published results are whatever
// the server computes from those cards.
import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { toViewer, type Viewer } from '../../src/lib/server/club/users';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as contests from '../../src/lib/server/contests/contests';
import * as entries from '../../src/lib/server/contests/contest-entries';
import * as judging from '../../src/lib/server/contests/judging';
import * as panel from '../../src/lib/server/contests/panel';
import { transition } from '../../src/lib/server/contests/review';
import { contestEntries } from '../../src/lib/server/contests/schema';
import type { TankInput } from '../../src/lib/journals/tank-input';
import type { ContestInput } from '../../src/lib/contests/contest-form';
import { checkEligibility } from '../../src/lib/contests/eligibility';
import { SCORE_STEP } from '../../src/lib/contests/rubric';
import type { CardFields } from '../../src/lib/contests/card';
import { dayOf } from '../../src/lib/dates';
import { demoUserIds } from './club';
import { randomFrom, storeDemoPhoto } from './lib/images';

const DAY = 86_400_000;

/** Our own rubric: five criteria in the club's words, weighted towards the layout and the plants. */
export const DEMO_RUBRIC = [
	{
		label: 'Sense of depth',
		max: 10,
		weight: 3,
		guidance:
			'Does the layout lead the eye from the front glass to the back? Foreground, middle and background read as separate planes, and the back does not end at a flat wall.'
	},
	{
		label: 'Plant vigour',
		max: 10,
		weight: 3,
		guidance: 'Healthy, well-coloured growth without melting leaves, algae or gaps from neglect; plants that suit the light and CO2 the tank actually has.'
	},
	{
		label: 'Hardscape balance',
		max: 10,
		weight: 2,
		guidance: 'Stone and wood placed with intent: one clear point of focus, sizes in proportion to the tank, no accidental symmetry.'
	},
	{
		label: 'Livestock fit',
		max: 5,
		weight: 1,
		guidance:
			'Fish and invertebrates that suit the volume, the water and the plants, look healthy and behave naturally. Overstocking, or animals kept for the photo, score low.'
	},
	{ label: 'Care in the details', max: 5, weight: 1, guidance: 'Clean glass, hidden or tidy cables and pipes, trimmed edges: the upkeep the photos show.' }
] as const;

/** Compared in this order when two entries are level on score. */
const TIE_BREAK = ['Sense of depth', 'Plant vigour', 'Hardscape balance', 'Care in the details', 'Livestock fit'];

/** Leniency (added to the 0–1 quality) and steadiness (SD of each judgement) of each demo judge. */
const JUDGE_STYLE: Record<string, { bias: number; noise: number }> = {
	sefa: { bias: 0.025, noise: 0.04 },
	tamsin: { bias: -0.035, noise: 0.035 },
	ugo: { bias: 0.0, noise: 0.06 },
	nell: { bias: 0.015, noise: 0.05 }
};

type Shape = { l: number; w: number; h: number; glass: number; substrate: number; rock: number; style: string };
const NANO: Shape[] = [
	{ l: 36, w: 22, h: 26, glass: 4, substrate: 4, rock: 1, style: 'nano' },
	{ l: 40, w: 25, h: 28, glass: 5, substrate: 4, rock: 1.5, style: 'nano' },
	{ l: 30, w: 30, h: 35, glass: 5, substrate: 5, rock: 2, style: 'nano' },
	{ l: 45, w: 24, h: 30, glass: 5, substrate: 5, rock: 1, style: 'nano' }
];
const STONES: Shape[] = [
	{ l: 60, w: 30, h: 36, glass: 6, substrate: 6, rock: 6, style: 'iwagumi' },
	{ l: 60, w: 35, h: 35, glass: 6, substrate: 7, rock: 7, style: 'iwagumi' },
	{ l: 75, w: 35, h: 40, glass: 8, substrate: 7, rock: 9, style: 'iwagumi' },
	{ l: 90, w: 45, h: 45, glass: 10, substrate: 8, rock: 14, style: 'iwagumi' }
];
const OPEN: Shape[] = [
	{ l: 90, w: 45, h: 50, glass: 10, substrate: 7, rock: 10, style: 'wood and stone' },
	{ l: 120, w: 50, h: 55, glass: 12, substrate: 8, rock: 18, style: 'stem garden' },
	{ l: 70, w: 35, h: 40, glass: 6, substrate: 5, rock: 3, style: 'jungle' },
	{ l: 80, w: 40, h: 45, glass: 8, substrate: 6, rock: 8, style: 'biotope' },
	{ l: 100, w: 40, h: 45, glass: 10, substrate: 7, rock: 12, style: 'wood and stone' }
];

const TANK_NAMES = [
	'Slate hollow',
	'Reed margin',
	'Low ford',
	'Mossback',
	'Grey shelf',
	'Alder shade',
	'Pebble run',
	'Still bay',
	'Fern step',
	'Heron bank',
	'Quiet weir',
	'Sedge corner',
	'Driftwood arch',
	'Cold spring',
	'Marsh light',
	'Willow root',
	'Shingle beach',
	'Otter pool',
	'Lichen ridge',
	'Dune grass'
];
const SCENES = [
	'a sloped sand path between two stone groups',
	'a dense red and green stem background',
	'a carpet of small round leaves in front of a branching root',
	'mossed stones along a gravel bank',
	'tall grass-like plants at the back and a low lawn in front',
	'a single upright stone with smaller stones around it',
	'floating plants shading a cave of wood'
];
const STATEMENTS = [
	'I wanted the feeling of a shallow stream bank in late summer: the path pulls the eye to the back left, where the tallest stems catch the light.',
	'Three stone groups set at roughly a third of the length each, with the largest leaning slightly to the right so the layout does not look placed.',
	'A jungle of mixed stems, trimmed into soft steps so the back rises like a hill. The shoal keeps to the open water in the middle.',
	'This is a low-tech tank: no added CO2, a long photoperiod at low intensity, and patience. The moss took four months to cover the wood.',
	'Everything here grows slowly on purpose. I trim once a month and change a third of the water every week.',
	'The wood came from one branch, split and re-joined, so the grain runs the same way throughout.',
	'I tried to keep the stone colours to two greys and let the plants bring all the colour.'
];
/** What a judge might say about a criterion that stood out, good or weak (one list per criterion). */
const STRONG = [
	[
		'The path into the back really works: the eye keeps travelling.',
		'Three clear planes, and the back fades away nicely.',
		'Fine plants at the back make the tank look deeper than it is.'
	],
	[
		'Even, healthy colour everywhere; the stems are dense right down to the substrate.',
		'No melt, no algae on the old leaves: this is a well-kept tank.',
		'The carpet is complete and low.'
	],
	[
		'The main stone sits exactly where it should.',
		'Good proportions: the hardscape fills the tank without crowding it.',
		'The wood and stone read as one piece.'
	],
	['The shoal is well chosen for this size and stays together.', 'Active, healthy fish that suit the plants.', 'A sensible, light stocking.'],
	['Spotless glass and no cable in sight.', 'Very tidy edges; the trimming is clearly regular.', 'Everything that is not the layout has been hidden.']
];
const WEAK = [
	[
		'The back stops abruptly; taller or finer plants there would add depth.',
		'Foreground and background are the same height, so it reads flat.',
		'The midground is thin.'
	],
	[
		'Some older leaves are tired or have algae on them.',
		'Gaps in the stems suggest the light does not reach the bottom.',
		'The carpet is patchy on the right.'
	],
	[
		'The stones compete with each other; fewer, larger pieces might help.',
		'The focal point sits right in the middle, which makes it static.',
		'The wood looks too small for the tank.'
	],
	[
		'Quite a lot of fish for this volume.',
		'The shrimp are hard to find; this scores on what the photos show.',
		'Mixed species that do not obviously suit each other.'
	],
	['The front glass needs a wipe.', 'A cable and a pipe are clearly visible.', 'The edges of the carpet need a trim.']
];
const OVERALL_HIGH = ['A layout that holds the eye. Well done.', 'One of the strongest in the category.', 'Very well kept and clearly thought through.'];
const OVERALL_MID = ['A good tank with room to grow.', 'Pleasant and healthy; a clearer idea would lift it.', 'Solid work.'];
const OVERALL_LOW = [
	'The idea is there; give it a few more months.',
	'Keep going: the plants need time to fill in before the layout reads.',
	'A steadier routine would lift every criterion.'
];

function gaussian(rnd: () => number): number {
	const u = Math.max(rnd(), 1e-12);
	return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rnd());
}

const onStep = (x: number) => Math.round(x / SCORE_STEP) * SCORE_STEP;

async function viewerOf(db: DbOrTx, id: string): Promise<Viewer> {
	const [row] = await db.select().from(users).where(eq(users.id, id));
	return toViewer(row!);
}

function tankInput(name: string, shape: Shape, setUpOn: string, visibility: TankInput['visibility'], description: string): TankInput {
	return {
		name,
		style: shape.style,
		setUpOn,
		lengthCm: shape.l,
		widthCm: shape.w,
		heightCm: shape.h,
		glassMm: shape.glass,
		substrateKind: 'nutrient-soil',
		substrateNote: '',
		substrateDepthCm: shape.substrate,
		hardscape: shape.style === 'iwagumi' ? 'Grey stones' : 'Stones and wood',
		hardscapeLitres: shape.rock,
		heaterWatts: shape.l >= 60 ? 100 : null,
		heaterSetC: shape.l >= 60 ? 24 : null,
		heaterNote: '',
		co2Method: shape.l >= 60 ? 'pressurised' : 'none',
		co2BubblesPerSecond: shape.l >= 60 ? 1.5 : null,
		waterLitres: null,
		parAtSubstrate: null,
		parDepthCm: null,
		description,
		visibility,
		lights: [{ label: 'LED bar', watts: Math.round(shape.l * 0.5), hoursPerDay: 7 }],
		filters: [
			{ label: shape.l >= 60 ? 'Canister' : 'Sponge filter', ratedFlow: Math.round(shape.l * shape.w * shape.h * 0.006), flowUnit: 'lph', mediaNotes: '' }
		],
		fertilisers: [],
		plants: [],
		livestock: []
	};
}

interface EntryPlan {
	owner: string;
	category: number;
	shape: Shape;
	/** Underlying quality 0–1 of the tank on each criterion. */
	quality: number[];
	photos: number;
}

interface ContestPlan {
	title: string;
	rules: string;
	categories: ContestInput['categories'];
	aggregation: ContestInput['aggregation'];
	entriesPerMember: number;
	judges: string[];
	openedDaysAgo: number;
	entriesCloseDaysAgo: number;
	judgingClosesInDays: number;
	entries: EntryPlan[];
	/** [judge, entry index, reason] */
	conflicts: [string, number, string][];
	/** Share of each judge's cards to submit (1 = all); the rest are drafts or not started. */
	finished: Record<string, number>;
	/** The state the contest is left in. */
	until: 'open' | 'judging' | 'published';
}

function plans(rnd: () => number): ContestPlan[] {
	const quality = (level: number) => DEMO_RUBRIC.map(() => Math.min(0.97, Math.max(0.25, level + (rnd() - 0.5) * 0.16)));
	const published: EntryPlan[] = [
		// Nano: up to 40 L.
		...['mara', 'dov', 'fenna', 'joss', 'yara', 'pim'].map((owner, i) => ({
			owner,
			category: 0,
			shape: NANO[i % NANO.length]!,
			quality: quality(0.5 + rnd() * 0.4),
			photos: 1 + (i % 2)
		})),
		// Stone layouts: 30 L or more, running at least 8 weeks.
		...['lio', 'ines', 'rafe', 'corin', 'mara', 'fenna'].map((owner, i) => ({
			owner,
			category: 1,
			shape: STONES[i % STONES.length]!,
			quality: quality(0.5 + rnd() * 0.4),
			photos: 1 + ((i + 1) % 2)
		})),
		// Open: any size, running at least 6 weeks; Ugo judges and enters here.
		...['dov', 'joss', 'yara', 'pim', 'ines', 'ugo', 'bramwell'].map((owner, i) => ({
			owner,
			category: 2,
			shape: OPEN[i % OPEN.length]!,
			quality: quality(0.45 + rnd() * 0.45),
			photos: 1 + (i % 3 === 0 ? 1 : 0)
		}))
	];
	const current: EntryPlan[] = [
		...['mara', 'corin', 'rafe', 'pim', 'fenna'].map((owner, i) => ({
			owner,
			category: 0,
			shape: OPEN[(i + 2) % OPEN.length]!,
			quality: quality(0.5 + rnd() * 0.4),
			photos: 1
		})),
		...['joss', 'lio', 'yara', 'ines'].map((owner, i) => ({
			owner,
			category: 1,
			shape: NANO[(i + 1) % NANO.length]!,
			quality: quality(0.5 + rnd() * 0.4),
			photos: 1
		}))
	];
	const third: EntryPlan[] = ['dov', 'yara'].map((owner, i) => ({ owner, category: 0, shape: OPEN[(i + 3) % OPEN.length]!, quality: quality(0.6), photos: 1 }));
	return [
		{
			title: 'Kettlewater Scapes, first round',
			rules:
				'Open to every club member with a running tank on their Riparia profile.\n\n- Up to **two** tanks per member, each in one category.\n- Photos taken for this round, of the tank as it is now; no editing beyond cropping and straightening.\n- Fish stay in their own tank for the photos.\n\nJudges score blind, by entry number, and step back from any tank they know.',
			categories: [
				{ id: null, name: 'Nano', description: 'Small tanks, where every leaf counts.', minLitres: null, maxLitres: 40, minAgeWeeks: null },
				{ id: null, name: 'Iwagumi', description: 'Stone-led layouts with a restrained planting.', minLitres: 30, maxLitres: null, minAgeWeeks: 8 },
				{ id: null, name: 'Open', description: 'Any style, any size.', minLitres: null, maxLitres: null, minAgeWeeks: 6 }
			],
			aggregation: 'mean',
			entriesPerMember: 2,
			judges: ['sefa', 'tamsin', 'ugo', 'nell'],
			openedDaysAgo: 130,
			entriesCloseDaysAgo: 100,
			judgingClosesInDays: -85,
			entries: published,
			conflicts: [['tamsin', 1, 'I helped set up the hardscape of this tank and would recognise it anywhere.']],
			finished: { sefa: 1, tamsin: 1, ugo: 1, nell: 1 },
			until: 'published'
		},
		{
			title: 'Kettlewater Scapes, second round',
			rules:
				'Same rules as the first round: two tanks per member at most, photos of the tank as it is now, fish in their own tank.\n\nThis round has two categories and the score is the **median** of the judges’ cards.',
			categories: [
				{ id: null, name: 'Large layouts', description: 'From 50 litres of water.', minLitres: 50, maxLitres: null, minAgeWeeks: 4 },
				{ id: null, name: 'Nano', description: 'Up to 40 litres of water.', minLitres: null, maxLitres: 40, minAgeWeeks: null }
			],
			aggregation: 'median',
			entriesPerMember: 2,
			judges: ['sefa', 'tamsin', 'nell'],
			openedDaysAgo: 35,
			entriesCloseDaysAgo: 6,
			judgingClosesInDays: 9,
			entries: current,
			conflicts: [],
			finished: { sefa: 1, tamsin: 0.5, nell: 0.25 },
			until: 'judging'
		},
		{
			title: 'Kettlewater Scapes, third round',
			rules: 'One tank per member this time, any size, running at least four weeks. Photos of the tank as it is now; fish stay in their own tank.',
			categories: [{ id: null, name: 'Open', description: 'Any style, any size.', minLitres: null, maxLitres: null, minAgeWeeks: 4 }],
			aggregation: 'trimmed-mean',
			entriesPerMember: 1,
			judges: ['sefa', 'tamsin', 'ugo', 'nell'],
			openedDaysAgo: 3,
			entriesCloseDaysAgo: -25,
			judgingClosesInDays: 40,
			entries: third,
			conflicts: [],
			finished: {},
			until: 'open'
		}
	];
}

function cardFor(rubricIds: string[], quality: number[], style: { bias: number; noise: number }, rnd: () => number): CardFields {
	const scores: Record<string, number | null> = {};
	const relative: number[] = [];
	rubricIds.forEach((id, i) => {
		const c = DEMO_RUBRIC[i]!;
		const q = quality[i]! + style.bias + gaussian(rnd) * style.noise;
		const score = Math.min(c.max, Math.max(0, onStep(q * c.max)));
		scores[id] = score;
		relative.push(score / c.max);
	});
	const pick = <T>(list: readonly T[]) => list[Math.floor(rnd() * list.length)]!;
	const best = relative.indexOf(Math.max(...relative));
	const worst = relative.indexOf(Math.min(...relative));
	const comments: Record<string, string> = Object.fromEntries(rubricIds.map((id) => [id, '']));
	if (rnd() < 0.7) comments[rubricIds[best]!] = pick(STRONG[best]!);
	if (rnd() < 0.7 && worst !== best) comments[rubricIds[worst]!] = pick(WEAK[worst]!);
	const mean = relative.reduce((a, b) => a + b, 0) / relative.length;
	const overall = mean > 0.78 ? pick(OVERALL_HIGH) : mean > 0.6 ? pick(OVERALL_MID) : pick(OVERALL_LOW);
	return {
		scores,
		comments,
		entrantComment: overall,
		panelNote: rnd() < 0.15 ? 'I scored the photos as they are; the second photo looks older than the first.' : ''
	};
}

export async function seedContests(db: DbOrTx): Promise<void> {
	const people = await demoUserIds(db);
	const need = ['oriel', 'sefa', 'tamsin', 'ugo', 'nell'];
	if (need.some((k) => !people.has(k))) return;
	// A fourth judge: a member of the club takes the role for the contests.
	await db
		.update(users)
		.set({ role: 'judge' })
		.where(eq(users.id, people.get('nell')!));
	const admin = await viewerOf(db, people.get('oriel')!);
	const now = new Date();
	const rnd = randomFrom(2026);
	let photoSeed = 300;
	const tankOf = new Map<string, number>();
	let tankCounter = 0;

	for (const plan of plans(rnd)) {
		const at = (days: number) => new Date(now.getTime() + days * DAY);
		const opened = at(-plan.openedDaysAgo);
		const entriesClose = at(-plan.entriesCloseDaysAgo);
		const judgingOpens = new Date(entriesClose.getTime() + DAY);
		const judgingCloses = at(plan.judgingClosesInDays);
		const input: ContestInput = {
			title: plan.title,
			rules: plan.rules,
			entryOpensOn: dayOf(opened),
			entryClosesOn: dayOf(entriesClose),
			judgingOpensOn: dayOf(judgingOpens),
			judgingClosesOn: dayOf(judgingCloses),
			entriesPerMember: plan.entriesPerMember,
			aggregation: plan.aggregation,
			criteria: DEMO_RUBRIC.map((c, i) => ({ id: null, key: `k${i}`, label: c.label, guidance: c.guidance, maxPoints: c.max, weight: c.weight })),
			tieBreak: TIE_BREAK.map((label) => `k${DEMO_RUBRIC.findIndex((c) => c.label === label)}`),
			categories: plan.categories
		};
		const prepared = new Date(opened.getTime() - 6 * DAY);
		const contestId = await contests.create(admin, input, { db, now: prepared });
		for (const judge of plan.judges) await panel.assign(admin, contestId, people.get(judge)!, { db, now: new Date(prepared.getTime() + 3_600_000) });
		await transition(admin, contestId, 'open-entries', {}, { db, now: opened });
		const contest = (await contests.load(contestId, { db }))!;

		// Entries, spread over the entry window.
		const span = Math.min(entriesClose.getTime(), now.getTime() - 3_600_000) - opened.getTime();
		const entryIds: number[] = [];
		for (const [i, e] of plan.entries.entries()) {
			const ownerId = people.get(e.owner);
			if (!ownerId) continue;
			const owner = await viewerOf(db, ownerId);
			const when = new Date(opened.getTime() + ((i + 0.5) / plan.entries.length) * span * 0.9);
			const category = contest.categories[e.category]!;
			const rule = contests.ruleOf(category);
			// A tank of the owner's that fits and is not entered here yet, else a new one.
			const own = await tanks.listOwn(owner, { retired: false }, { db });
			let tankId: number | null = null;
			for (const summary of own) {
				if ([...tankOf.entries()].some(([k, v]) => v === summary.id && k.startsWith(`${contestId}:`))) continue;
				const full = await tanks.getOwn(owner, summary.id, { db });
				if (full && checkEligibility(rule, entries.factsOf(full, { now: when }).facts).eligible && full.setUpOn && new Date(full.setUpOn) < when) {
					tankId = full.id;
					break;
				}
			}
			if (tankId === null) {
				tankCounter++;
				const setUp = dayOf(new Date(when.getTime() - (70 + ((tankCounter * 37) % 200)) * DAY));
				const scene = SCENES[tankCounter % SCENES.length]!;
				tankId = await tanks.create(
					{ id: ownerId },
					tankInput(
						TANK_NAMES[(tankCounter - 1) % TANK_NAMES.length]!,
						e.shape,
						setUp,
						tankCounter % 3 === 0 ? 'public' : 'club',
						`A ${e.shape.style} layout with ${scene}.`
					),
					[],
					{ db }
				);
			}
			tankOf.set(`${contestId}:${e.owner}:${i}`, tankId);
			const photos = [];
			for (let p = 0; p < e.photos; p++) {
				const stored = await storeDemoPhoto(ownerId, photoSeed++, db, { width: 1200, height: 750 });
				photos.push({
					id: stored.id,
					alt: p === 0 ? `The whole tank from the front: ${SCENES[(photoSeed + i) % SCENES.length]}.` : 'A closer view of the planting on the left.',
					caption: p === 0 ? '' : 'Taken the same evening.'
				});
			}
			const id = await entries.create(
				owner,
				contestId,
				{ categoryId: category.id, tankId, statement: STATEMENTS[i % STATEMENTS.length]!, photos },
				{ db, now: when }
			);
			entryIds.push(id);
		}

		if (plan.until === 'open') continue;
		await transition(admin, contestId, 'start-judging', {}, { db, now: judgingOpens });
		const numbers = new Map(
			(await db.select({ id: contestEntries.id, number: contestEntries.number }).from(contestEntries).where(eq(contestEntries.contestId, contestId))).map(
				(r) => [r.id, r.number!]
			)
		);

		for (const [judge, index, reason] of plan.conflicts) {
			const viewer = await viewerOf(db, people.get(judge)!);
			await judging.declareConflict(viewer, contestId, numbers.get(entryIds[index]!)!, reason, { db, now: new Date(judgingOpens.getTime() + 2 * 3_600_000) });
		}

		const rubricIds = contest.criteria.map((c) => String(c.id));
		for (const judge of plan.judges) {
			const viewer = await viewerOf(db, people.get(judge)!);
			const style = JUDGE_STYLE[judge]!;
			const owed = [];
			for (const [i, entryId] of entryIds.entries()) {
				const [entry] = await db
					.select()
					.from(contestEntries)
					.where(and(eq(contestEntries.id, entryId), eq(contestEntries.contestId, contestId)));
				if (!entry || entry.entrantId === viewer.id) continue;
				if (plan.conflicts.some(([j, k]) => j === judge && k === i)) continue;
				owed.push({ i, number: numbers.get(entryId)! });
			}
			const submitCount = Math.round(owed.length * plan.finished[judge]!);
			for (const [k, cell] of owed.entries()) {
				const drafted = k >= submitCount;
				if (drafted && k >= submitCount + 2) continue; // not started
				const when = new Date(judgingOpens.getTime() + (k + 1) * 3_600_000 * 5);
				const fields = cardFor(rubricIds, plan.entries[cell.i]!.quality, style, rnd);
				if (drafted) fields.scores[rubricIds[rubricIds.length - 1]!] = null;
				const saved = await judging.saveCard(
					viewer,
					contestId,
					cell.number,
					{ baseVersion: 0, saveId: `seed-${contestId}-${judge}-${cell.number}`, fields },
					{ db, now: when }
				);
				if (!drafted) await judging.submitCard(viewer, contestId, cell.number, saved.version, { db, now: when });
			}
		}

		if (plan.until === 'published') await transition(admin, contestId, 'publish', {}, { db, now: new Date(judgingCloses.getTime() + DAY) });
	}
}
