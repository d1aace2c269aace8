// The public gallery: running public tanks, filtered by style and size, sorted and paged.
import { and, count, desc, eq, gte, isNull, lt, sql, type SQL } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import * as media from '../media';
import type { Photo } from '../media';
import * as directory from '../club/directory';
import { UNNAMED_MEMBER } from '../../club/names';
import { VOLUME_BANDS, type ShowcaseSort, type VolumeBand } from '../../journals/showcase-filters';
import { tankAdmires, tanks } from './schema';

export const SHOWCASE_PAGE_SIZE = 12;

export interface ShowcaseFilter {
	style?: string;
	band?: VolumeBand;
	sort: ShowcaseSort;
	page: number;
}

export interface ShowcaseCard {
	id: number;
	name: string;
	style: string;
	volumeLitres: number | null;
	setUpOn: string | null;
	ownerName: string;
	admirers: number;
	activityAt: Date | null;
	cover: Photo | null;
}

const admirers = sql<number>`(SELECT COUNT(*) FROM ${tankAdmires} WHERE ${tankAdmires.tankId} = ${tanks.id})`.mapWith(Number);

export async function list(filter: ShowcaseFilter, context: Context = {}): Promise<{ cards: ShowcaseCard[]; page: number; pages: number; total: number }> {
	const { db: tx } = resolve(context);
	const conditions: SQL[] = [eq(tanks.visibility, 'public'), isNull(tanks.retiredOn)];
	if (filter.style) conditions.push(eq(tanks.style, filter.style));
	if (filter.band) {
		const { min, max } = VOLUME_BANDS[filter.band];
		conditions.push(gte(tanks.volumeLitres, min));
		if (max !== null) conditions.push(lt(tanks.volumeLitres, max));
	}
	const where = and(...conditions);
	const [totalRow] = await tx.select({ n: count() }).from(tanks).where(where);
	const total = totalRow?.n ?? 0;
	const pages = Math.max(1, Math.ceil(total / SHOWCASE_PAGE_SIZE));
	const page = Math.min(Math.max(1, filter.page), pages);
	const order =
		filter.sort === 'admired'
			? [desc(admirers), desc(tanks.activityAt), desc(tanks.id)]
			: filter.sort === 'updated'
				? [desc(tanks.recentAt), desc(tanks.id)]
				: [desc(tanks.createdAt), desc(tanks.id)];
	const rows = await tx
		.select({
			id: tanks.id,
			name: tanks.name,
			style: tanks.style,
			volumeLitres: tanks.volumeLitres,
			setUpOn: tanks.setUpOn,
			ownerId: tanks.ownerId,
			admirers,
			activityAt: tanks.activityAt
		})
		.from(tanks)
		.where(where)
		.orderBy(...order)
		.limit(SHOWCASE_PAGE_SIZE)
		.offset((page - 1) * SHOWCASE_PAGE_SIZE);
	const [covers, owners] = await Promise.all([
		media.listForMany(
			'tank',
			rows.map((r) => r.id),
			context
		),
		directory.names(
			rows.map((r) => r.ownerId),
			context
		)
	]);
	return {
		cards: rows.map(({ ownerId, ...r }) => ({ ...r, ownerName: owners.get(ownerId) ?? UNNAMED_MEMBER, cover: covers.get(r.id)?.[0] ?? null })),
		page,
		pages,
		total
	};
}

/** The styles public tanks give, for the filter (as typed, most used first). */
export async function styles(context: Context = {}): Promise<string[]> {
	const rows = await resolve(context)
		.db.select({ style: tanks.style, n: count() })
		.from(tanks)
		.where(and(eq(tanks.visibility, 'public'), isNull(tanks.retiredOn), sql`${tanks.style} <> ''`))
		.groupBy(tanks.style)
		.orderBy(desc(count()), tanks.style);
	return rows.map((r) => r.style);
}
