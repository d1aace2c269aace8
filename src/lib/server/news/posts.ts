// Club news: admins write a post (markdown, its HTML stored beside it), choose who reads it on the
// site and who gets it by mail, send themselves a test, then publish. Publishing queues one mail
// per recipient through the outbox in the transaction that publishes, with multi-row inserts, in
// the "news" mail category (members who turned club news off are dropped by the outbox). Every
// admin step checks the role itself and is in the audit log.
import { and, count, desc, eq, isNotNull, isNull } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../../club/viewer';
import { assertRole } from '../../club/roles';
import { conflict, notFound } from '../../errors';
import { distanceUnitOf } from '../../journals/calc/units';
import { audienceOf, describeAudience, NEWS_PAGE_SIZE, withinRadius, type Audience, type PostInput } from '../../news/post';
import * as audit from '../audit';
import * as directory from '../club/directory';
import * as areas from '../club/areas';
import * as entrants from '../contests/contest-entries';
import * as contests from '../contests/contests';
import { absoluteUrl } from '../config';
import { renderMarkdown } from '../markdown';
import { enqueue, type QueuedMail } from '../mail/outbox';
import * as preferences from '../mail/preferences';
import { deliverySummary, listOutbox } from '../mail/report';
import { renderMail } from '../mail/templates';
import { newsPosts } from './schema';

type PostRow = typeof newsPosts.$inferSelect;

const subject = (id: number) => ({ type: 'news', id });
/** Every mail of a post is under this topic; the admin's test copies under `news:<id>:test`. */
export const postTopic = (id: number) => `news:${id}:post`;

export interface NewsPost {
	id: number;
	title: string;
	html: string;
	visibility: PostRow['visibility'];
	authorName: string;
	publishedAt: Date;
}

async function shown(rows: PostRow[], context: Context): Promise<NewsPost[]> {
	const names = await directory.names(
		rows.flatMap((r) => (r.authorId ? [r.authorId] : [])),
		context
	);
	return rows.map((r) => ({
		id: r.id,
		title: r.title,
		html: r.bodyHtml ?? '',
		visibility: r.visibility,
		authorName: (r.authorId && names.get(r.authorId)) || 'The club',
		publishedAt: r.publishedAt!
	}));
}

/** What a viewer may read: published posts; members-only ones to members. */
const readable = (viewer: Viewer | null) => and(isNotNull(newsPosts.publishedAt), viewer ? undefined : eq(newsPosts.visibility, 'public'));

/** Published posts the viewer may read, newest first, a page at a time. */
export async function list(viewer: Viewer | null, page: number, context: Context = {}) {
	const { db } = resolve(context);
	const [total] = await db.select({ n: count() }).from(newsPosts).where(readable(viewer));
	const rows = await db
		.select()
		.from(newsPosts)
		.where(readable(viewer))
		.orderBy(desc(newsPosts.publishedAt), desc(newsPosts.id))
		.limit(NEWS_PAGE_SIZE)
		.offset((page - 1) * NEWS_PAGE_SIZE);
	return { posts: await shown(rows, context), pages: Math.max(1, Math.ceil((total?.n ?? 0) / NEWS_PAGE_SIZE)) };
}

/** The newest few for the dashboard. */
export async function latest(viewer: Viewer, limit = 3, context: Context = {}): Promise<NewsPost[]> {
	const { db } = resolve(context);
	return shown(await db.select().from(newsPosts).where(readable(viewer)).orderBy(desc(newsPosts.publishedAt)).limit(limit), context);
}

/** One published post the viewer may read; null for a draft, a members-only post for a visitor, or none. */
export async function get(viewer: Viewer | null, id: number, context: Context = {}): Promise<NewsPost | null> {
	const { db } = resolve(context);
	const [row] = await db
		.select()
		.from(newsPosts)
		.where(and(eq(newsPosts.id, id), readable(viewer)));
	return row ? (await shown([row], context))[0]! : null;
}

/** Public posts for the Atom feed, newest first. */
export async function publicPosts(limit: number, context: Context = {}): Promise<(NewsPost & { body: string })[]> {
	const { db } = resolve(context);
	const rows = await db.select().from(newsPosts).where(readable(null)).orderBy(desc(newsPosts.publishedAt)).limit(limit);
	const posts = await shown(rows, context);
	return posts.map((p, i) => ({ ...p, body: rows[i]!.body }));
}

// ─── Admins ──────────────────────────────────────────────────────────────────

