// The club's audit log: who did what to what, and when. Every admin action and every change to
// someone else's data is recorded here through record(), in the same transaction as the change.
// Rows are never changed or removed (the database refuses it too).
import { and, asc, desc, eq, gte, inArray, like, lt, or, type SQL } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { auditLog } from './schema';

export interface AuditRecord {
	/** Who did it; null for the system (a periodic job). */
	actorId: string | null;
	/** What was done, as `subject.verb`, e.g. 'role.change', 'contest.publish'. */
	action: string;
	subject: { type: string; id: string | number };
	/** Context that is neither before nor after: a reason, a message, a count. */
	detail?: Record<string, unknown>;
	/** The changed values as they were, and as they became (only the fields that changed). */
	before?: Record<string, unknown>;
	after?: Record<string, unknown>;
}

/** Appends one row. `context.now` dates it (the demo seed's steps carry their own days); otherwise the database's clock. */
export async function record(entry: AuditRecord, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	await db.insert(auditLog).values({
		actorId: entry.actorId,
		action: entry.action,
		subjectType: entry.subject.type,
		subjectId: String(entry.subject.id),
		detail: entry.detail ?? {},
		before: entry.before ?? null,
		after: entry.after ?? null,
		...(context.now ? { createdAt: context.now } : {})
	});
}

export interface AuditEntry {
	id: number;
	action: string;
	actorId: string | null;
	detail: Record<string, unknown>;
	createdAt: Date;
}

/** One subject's log, oldest first; `actions` narrows it (e.g. to a contest's public corrections). */
export async function trail(subject: { type: string; id: string | number }, actions?: string[], context: Context = {}): Promise<AuditEntry[]> {
	const { db } = resolve(context);
	const rows = await db
		.select({ id: auditLog.id, action: auditLog.action, actorId: auditLog.actorId, detail: auditLog.detail, createdAt: auditLog.createdAt })
		.from(auditLog)
		.where(and(eq(auditLog.subjectType, subject.type), eq(auditLog.subjectId, String(subject.id)), actions ? inArray(auditLog.action, actions) : undefined))
		.orderBy(asc(auditLog.id));
	return rows.map((r) => ({ ...r, detail: r.detail ?? {} }));
}

export interface AuditFilter {
	actorId?: string;
	/** An action (`role.change`) or the part before its dot (`role`). */
	kind?: string;
	/** From the start of `from` up to the end of `to`, both instants (the caller turns days into them). */
	from?: Date;
	until?: Date;
}

export interface AuditRow extends AuditEntry {
	subjectType: string;
	subjectId: string;
	before: Record<string, unknown> | null;
	after: Record<string, unknown> | null;
}

function matching(filter: AuditFilter): SQL | undefined {
	const kind = filter.kind
		? filter.kind.includes('.')
			? eq(auditLog.action, filter.kind)
			: or(eq(auditLog.action, filter.kind), like(auditLog.action, `${filter.kind}.%`))
		: undefined;
	return and(
		filter.actorId ? eq(auditLog.actorId, filter.actorId) : undefined,
		kind,
		filter.from ? gte(auditLog.createdAt, filter.from) : undefined,
		filter.until ? lt(auditLog.createdAt, filter.until) : undefined
	);
}

const rowColumns = {
	id: auditLog.id,
	action: auditLog.action,
	actorId: auditLog.actorId,
	subjectType: auditLog.subjectType,
	subjectId: auditLog.subjectId,
	detail: auditLog.detail,
	before: auditLog.before,
	after: auditLog.after,
	createdAt: auditLog.createdAt
};

/** The log newest first, filtered, `limit` rows before the row `beforeId` (a page boundary that new rows do not shift). */
export async function search(filter: AuditFilter, page: { beforeId?: number; limit: number }, context: Context = {}): Promise<AuditRow[]> {
	const { db } = resolve(context);
	const rows = await db
		.select(rowColumns)
		.from(auditLog)
		.where(and(matching(filter), page.beforeId ? lt(auditLog.id, page.beforeId) : undefined))
		.orderBy(desc(auditLog.id))
		.limit(page.limit);
	return rows.map((r) => ({ ...r, detail: r.detail ?? {} }));
}

/** The actions recorded so far, for the kind filter. */
export async function actions(context: Context = {}): Promise<string[]> {
	const { db } = resolve(context);
	const rows = await db.selectDistinct({ action: auditLog.action }).from(auditLog).orderBy(asc(auditLog.action));
	return rows.map((r) => r.action);
}

/** Everyone who has acted, for the person filter (the system's rows have no actor). */
export async function actorIds(context: Context = {}): Promise<string[]> {
	const { db } = resolve(context);
	const rows = await db.selectDistinct({ actorId: auditLog.actorId }).from(auditLog);
	return rows.flatMap((r) => (r.actorId ? [r.actorId] : []));
}
