// The benchmark's large invented club ("Greyreach"), written with multi-row INSERTs rather than
// the app's forms, so it takes seconds rather than hours: 2,000 members, 5,000 tanks, 50,000
// journal entries with events and markdown bodies, 100,000 water tests, 20,000 comments, 10,000
// swap listings with 1,500 conversations, 30 contests of 100 entries judged by 6 judges on 6
// criteria, and 2,000 photos whose renditions went through the real media pipeline. It includes
// the busiest tank (500 entries), published contests with every card in, a judge with a full
// set of cards in a contest being judged, and one long conversation.
//
// Run by bench/run.ts in a child process with the bench stack's environment:
//   node --import tsx bench/seed/large.ts <fingerprint>
import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import type { MySqlTable } from 'drizzle-orm/mysql-core';
import pLimit from 'p-limit';
import { connect } from '../../src/lib/server/db';
import { seedRuns } from '../../src/lib/server/db/meta';
import { renderStoredMarkdown } from '../../src/lib/server/markdown-fields';
import { clubAreas, users } from '../../src/lib/server/club/schema';
import { species } from '../../src/lib/server/species/schema';
import {
	entryComments,
	journalEntries,
	journalEvents,
	maintenanceTasks,
	tankAdmires,
	tankFilters,
	tankFollows,
	tankLights,
	tankLivestock,
	tankPlants,
	tanks,
	waterTests
} from '../../src/lib/server/journals/schema';
import { listingEvents, listings, swapMessages, swapThreads } from '../../src/lib/server/swaps/schema';
import {
	contestCards,
	contestCategories,
	contestConflicts,
	contestCriteria,
	contestEntries,
	contestJudges,
	contests
} from '../../src/lib/server/contests/schema';
import { media } from '../../src/lib/server/media/schema';
import { objectKey } from '../../src/lib/server/media';
import { prepareImage, type PreparedImage } from '../../src/lib/server/media/process';
import { bucketStore } from '../../src/lib/server/media/storage';
import { roundToKilometre } from '../../src/lib/club/location';
import { SCORE_STEP } from '../../src/lib/contests/rubric';
import type { CardFields } from '../../src/lib/contests/card';
import { drawAquarium, randomFrom } from '../../scripts/seed/lib/images';
import * as w from './words';
import { BENCH_SEED_MARKER, SIZES } from './sizes';

const DAY = 86_400_000;
const rnd = randomFrom(20_261_203);
const pick = <T>(list: readonly T[]): T => list[Math.floor(rnd() * list.length)]!;
const between = (a: number, b: number) => a + rnd() * (b - a);
const int = (a: number, b: number) => Math.floor(between(a, b + 1));
const dayOf = (d: Date) => d.toISOString().slice(0, 10);
const round = (x: number, step: number) => Math.round(x / step) * step;

const { db, pool, close } = connect();
const now = new Date();
const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
const timings: { what: string; rows: number; ms: number }[] = [];

/** Inserts rows in multi-row statements; returns the ids, which InnoDB hands out consecutively per statement. */
async function insertAll<T extends MySqlTable>(table: T, rows: T['$inferInsert'][], chunk = 1000): Promise<number[]> {
	const ids: number[] = [];
	for (let i = 0; i < rows.length; i += chunk) {
		const part = rows.slice(i, i + chunk);
		const [result] = (await db.insert(table).values(part as never)) as unknown as [{ insertId: number }];
		for (let k = 0; k < part.length; k++) ids.push(result.insertId + k);
	}
	return ids;
}

async function timed<T>(what: string, rows: () => number, run: () => Promise<T>): Promise<T> {
	const started = performance.now();
	const out = await run();
	timings.push({ what, rows: rows(), ms: performance.now() - started });
	return out;
}

function markdownBody(): string {
	const parts: string[] = [];
	const sections = int(1, 3);
	for (let s = 0; s < sections; s++) {
		if (rnd() < 0.5) parts.push(`### ${pick(w.HEADINGS)}`);
		parts.push(
			Array.from({ length: int(2, 4) }, () => pick(w.SENTENCES))
				.join(' ')
				.replace(/(\w+ \w+)/, rnd() < 0.3 ? '**$1**' : '$1')
		);
		if (rnd() < 0.4) parts.push(Array.from({ length: int(2, 4) }, () => `- ${pick(w.SENTENCES)}`).join('\n'));
	}
	return parts.join('\n\n');
}