/** Every post, drafts first, then by newest. */
export async function adminList(admin: Viewer, context: Context = {}) {
	assertRole(admin, 'admin');
	const { db } = resolve(context);
	const rows = await db
		.select()
		.from(newsPosts)
		.orderBy(desc(isNull(newsPosts.publishedAt)), desc(newsPosts.publishedAt), desc(newsPosts.id))
		.limit(200);
	return rows.map((r) => ({
		id: r.id,
		title: r.title,
		publishedAt: r.publishedAt,
		recipients: r.recipients,
		visibility: r.visibility,
		createdAt: r.createdAt
	}));
}

async function row(id: number, context: Context, lock = false): Promise<PostRow> {
	const { db } = resolve(context);
	const query = db.select().from(newsPosts).where(eq(newsPosts.id, id));
	const [found] = lock ? await query.for('update') : await query;
	if (!found) throw notFound('We could not find that news post.');
	return found;
}

/** The names an audience's description needs. */
async function audienceNames(audience: Audience, context: Context) {
	if (audience.kind === 'entrants') return { contest: (await contests.row(audience.contestId, context))?.title };
	if (audience.kind === 'area') return { area: (await areas.get(audience.areaId, context))?.name };
	return {};
}

/** A post as its admin page shows it: source for the form, its HTML, audience and delivery. */
export async function adminGet(admin: Viewer, id: number, context: Context = {}) {
	assertRole(admin, 'admin');
	const post = await row(id, context);
	const audienceText = describeAudience(post.audience, await audienceNames(post.audience, context));
	const reach = post.publishedAt ? null : (await takers(await recipientsOf(post.audience, context), context)).length;
	return { post, audienceText, reach };
}

/** What the post form offers: the contests (newest first) and the club's areas. */
export async function formOptions(admin: Viewer, context: Context = {}) {
	assertRole(admin, 'admin');
	const [all, areaList] = await Promise.all([contests.listAll(admin, context), areas.list(context)]);
	return {
		contests: all.map((c) => ({ id: c.id, title: c.title })),
		areas: areaList.map((a) => ({ id: a.id, name: a.name })),
		unit: distanceUnitOf(admin.units)
	};
}

async function checkAudience(audience: Audience, context: Context) {
	if (audience.kind === 'entrants' && !(await contests.row(audience.contestId, context))) throw notFound('We could not find that contest.');
	if (audience.kind === 'area' && !(await areas.get(audience.areaId, context))) throw notFound('We could not find that club area.');
}

export async function create(admin: Viewer, input: PostInput, context: Context = {}): Promise<number> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	const audience = audienceOf(input, distanceUnitOf(admin.units));
	await checkAudience(audience, context);
	return db.transaction(async (tx) => {
		const [result] = await tx.insert(newsPosts).values({
			authorId: admin.id,
			title: input.title,
			body: input.body,
			bodyHtml: renderMarkdown(input.body),
			visibility: input.visibility,
			audience,
			createdAt: now
		});
		await audit.record({ actorId: admin.id, action: 'news.draft', subject: subject(result.insertId), detail: { title: input.title } }, { ...context, db: tx });
		return result.insertId;
	});
}

/** Changes a draft; a published post stays as it was sent. */
export async function update(admin: Viewer, id: number, input: PostInput, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	const audience = audienceOf(input, distanceUnitOf(admin.units));
	await checkAudience(audience, context);
	await db.transaction(async (tx) => {
		const before = await row(id, { ...context, db: tx }, true);
		if (before.publishedAt) throw conflict('published', 'This post is published and was mailed as it stands; it can no longer be changed.');
		await tx
			.update(newsPosts)
			.set({ title: input.title, body: input.body, bodyHtml: renderMarkdown(input.body), visibility: input.visibility, audience, updatedAt: now })
			.where(eq(newsPosts.id, id));
		await audit.record(
			{
				actorId: admin.id,
				action: 'news.edit',
				subject: subject(id),
				before: { title: before.title, visibility: before.visibility, audience: before.audience },
				after: { title: input.title, visibility: input.visibility, audience }
			},
			{ ...context, db: tx }
		);
	});
}

/** Deletes a draft. */
export async function remove(admin: Viewer, id: number, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		const before = await row(id, { ...context, db: tx }, true);
		if (before.publishedAt) throw conflict('published', 'A published post stays in the club’s news.');
		await tx.delete(newsPosts).where(eq(newsPosts.id, id));
		await audit.record({ actorId: admin.id, action: 'news.delete', subject: subject(id), detail: { title: before.title } }, { ...context, db: tx });
	});
}

