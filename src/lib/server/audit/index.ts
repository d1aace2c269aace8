// The club's audit log: who did what to what, and when. Every admin action and every change to
// someone else's data is recorded here through record(), in the same transaction as the change.
import { and, asc, eq, inArray } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { auditLog } from './schema';

export interface AuditRecord {
	/** Who did it; null for the system (a periodic job). */
	actorId: string | null;
	/** What was done, as `subject.verb`, e.g. 'role.change', 'contest.publish'. */
	action: string;
	subject: { type: string; id: string | number };
	detail?: Record<string, unknown>;
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
