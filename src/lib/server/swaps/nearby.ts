// The nearby search: open listings near the viewer, for the board. The search never scans every
// listing in JavaScript: SQL pre-filters on the bounding box of the radius (indexed state, lat,
// lng of the listing, two longitude ranges across ±180°, every longitude near a pole), computes
// the haversine distance once for each row in the box, turns it into the figure members are shown
// ($lib/swaps/display) and filters and orders by that figure alone (then newest first), and pages
// with LIMIT/OFFSET. The exact distance never leaves this query: what a member can learn by moving
// their own point is the shown figures and nothing finer. Without a location the board is newest
// first. The query reads the listing table alone; the names on the cards come afterwards, a batch
// per page (listing-cards.ts).
import { and, count, desc, eq, gt, inArray, like, notExists, notInArray, or, sql, type AnyColumn, type SQL } from 'drizzle-orm';
import { db as appDb } from '../db';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as users from '../club/users';
import * as suspension from '../club/suspension';
import * as matching from '../species/matching';
import type { LatLng } from '../../club/location';
import { boundingBox, MEAN_EARTH_RADIUS_M } from '../../swaps/distance';
import { bandsInMetres, labelOf, radiusReachMetres, type DistanceUnit } from '../../swaps/display';
import { distanceUnitOf } from '../../journals/calc/units';
import { BOARD_PAGE_SIZE, pageCount, type BoardFilter } from '../../swaps/board-filter';
import type { BoardPage } from '../../swaps/listing-card';
import { listings, memberBlocks } from './schema';
import { cardColumns, toCards } from './listing-cards';

/** The viewer's stored (rounded) point, or null when they have not set one. */
async function viewerPoint(viewerId: string, context: Context): Promise<LatLng | null> {
	const row = await users.getById(viewerId, { db: context.db });
	return row && row.homeLat !== null && row.homeLng !== null ? { lat: row.homeLat, lng: row.homeLng } : null;
}

/** A number as an exact SQL decimal literal, so comparisons with the DECIMAL columns can use their index. */
const decimal = (n: number) => {
	if (!Number.isFinite(n)) throw new RangeError('Not a finite number.');
	return sql.raw(n.toFixed(9));
};

/**
 * Great-circle distance in metres from `point` to the listing, by the haversine formula on the
 * IUGG mean radius, written as $lib/swaps/distance's centralAngle is (same operations in the
 * same order), with the argument of ASIN clamped to 1.
 */
export function distanceSql(point: LatLng): SQL<number> {
	const lat = decimal(point.lat);
	const lng = decimal(point.lng);
	return sql<number>`(${decimal(MEAN_EARTH_RADIUS_M)} * (2 * ASIN(LEAST(1, SQRT(POW(SIN((RADIANS(${listings.lat}) - RADIANS(${lat})) / 2), 2) + COS(RADIANS(${lat})) * COS(RADIANS(${listings.lat})) * POW(SIN(RADIANS(${listings.lng} - ${lng}) / 2), 2))))))`;
}

/** The pre-filter: latitude and longitude limits of the circle, on the listing's own columns. */
export function boxSql(point: LatLng, radiusMetres: number): SQL {
	const box = boundingBox(point, radiusMetres);
	const lat = sql`${listings.lat} BETWEEN ${decimal(box.minLat)} AND ${decimal(box.maxLat)}`;
	if (box.coversPole || (box.lngRanges.length === 1 && box.lngRanges[0]!.min <= -180 && box.lngRanges[0]!.max >= 180)) return lat;
	const ranges = box.lngRanges.map((r) => sql`${listings.lng} BETWEEN ${decimal(r.min)} AND ${decimal(r.max)}`);
	return sql`${lat} AND (${sql.join(ranges, sql` OR `)})`;
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => '\\' + c);

/**
 * The figure members are shown for a distance `d` in metres, in `unit` (kilometres or miles), as
 * $lib/swaps/display's shownFigure computes it (the same bands, the same literals, the same
 * operations): 0 for "under 2", else FLOOR((d + half step) / step) * step in the band of `d`.
 */
export function shownSql(d: SQL | SQL.Aliased | AnyColumn, unit: DistanceUnit): SQL<number> {
	const cases = bandsInMetres(unit).map(({ belowMetres, step, stepMetres, halfStepMetres }) => {
		const figure = step === 0 ? sql`0` : sql`FLOOR((${d} + ${decimal(halfStepMetres)}) / ${decimal(stepMetres)}) * ${sql.raw(String(step))}`;
		return Number.isFinite(belowMetres) ? sql`WHEN ${d} < ${decimal(belowMetres)} THEN ${figure}` : sql`ELSE ${figure}`;
	});
	return sql<number>`(CASE ${sql.join(cases, sql` `)} END)`;
}

/**
 * Every condition of the board on the listing itself for this viewer and filter. From a point with
 * a radius, that is the bounding box of the radius's reach (every distance still shown within the
 * radius); the shown figure itself is compared on the derived table (see `nearbyQuery`). Words
 * searched for match the title, the species name on the listing, or the catalogue's common name
 * of its species (looked up first, in the catalogue).
 */
