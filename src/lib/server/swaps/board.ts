// The board: open listings near the viewer. The search never scans every listing in JavaScript:
// SQL pre-filters on the bounding box of the radius (indexed state, lat, lng of the listing,
// two longitude ranges across ±180°, every longitude near a pole), computes the exact haversine
// distance for the rows in the box, filters and orders by it, and pages with LIMIT/OFFSET.
// Without a location the board is newest first.
import { and, count, desc, eq, gt, like, notExists, or, sql, type SQL } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { clubAreas, users } from '../club/schema';
import type { Viewer } from '../club/users';
import { species } from '../species/schema';
import type { LatLng } from '../../club/location';
import { boundingBox, MEAN_EARTH_RADIUS_M } from '../../swaps/distance';
import { formatDistance } from '../../swaps/display';
import { BOARD_PAGE_SIZE, pageCount, type BoardFilter } from '../../swaps/board';
import { listings, memberBlocks } from './schema';
import { cardColumns, toCards, type ListingCard } from './listings';

export interface BoardPage {
	rows: ListingCard[];
	total: number;
	page: number;
	pages: number;
	/** 'distance' when the viewer has a location, else 'newest'. */
	order: 'distance' | 'newest';
}

/** The viewer's stored (rounded) point, or null when they have not set one. */
export async function viewerPoint(viewerId: string, database: DbOrTx = appDb): Promise<LatLng | null> {
	const [row] = await database.select({ lat: users.homeLat, lng: users.homeLng }).from(users).where(eq(users.id, viewerId));
	return row && row.lat !== null && row.lng !== null ? { lat: row.lat, lng: row.lng } : null;
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

/** Every condition of the board for this viewer and filter (the radius only with a point). */
export function boardWhere(viewer: Pick<Viewer, 'id'>, filter: BoardFilter, now: Date, point: LatLng | null): SQL {
	const conditions: (SQL | undefined)[] = [eq(listings.state, 'open'), gt(listings.availableUntil, now)];
	if (point && filter.radiusKm !== null) {
		const metres = filter.radiusKm * 1000;
		conditions.push(boxSql(point, metres), sql`${distanceSql(point)} <= ${decimal(metres)}`);
	}
	if (filter.category) conditions.push(eq(listings.category, filter.category));
	if (filter.kind) conditions.push(eq(listings.kind, filter.kind));
	if (filter.speciesId !== null) conditions.push(eq(listings.speciesId, filter.speciesId));
	if (filter.q) {
		const pattern = `%${escapeLike(filter.q)}%`;
		conditions.push(or(like(listings.title, pattern), like(listings.speciesName, pattern), like(species.commonName, pattern)));
	}
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

/** The page query itself (also used by the benchmark to EXPLAIN it). */
export function boardQuery(database: DbOrTx, viewer: Pick<Viewer, 'id'>, filter: BoardFilter, now: Date, point: LatLng | null) {
	const distance = point ? distanceSql(point) : sql<null>`NULL`;
	return database
		.select({ ...cardColumns, distance: sql<number | null>`${distance}`.as('distance') })
		.from(listings)
		.innerJoin(users, eq(users.id, listings.ownerId))
		.leftJoin(clubAreas, eq(clubAreas.id, listings.pickupAreaId))
		.leftJoin(species, eq(species.id, listings.speciesId))
		.where(boardWhere(viewer, filter, now, point))
		.orderBy(...(point ? [sql`distance`, desc(listings.id)] : [desc(listings.createdAt), desc(listings.id)]))
		.limit(BOARD_PAGE_SIZE)
		.offset((filter.page - 1) * BOARD_PAGE_SIZE);
}

/** One page of the board for the viewer, nearest first when they have a location. */
export async function search(viewer: Pick<Viewer, 'id'>, filter: BoardFilter, options: { now?: Date; database?: DbOrTx } = {}): Promise<BoardPage> {
	const database = options.database ?? appDb;
	const now = options.now ?? new Date();
	const point = await viewerPoint(viewer.id, database);
	const [rows, [totalRow]] = await Promise.all([
		boardQuery(database, viewer, filter, now, point),
		database
			.select({ n: count() })
			.from(listings)
			.leftJoin(species, eq(species.id, listings.speciesId))
			.where(boardWhere(viewer, filter, now, point))
	]);
	const cards = await toCards(rows, viewer, now, database);
	const total = totalRow?.n ?? 0;
	return {
		rows: cards.map((card, i) => {
			const metres = rows[i]!.distance;
			return { ...card, distance: metres === null ? null : formatDistance(Number(metres)) };
		}),
		total,
		page: filter.page,
		pages: pageCount(total),
		order: point ? 'distance' : 'newest'
	};
}