/** The members an audience names, with an address; who of them takes club news is the outbox's to decide. */
export async function recipientsOf(audience: Audience, context: Context = {}): Promise<directory.Member[]> {
	switch (audience.kind) {
		case 'all':
			return directory.everyone(context);
		case 'judges':
			return directory.withRole('judge', context);
		case 'entrants': {
			const found = await directory.byIds(await entrants.entrantIds(audience.contestId, context), context);
			return [...found.values()].filter((m) => m.email);
		}
		case 'area': {
			const area = await areas.get(audience.areaId, context);
			if (!area) return [];
			const everyone = await directory.everyone(context);
			const homes = await directory.homePoints(
				everyone.map((m) => m.id),
				context
			);
			return everyone.filter((m) => {
				const home = homes.get(m.id);
				return home !== undefined && withinRadius(home, { lat: area.lat, lng: area.lng }, audience.radius, audience.unit);
			});
		}
	}
}

/** Those of `members` who take club news. */
async function takers(members: directory.Member[], context: Context) {
	const settings = await preferences.ofMembers(
		members.map((m) => m.id),
		context
	);
	return members.filter((m) => settings.get(m.id)!.news === 'on');
}

function newsMail(post: PostRow, to: { id: string; email: string }, test = false) {
	const url = absoluteUrl(`/news/${post.id}`);
	const { html, text } = renderMail({
		heading: post.title,
		paragraphs: test ? ['A test copy, to you only. Nobody else has been sent this post yet.'] : [],
		rich: { html: post.bodyHtml ?? '', text: post.body },
		action: { label: 'Read it on Riparia', url },
		footer: 'You get this because you take club news from Riparia.',
		to: { memberId: to.id, category: test ? 'account' : 'news' }
	});
	return { to: to.email, subject: `${test ? '[Test] ' : ''}${post.title}`, html, text };
}

/** Mails the post to the admin alone, as it will look (with their own links). */
export async function sendTest(admin: Viewer, id: number, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	await db.transaction(async (tx) => {
		const post = await row(id, { ...context, db: tx });
		await enqueue({ ...newsMail(post, admin, true), category: 'account', memberId: admin.id, topic: `news:${id}:test` }, { ...context, db: tx, now });
		await audit.record({ actorId: admin.id, action: 'news.test', subject: subject(id) }, { ...context, db: tx });
	});
}

/**
 * Publishes a draft: it shows on the news page from now on, and one mail per recipient is queued
 * in this transaction. Publishing twice is refused (the row is locked, so two admins cannot both).
 */
export async function publish(admin: Viewer, id: number, context: Context = {}): Promise<{ queued: number }> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = { ...context, db: tx, now };
		const post = await row(id, inTx, true);
		if (post.publishedAt) throw conflict('published', 'This post is published already.');
		const members = await recipientsOf(post.audience, inTx);
		const mails: QueuedMail[] = members.map((m) => ({
			...newsMail(post, m),
			category: 'news',
			memberId: m.id,
			topic: postTopic(id),
			bulk: true,
			dedupeKey: `news:${id}:${m.id}`
		}));
		const queued = await enqueue(mails, inTx);
		await tx.update(newsPosts).set({ publishedAt: now, recipients: queued }).where(eq(newsPosts.id, id));
		await audit.record(
			{
				actorId: admin.id,
				action: 'news.publish',
				subject: subject(id),
				detail: { title: post.title, audience: post.audience, recipients: queued },
				after: { publishedAt: now.toISOString() }
			},
			inTx
		);
		return { queued };
	});
}

/** Per-recipient delivery of a post's mail, optionally for addresses containing `address`. */
export async function delivery(admin: Viewer, id: number, page: number, address?: string, context: Context = {}) {
	assertRole(admin, 'admin');
	await row(id, context);
	const [summary, listing] = await Promise.all([
		deliverySummary(postTopic(id), context),
		listOutbox({ topic: postTopic(id), address: address || undefined, page }, context)
	]);
	return { summary, ...listing };
}

/** Only the counts, for the admin page to poll while mail waits. */
export async function deliveryCounts(admin: Viewer, id: number, context: Context = {}) {
	assertRole(admin, 'admin');
	await row(id, context);
	return deliverySummary(postTopic(id), context);
}