export async function boardWhere(viewer: Pick<Viewer, 'id' | 'units'>, filter: BoardFilter, point: LatLng | null, context: Context = {}): Promise<SQL> {
	const { now } = resolve(context);
	const conditions: (SQL | undefined)[] = [eq(listings.state, 'open'), gt(listings.availableUntil, now)];
	if (point && filter.radius !== null) conditions.push(boxSql(point, radiusReachMetres(filter.radius, distanceUnitOf(viewer.units))));
	if (filter.category) conditions.push(eq(listings.category, filter.category));
	if (filter.kind) conditions.push(eq(listings.kind, filter.kind));
	if (filter.speciesId !== null) conditions.push(eq(listings.speciesId, filter.speciesId));
	if (filter.q) {
		const pattern = `%${escapeLike(filter.q)}%`;
		const commonNamed = await matching.idsWithCommonName(filter.q, context);
		conditions.push(
			or(like(listings.title, pattern), like(listings.speciesName, pattern), commonNamed.length ? inArray(listings.speciesId, commonNamed) : undefined)
		);
	}
	// A suspended member's listings leave the board until they are reinstated.
	const suspended = await suspension.suspendedIds(context);
	if (suspended.length) conditions.push(notInArray(listings.ownerId, suspended));
	// Listings of members the viewer has blocked are hidden from them.
	conditions.push(
		notExists(
			appDb
				.select({ one: sql`1` })
				.from(memberBlocks)
				.where(and(eq(memberBlocks.blockerId, viewer.id), eq(memberBlocks.blockedId, listings.ownerId)))
		)
	);
	return and(...conditions)!;
}

/**
 * The board from a point: its listings with their card columns and distance as a derived table
 * (so the distance is computed once per row), their shown figure, and the radius as a condition
 * on that figure.
 */
function fromPoint(where: SQL, point: LatLng, radius: BoardFilter['radius'], unit: DistanceUnit, context: Context) {
	const { db } = resolve(context);
	const inner = db
		.select({ ...cardColumns, distance: sql<number>`${distanceSql(point)}`.as('distance') })
		.from(listings)
		.where(where)
		.as('nearby');
	const shown = shownSql(inner.distance, unit);
	return { inner, shown, within: radius === null ? undefined : sql`${shown} <= ${sql.raw(String(radius))}` };
}

/**
 * One page of the board from a point, for the conditions of `boardWhere`: by shown figure, then
 * newest first, never by the exact distance (also used by the benchmark to EXPLAIN it).
 */
export function nearbyQuery(where: SQL, point: LatLng, filter: Pick<BoardFilter, 'radius' | 'page'>, unit: DistanceUnit, context: Context = {}) {
	const { db } = resolve(context);
	const { inner, shown, within } = fromPoint(where, point, filter.radius, unit, context);
	// The card columns of the derived table (a subquery's fields are only reached through it, one by one).
	const columns = Object.fromEntries(Object.keys(cardColumns).map((key) => [key, inner[key as keyof typeof cardColumns]])) as Pick<
		typeof inner,
		keyof typeof cardColumns
	>;
	return (
		db
			// The count of every row that qualifies comes with the page (a window over the whole result,
			// taken before LIMIT), so the distances are computed once, not again for a separate count.
			.select({ ...columns, shown: sql<number>`${shown}`.mapWith(Number).as('shown'), matching: sql<number>`COUNT(*) OVER ()`.mapWith(Number).as('matching') })
			.from(inner)
			.where(within)
			.orderBy(sql`shown`, desc(inner.createdAt), desc(inner.id))
			.limit(BOARD_PAGE_SIZE)
			.offset((filter.page - 1) * BOARD_PAGE_SIZE)
	);
}

/** One page of the board without a location: newest first. */
function newestQuery(where: SQL, page: number, context: Context) {
	const { db } = resolve(context);
	return db
		.select(cardColumns)
		.from(listings)
		.where(where)
		.orderBy(desc(listings.createdAt), desc(listings.id))
		.limit(BOARD_PAGE_SIZE)
		.offset((page - 1) * BOARD_PAGE_SIZE);
}

/** How many listings the board has for these conditions, counted as the page query selects them. */
async function total(where: SQL, point: LatLng | null, radius: BoardFilter['radius'], unit: DistanceUnit, context: Context): Promise<number> {
	const { db } = resolve(context);
	if (point) {
		const { inner, within } = fromPoint(where, point, radius, unit, context);
		const [row] = await db.select({ n: count() }).from(inner).where(within);
		return row?.n ?? 0;
	}
	const [row] = await db.select({ n: count() }).from(listings).where(where);
	return row?.n ?? 0;
}

/**
 * One page of the board for the viewer: nearest first by the shown figure when they have a location,
 * with distances and the radius in the viewer's unit (kilometres, or miles for US and imperial members).
 */
export async function search(viewer: Pick<Viewer, 'id' | 'units'>, filter: BoardFilter, context: Context = {}): Promise<BoardPage> {
	const { db, now } = resolve(context);
	const at = { ...context, db, now };
	const unit = distanceUnitOf(viewer.units);
	const point = await viewerPoint(viewer.id, at);
	const where = await boardWhere(viewer, filter, point, at);
	let rows: (Awaited<ReturnType<typeof nearbyQuery>>[number] | Awaited<ReturnType<typeof newestQuery>>[number])[];
	let n: number;
	if (point) {
		rows = await nearbyQuery(where, point, filter, unit, at);
		// A page past the end has no row to carry the count.
		n = rows.length ? (rows[0] as { matching: number }).matching : filter.page > 1 ? await total(where, point, filter.radius, unit, at) : 0;
	} else {
		[rows, n] = await Promise.all([newestQuery(where, filter.page, at), total(where, null, filter.radius, unit, at)]);
	}
	const cards = await toCards(rows, viewer, at);
	return {
		rows: cards.map((card, i) => {
			const row = rows[i]!;
			return { ...card, distance: 'shown' in row ? labelOf(row.shown, unit) : null };
		}),
		total: n,
		page: filter.page,
		pages: pageCount(n),
		order: point ? 'distance' : 'newest'
	};
}
