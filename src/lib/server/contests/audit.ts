// The contest's entries in the club's audit log: every state change, panel change, conflict,
// override and correction, with who did it and why.
import { and, asc, eq, inArray } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { users } from '../club/schema';
import { auditLog } from '../audit/schema';

export const SUBJECT = 'contest';

/** `at` defaults to the database's clock; steps taken on a given day (the demo data) pass theirs. */
export async function record(
	tx: DbOrTx,
	actorId: string | null,
	action: string,
	contestId: number,
	detail: Record<string, unknown> = {},
	at?: Date
): Promise<void> {
	await tx.insert(auditLog).values({ actorId, action, subjectType: SUBJECT, subjectId: String(contestId), detail, ...(at ? { createdAt: at } : {}) });
}

export interface AuditEntry {
	id: number;
	action: string;
	actorName: string | null;
	detail: Record<string, unknown>;
	createdAt: Date;
}

/** The contest's log, oldest first; `actions` narrows it (e.g. to the public corrections). */
export async function trail(contestId: number, actions?: string[], tx: DbOrTx = appDb): Promise<AuditEntry[]> {
	const rows = await tx
		.select({ id: auditLog.id, action: auditLog.action, actorName: users.displayName, detail: auditLog.detail, createdAt: auditLog.createdAt })
		.from(auditLog)
		.leftJoin(users, eq(users.id, auditLog.actorId))
		.where(and(eq(auditLog.subjectType, SUBJECT), eq(auditLog.subjectId, String(contestId)), actions ? inArray(auditLog.action, actions) : undefined))
		.orderBy(asc(auditLog.id));
	return rows.map((r) => ({ ...r, detail: r.detail ?? {} }));
}