const fingerprint = process.argv[2];
if (!fingerprint) {
	console.error('usage: bench/seed/large.ts <fingerprint>');
	process.exit(2);
}

const started = performance.now();
try {
	// --- Areas and members -------------------------------------------------------------------
	const areaRows = w.AREA_NAMES.map((name) => {
		const p = roundToKilometre({ lat: w.REGION.lat + between(-0.6, 0.6) * w.REGION.halfLat, lng: w.REGION.lng + between(-0.6, 0.6) * w.REGION.halfLng });
		return { name, lat: p.lat, lng: p.lng };
	});
	const areaIds = await insertAll(clubAreas, areaRows);

	interface Member {
		id: string;
		role: 'member' | 'judge' | 'admin';
		lat: number;
		lng: number;
		name: string;
	}
	const members: Member[] = [];
	const memberRows = await timed(
		'members',
		() => SIZES.members,
		async () => {
			const rows = Array.from({ length: SIZES.members }, (_, i) => {
				const given = w.GIVEN_NAMES[i % w.GIVEN_NAMES.length]!;
				const family = w.FAMILY_NAMES[(i * 7 + Math.floor(i / w.GIVEN_NAMES.length)) % w.FAMILY_NAMES.length]!;
				// Member 0 lives in the middle of the region: the nearby search is measured for them.
				const home =
					i === 0
						? roundToKilometre({ lat: w.REGION.lat, lng: w.REGION.lng })
						: roundToKilometre({ lat: w.REGION.lat + between(-1, 1) * w.REGION.halfLat, lng: w.REGION.lng + between(-1, 1) * w.REGION.halfLng });
				const role = i >= 1 && i <= SIZES.judges ? ('judge' as const) : i >= 7 && i <= 8 ? ('admin' as const) : ('member' as const);
				const id = randomUUID();
				const name = `${given} ${family}`;
				members.push({ id, role, lat: home.lat, lng: home.lng, name });
				return {
					id,
					email: `${given}.${family}.${i}@${w.BENCH_CLUB_DOMAIN}`.toLowerCase(),
					emailVerified: new Date(today - 400 * DAY),
					displayName: name,
					role,
					homeLat: home.lat,
					homeLng: home.lng,
					homeAreaId: rnd() < 0.3 ? pick(areaIds) : null,
					units: rnd() < 0.8 ? ('metric' as const) : rnd() < 0.5 ? ('us' as const) : ('imperial' as const),
					createdAt: new Date(today - int(30, 700) * DAY)
				};
			});
			await insertAll(users, rows);
			return rows;
		}
	);
	const judges = members.filter((m) => m.role === 'judge');
	// The member whose dashboard is measured, and the one whose tank is the busiest.
	const dashboardMember = members[10]!;
	const busiestKeeper = members[11]!;

	const plantIds = (await db.select({ id: species.id, name: species.scientificName }).from(species).where(eq(species.kind, 'plant'))).map((r) => r);
	const animalIds = (
		await db
			.select({ id: species.id, name: species.scientificName })
			.from(species)
			.where(sql`${species.kind} <> 'plant'`)
	).map((r) => r);

	// --- Tanks and their lists ---------------------------------------------------------------
	interface Tank {
		id: number;
		ownerId: string;
		visibility: 'public' | 'club' | 'private';
		litres: number;
		setUp: number;
	}
	const tankList: Tank[] = [];
	await timed(
		'tanks with lights, filters, plants, livestock, schedule',
		() => tankList.length,
		async () => {
			const owners = [...members.map((m) => m.id), ...Array.from({ length: SIZES.tanks - members.length }, () => pick(members).id)];
			const rows = owners.map((ownerId, i) => {
				const l = pick([30, 45, 60, 60, 75, 90, 120]);
				const wd = Math.round(l * between(0.4, 0.6));
				const h = Math.round(l * between(0.5, 0.7));
				const litres = Math.round((l * wd * h) / 1000);
				const setUp = today - int(40, 900) * DAY;
				const visibility = i === 0 ? ('public' as const) : rnd() < 0.2 ? ('public' as const) : rnd() < 0.88 ? ('club' as const) : ('private' as const);
				return {
					ownerId: i === 0 ? busiestKeeper.id : ownerId,
					name: `${pick(w.TANK_WORDS_A)} ${pick(w.TANK_WORDS_B)}`,
					style: pick(w.STYLES),
					setUpOn: dayOf(new Date(setUp)),
					lengthCm: l,
					widthCm: wd,
					heightCm: h,
					glassMm: l >= 90 ? 10 : 6,
					substrateKind: pick(['nutrient-soil', 'sand', 'gravel']),
					substrateDepthCm: int(3, 8),
					hardscape: pick(['', 'grey stone', 'branching wood', 'lava rock and wood']),
					co2Method: pick(['none', 'liquid', 'pressurised'] as const),
					description: rnd() < 0.6 ? markdownBody() : null,
					visibility,
					volumeLitres: litres,
					activityAt: new Date(today - int(0, 60) * DAY),
					createdAt: new Date(setUp)
				};
			});
			const ids = await insertAll(tanks, rows);
			rows.forEach((r, i) =>
				tankList.push({ id: ids[i]!, ownerId: r.ownerId, visibility: r.visibility, litres: r.volumeLitres, setUp: Date.parse(r.setUpOn) })
			);
			await insertAll(
				tankLights,
				tankList.map((t) => ({ tankId: t.id, label: 'LED bar', watts: int(10, 80), hoursPerDay: pick([6, 6.5, 7, 7.5, 8]) }))
			);
			await insertAll(
				tankFilters,
				tankList.map((t) => ({ tankId: t.id, label: 'Canister', ratedFlow: t.litres * int(4, 8), flowUnit: 'lph' as const }))
			);
			await insertAll(
				tankPlants,
				tankList.flatMap((t) =>
					Array.from({ length: 3 }, (_, k) => {
						const s = pick(plantIds);
						return { tankId: t.id, position: k, speciesId: s.id, name: s.name, placement: pick(['foreground', 'midground', 'background'] as const) };
					})
				)
			);
			await insertAll(
				tankLivestock,
				tankList.flatMap((t) =>
					Array.from({ length: 2 }, (_, k) => {
						const s = pick(animalIds);
						return { tankId: t.id, position: k, speciesId: s.id, name: s.name, count: int(1, 15) };
					})
				)
			);
			await insertAll(
				maintenanceTasks,
				tankList.flatMap((t) => [
					{
						tankId: t.id,
						kind: 'water-change' as const,
						label: 'Water change',
						intervalDays: 7,
						lastDoneOn: dayOf(new Date(today - int(0, 10) * DAY)),
						position: 0
					},
					{
						tankId: t.id,
						kind: 'filter-clean' as const,
						label: 'Clean the filter',
						intervalDays: 30,
						lastDoneOn: dayOf(new Date(today - int(0, 40) * DAY)),
						position: 1
					}
				])
			);
		}
	);
	const busiest = tankList[0]!;

	// --- Journal entries with events, water tests, comments, admires, follows ----------------
	const entryList: { id: number; tankId: number; on: number }[] = [];
	await timed(
		'journal entries with events',
		() => entryList.length,
		async () => {
			const counts = new Map<number, number>([[busiest.id, SIZES.busiestEntries]]);
			const rest = tankList.slice(1);
			for (let i = 0; i < SIZES.entries - SIZES.busiestEntries; i++) {
				const t = rest[i % rest.length]!;
				counts.set(t.id, (counts.get(t.id) ?? 0) + 1);
			}
			const byId = new Map(tankList.map((t) => [t.id, t]));
			const rows: (typeof journalEntries.$inferInsert)[] = [];
			for (const [tankId, n] of counts) {
				const t = byId.get(tankId)!;
				const span = Math.max(1, Math.floor((today - t.setUp) / DAY));
				for (let k = 0; k < n; k++) {
					const on = t.setUp + Math.floor(((k + 0.5) / n) * span) * DAY;
					rows.push({
						tankId,
						authorId: t.ownerId,
						entryOn: dayOf(new Date(on)),
						title: pick(w.ENTRY_TITLES),
						body: markdownBody(),
						createdAt: new Date(on + 20 * 3_600_000)
					});
				}
			}
			const ids = await insertAll(journalEntries, rows, 1000);
			rows.forEach((r, i) => entryList.push({ id: ids[i]!, tankId: r.tankId, on: Date.parse(r.entryOn) }));
			const events = entryList.flatMap((e) =>
				Array.from({ length: int(1, 2) }, (_, position) => {
					const kind = pick(['water-change', 'water-change', 'trim', 'dose', 'filter-clean', 'glass', 'note', 'algae'] as const);
					return {
						tankId: e.tankId,
						entryId: e.id,
						kind,
						occurredOn: dayOf(new Date(e.on)),
						position,
						percent: kind === 'water-change' ? pick([20, 25, 30, 40, 50]) : null,
						what: kind === 'trim' ? 'background stems' : kind === 'dose' ? 'macro mix' : '',
						amount: kind === 'dose' ? pick([2, 5, 10]) : null,
						amountUnit: kind === 'dose' ? ('mL' as const) : null,
						filterPart: kind === 'filter-clean' ? pick(['prefilter', 'media', 'impeller'] as const) : null,
						algaeKind: kind === 'algae' ? pick(['green-dust', 'green-spots', 'threads'] as const) : null,
						note: kind === 'note' ? pick(w.SENTENCES) : ''
					};
				})
			);
			await insertAll(journalEvents, events, 2000);
		}
	);

	await timed(
		'water tests',
		() => SIZES.waterTests,
		async () => {
			const rows: (typeof waterTests.$inferInsert)[] = [];
			const busiestTests = 400;
			for (let i = 0; i < SIZES.waterTests; i++) {
				const t = i < busiestTests ? busiest : tankList[1 + (i % (tankList.length - 1))]!;
				const k = i < busiestTests ? i : Math.floor(i / (tankList.length - 1));
				const on = Math.min(today, t.setUp + k * 7 * DAY);
				rows.push({
					tankId: t.id,
					testedOn: dayOf(new Date(on)),
					ph: round(between(6.2, 7.6), 0.1),
					kh: round(between(2, 8), 0.5),
					gh: round(between(4, 12), 0.5),
					no3: round(between(5, 30), 1),
					po4: round(between(0.2, 2), 0.1),
					temperatureC: round(between(22, 27), 0.5),
					ammonia: rnd() < 0.3 ? round(between(0, 0.5), 0.05) : null
				});
			}
			await insertAll(waterTests, rows, 2000);
		}
	);

	await timed(
		'comments, admires and follows',
		() => SIZES.comments,
		async () => {
			const busiestEntries = entryList.filter((e) => e.tankId === busiest.id);
			const rows = Array.from({ length: SIZES.comments }, (_, i) => {
				const e = i < 600 ? busiestEntries[i % busiestEntries.length]! : pick(entryList);
				return { entryId: e.id, authorId: pick(members).id, body: pick(w.COMMENTS), createdAt: new Date(e.on + int(1, 5) * DAY) };
			});
			await insertAll(entryComments, rows, 2000);
			const admires = new Map<string, { tankId: number; userId: string }>();
			for (let i = 0; i < 20_000; i++) {
				const t = i < 300 ? busiest : pick(tankList);
				const u = pick(members).id;
				admires.set(`${t.id}|${u}`, { tankId: t.id, userId: u });
			}
			await insertAll(tankAdmires, [...admires.values()], 2000);
			const follows = new Map<string, { tankId: number; userId: string }>();
			const visible = tankList.filter((t) => t.visibility !== 'private');
			for (let i = 0; i < 40; i++) {
				const t = i === 0 ? busiest : pick(visible);
				follows.set(`${t.id}|${dashboardMember.id}`, { tankId: t.id, userId: dashboardMember.id });
			}
			for (let i = 0; i < 8000; i++) {
				const t = pick(visible);
				const u = pick(members).id;
				follows.set(`${t.id}|${u}`, { tankId: t.id, userId: u });
			}
			await insertAll(tankFollows, [...follows.values()], 2000);
		}
	);

	// --- Swap board ----------------------------------------------------------------------------
	const listingList: { id: number; ownerId: string; state: string }[] = [];
	let longThreadId = 0;
	await timed(
		'swap listings and conversations',
		() => SIZES.listings,
		async () => {
			const categories = ['plants', 'plants', 'plants', 'livestock', 'hardscape', 'equipment'] as const;
			const rows = Array.from({ length: SIZES.listings }, () => {
				const owner = pick(members);
				const category = pick(categories);
				const state = rnd() < 0.72 ? ('open' as const) : pick(['reserved', 'handed-over', 'withdrawn', 'expired'] as const);
				const created = now.getTime() - int(0, 40) * DAY - int(0, 23) * 3_600_000;
				return {
					ownerId: owner.id,
					kind: rnd() < 0.8 ? ('offer' as const) : ('wanted' as const),
					category,
					title: pick(w.LISTING_TITLES[category]),
					quantityAmount: int(1, 20),
					quantityUnit:
						category === 'plants' ? pick(['stems', 'portions', 'pots'] as const) : category === 'livestock' ? ('individuals' as const) : ('pieces' as const),
					description: rnd() < 0.5 ? pick(w.SENTENCES) : null,
					terms: pick(['free', 'free', 'swap', 'token'] as const),
					lat: owner.lat,
					lng: owner.lng,
					state,
					availableUntil: new Date(state === 'expired' ? now.getTime() - int(1, 10) * DAY : now.getTime() + int(3, 30) * DAY),
					createdAt: new Date(created)
				};
			});
			const ids = await insertAll(listings, rows);
			rows.forEach((r, i) => listingList.push({ id: ids[i]!, ownerId: r.ownerId, state: r.state }));
			await insertAll(
				listingEvents,
				rows.map((r, i) => ({ listingId: ids[i]!, action: 'create', actorId: r.ownerId, toState: 'open' as const, at: r.createdAt }))
			);

			const open = listingList.filter((l) => l.state === 'open');
			const threads = new Map<string, { listingId: number; ownerId: string; requesterId: string }>();
			while (threads.size < SIZES.conversations) {
				const l = pick(open);
				const requester = threads.size === 0 ? dashboardMember : pick(members);
				if (requester.id === l.ownerId) continue;
				threads.set(`${l.id}|${requester.id}`, { listingId: l.id, ownerId: l.ownerId, requesterId: requester.id });
			}
			const threadRows = [...threads.values()].map((t) => ({ ...t, lastMessageAt: now, createdAt: new Date(now.getTime() - 20 * DAY) }));
			const threadIds = await insertAll(swapThreads, threadRows);
			longThreadId = threadIds[0]!;
			const messages: (typeof swapMessages.$inferInsert)[] = [];
			threadRows.forEach((t, i) => {
				const n = i === 0 ? SIZES.longConversation : int(2, 8);
				const start = now.getTime() - 20 * DAY;
				for (let k = 0; k < n; k++) {
					const fromRequester = k % 2 === 0;
					const at = new Date(start + Math.floor(((k + 1) / (n + 1)) * 19 * DAY));
					messages.push({
						threadId: threadIds[i]!,
						senderId: fromRequester ? t.requesterId : t.ownerId,
						recipientId: fromRequester ? t.ownerId : t.requesterId,
						kind: 'text',
						body: w.MESSAGES[k % w.MESSAGES.length]!,
						createdAt: at,
						readAt: k < n - 1 ? at : null,
						notifiedAt: at
					});
				}
			});
			await insertAll(swapMessages, messages, 2000);
			await db.execute(
				sql`UPDATE swap_thread t SET last_message_at = (SELECT MAX(m.created_at) FROM swap_message m WHERE m.thread_id = t.id) WHERE t.id >= ${threadIds[0]!}`
			);
		}
	);

	// --- Contests ------------------------------------------------------------------------------
	let judgingContestId = 0;
	const contestEntryIds = new Map<number, { id: number; ownerId: string }[]>();
	let benchContestId = 0;
	await timed(
		'contests with entries, panels and cards',
		() => SIZES.contests * SIZES.entriesPerContest,
		async () => {
			for (let c = 0; c < SIZES.contests; c++) {
				// The last contests are still running: one being judged, one open, one a draft.
				const state =
					c === SIZES.contests - 1 ? 'draft' : c === SIZES.contests - 2 ? 'open' : c === SIZES.contests - 3 ? 'judging' : c < 3 ? 'archived' : 'published';
				const age = (SIZES.contests - c) * 40;
				const opens = state === 'open' || state === 'draft' ? today - 5 * DAY : today - age * DAY;
				const closes = state === 'open' || state === 'draft' ? today + 20 * DAY : opens + 20 * DAY;
				const judgingOpens = state === 'judging' ? today - 3 * DAY : closes + DAY;
				const judgingCloses = state === 'judging' ? today + 10 * DAY : judgingOpens + 14 * DAY;
				const [contest] = (await db.insert(contests).values({
					title: `Greyreach layout contest ${2020 + Math.floor(c / 6)}-${(c % 6) + 1}`,
					rules: 'Enter one tank you keep yourself. Judges score blind on the rubric below; the photos must be of the tank as it is now.',
					state,
					entryOpensOn: dayOf(new Date(opens)),
					entryClosesOn: dayOf(new Date(closes)),
					judgingOpensOn: dayOf(new Date(judgingOpens)),
					judgingClosesOn: dayOf(new Date(judgingCloses)),
					aggregation: 'trimmed-mean',
					createdBy: members[7]!.id,
					openedAt: new Date(opens),
					judgingStartedAt: state === 'judging' || state === 'published' || state === 'archived' ? new Date(judgingOpens) : null,
					publishedAt: state === 'published' || state === 'archived' ? new Date(judgingCloses) : null,
					archivedAt: state === 'archived' ? new Date(judgingCloses + 30 * DAY) : null,
					resultsRevision: state === 'published' || state === 'archived' ? 1 : 0,
					announcedRevision: state === 'published' || state === 'archived' ? 1 : null
				})) as unknown as [{ insertId: number }];
				const contestId = contest.insertId;
				if (state === 'judging') judgingContestId = contestId;
				if (state === 'published') benchContestId = contestId;
				const criterionIds = await insertAll(
					contestCriteria,
					w.CRITERIA.map((k, i) => ({ contestId, position: i, label: k.label, maxPoints: k.max, weight: k.weight, tieBreakRank: i + 1 }))
				);
				const [category] = (await db.insert(contestCategories).values({ contestId, position: 0, name: 'Open layouts' })) as unknown as [{ insertId: number }];
				await insertAll(
					contestJudges,
					judges.map((j) => ({ contestId, judgeId: j.id }))
				);
				// One tank per entrant, a hundred entrants drawn from the members who are not judges.
				const entrants = new Set<string>();
				const chosen: Tank[] = [];
				while (chosen.length < SIZES.entriesPerContest) {
					const t = pick(tankList);
					if (entrants.has(t.ownerId) || judges.some((j) => j.id === t.ownerId) || t.visibility === 'private') continue;
					entrants.add(t.ownerId);
					chosen.push(t);
				}
				const numbers = state === 'open' || state === 'draft' ? null : shuffled(SIZES.entriesPerContest);
				const entryIds = await insertAll(
					contestEntries,
					chosen.map((t, i) => ({
						contestId,
						categoryId: category.insertId,
						entrantId: t.ownerId,
						tankId: t.id,
						number: numbers ? numbers[i]! : null,
						statement: pick(w.STATEMENTS),
						litres: t.litres,
						volumeSource: 'estimated' as const,
						ageWeeks: Math.floor((opens - t.setUp) / (7 * DAY)),
						createdAt: new Date(opens + DAY)
					}))
				);
				contestEntryIds.set(
					contestId,
					entryIds.map((id, i) => ({ id, ownerId: chosen[i]!.ownerId }))
				);
				if (state === 'draft' || state === 'open') continue;
				// One declared conflict per contest.
				await db.insert(contestConflicts).values({ entryId: entryIds[c % entryIds.length]!, judgeId: judges[c % judges.length]!.id, reason: 'A neighbour' });
				const cards: (typeof contestCards.$inferInsert)[] = [];
				const quality = entryIds.map(() => between(0.3, 0.9));
				judges.forEach((judge, j) => {
					const bias = between(-0.05, 0.05);
					entryIds.forEach((entryId, e) => {
						if (e === c % entryIds.length && j === c % judges.length) return;
						const judging = state === 'judging';
						// In the contest being judged, the first judge has every card, the others about half.
						if (judging && j > 0 && rnd() < 0.5) return;
						const fields: CardFields = {
							scores: Object.fromEntries(
								criterionIds.map((id, k) => [
									String(id),
									Math.min(w.CRITERIA[k]!.max, Math.max(0, round((quality[e]! + bias + between(-0.1, 0.1)) * w.CRITERIA[k]!.max, SCORE_STEP)))
								])
							),
							comments: Object.fromEntries(criterionIds.map((id) => [String(id), rnd() < 0.3 ? pick(w.COMMENTS) : ''])),
							entrantComment: pick(w.STATEMENTS),
							panelNote: ''
						};
						const submitted = !judging || rnd() < 0.7;
						const at = new Date(judgingOpens + int(0, 10) * DAY);
						cards.push({
							contestId,
							entryId,
							judgeId: judge.id,
							status: submitted ? 'submitted' : 'draft',
							fields,
							version: int(1, 6),
							updatedAt: at,
							submittedAt: submitted ? at : null
						});
					});
				});
				await insertAll(contestCards, cards, 1000);
			}
		}
	);

	// --- Photos --------------------------------------------------------------------------------
	await timed(
		'photos (renditions through the media pipeline, stored in the bucket)',
		() => SIZES.photos,
		async () => {
			// A few dozen different pictures go through the real pipeline; each photo row gets its own copy of one of them.
			const variants: PreparedImage[] = [];
			for (let i = 0; i < 24; i++) variants.push(await prepareImage(await drawAquarium(9000 + i, { width: 800, height: 500 })));
			const busiestEntries = entryList.filter((e) => e.tankId === busiest.id).slice(-100);
			const benchEntries = contestEntryIds.get(benchContestId) ?? [];
			const publicTanks = tankList.filter((t) => t.visibility === 'public');
			const owners = new Map(tankList.map((t) => [t.id, t.ownerId]));
			const targets: { scope: string; scopeId: number; ownerId: string }[] = [
				{ scope: 'tank', scopeId: busiest.id, ownerId: busiest.ownerId },
				...busiestEntries.map((e) => ({ scope: 'entry', scopeId: e.id, ownerId: busiest.ownerId })),
				...benchEntries.map((e) => ({ scope: 'contest-entry', scopeId: e.id, ownerId: e.ownerId })),
				...publicTanks.slice(1, 701).map((t) => ({ scope: 'tank', scopeId: t.id, ownerId: t.ownerId })),
				...listingList.slice(0, 400).map((l) => ({ scope: 'listing', scopeId: l.id, ownerId: l.ownerId }))
			];
			while (targets.length < SIZES.photos) {
				const e = pick(entryList);
				targets.push({ scope: 'entry', scopeId: e.id, ownerId: owners.get(e.tankId)! });
			}
			targets.length = SIZES.photos;
			const bucket = bucketStore();
			const limit = pLimit(16);
			const rows = targets.map((t, i) => {
				const prepared = variants[i % variants.length]!;
				return {
					ownerId: t.ownerId,
					scope: t.scope,
					scopeId: t.scopeId,
					storageKey: `u/${t.ownerId}/${randomUUID()}`,
					uploadBytes: 80_000,
					byteSize: prepared.renditions.reduce((s, r) => s + r.data.byteLength, 0),
					width: prepared.width,
					height: prepared.height,
					renditions: Object.fromEntries(prepared.renditions.map((r) => [r.size, { width: r.width, height: r.height, bytes: r.data.byteLength }])) as never,
					altText: 'A planted tank seen from the front',
					attachedAt: now,
					prepared
				};
			});
			await Promise.all(
				rows.flatMap((r) =>
					r.prepared.renditions.map((rendition) => limit(() => bucket.put(objectKey(r.storageKey, rendition.size), rendition.data, 'image/webp')))
				)
			);
			await insertAll(
				media,
				rows.map(({ prepared: _, ...row }) => row)
			);
		}
	);

	// The bulk rows above carry markdown without its stored HTML; render it as the migration runner
	// does for rows written by SQL.
	await timed(
		'stored markdown HTML',
		() => SIZES.entries + SIZES.comments,
		() => renderStoredMarkdown(pool)
	);

	await db.execute(
		sql`ANALYZE TABLE tank, journal_entry, journal_event, water_test, entry_comment, listing, swap_thread, swap_message, contest_entry, contest_card, media`
	);
	await db.insert(seedRuns).values({ name: `${BENCH_SEED_MARKER}:${fingerprint.slice(0, 40)}`, ranAt: new Date() });

	const total = performance.now() - started;
	console.log(
		JSON.stringify({
			totalMs: Math.round(total),
			steps: timings.map((t) => ({ ...t, ms: Math.round(t.ms) })),
			rows: memberRows.length,
			busiestTankId: busiest.id,
			judgingContestId,
			longThreadId
		})
	);
} finally {
	await close();
}

function shuffled(n: number): number[] {
	const list = Array.from({ length: n }, (_, i) => i + 1);
	for (let i = n - 1; i > 0; i--) {
		const j = Math.floor(rnd() * (i + 1));
		[list[i], list[j]] = [list[j]!, list[i]!];
	}
	return list;
}
