// The audit log as admins read it: filtered by person, kind and dates, a page at a time, with
// names for the ids, and the same rows as CSV.
import { assertRole } from '../../club/roles';
import type { Viewer } from '../../club/viewer';
import { auditRange, kindChoices, type AuditQuery } from '../../club/audit-filter';
import { toCsv } from '../../contests/csv';
import * as audit from '../audit';
import type { Context } from '../context';
import * as directory from './directory';

export const AUDIT_PAGE_SIZE = 50;
/** The most rows one CSV holds; narrow the filter for more. */
const CSV_MAX_ROWS = 50_000;
const CSV_BATCH = 1_000;
/** Shown for an id that names no one (a removed member) and for the system's own steps. */
const FORMER = 'former member';
const SYSTEM = 'Riparia (automatic)';

export interface AuditLine {
	id: number;
	at: Date;
	actor: string;
	action: string;
	subject: string;
	detail: string;
	before: string;
	after: string;
}

const json = (value: Record<string, unknown> | null) => (value && Object.keys(value).length ? JSON.stringify(value) : '');

async function lines(rows: audit.AuditRow[], context: Context): Promise<AuditLine[]> {
	const ids = rows.flatMap((r) => [r.actorId ?? '', r.subjectType === 'user' ? r.subjectId : '']).filter(Boolean);
	const names = await directory.names(ids, context);
	return rows.map((r) => ({
		id: r.id,
		at: r.createdAt,
		actor: r.actorId ? (names.get(r.actorId) ?? FORMER) : SYSTEM,
		action: r.action,
		subject: r.subjectType === 'user' ? `member ${names.get(r.subjectId) ?? FORMER}` : `${r.subjectType} ${r.subjectId}`,
		detail: json(r.detail),
		before: json(r.before),
		after: json(r.after)
	}));
}

const filterOf = (query: AuditQuery): audit.AuditFilter => ({ actorId: query.actor, kind: query.kind, ...auditRange(query) });

/** One page of the log, newest first, with what the filters offer. */
export async function page(admin: Viewer, query: AuditQuery, context: Context = {}) {
	assertRole(admin, 'admin');
	const rows = await audit.search(filterOf(query), { beforeId: query.before, limit: AUDIT_PAGE_SIZE + 1 }, context);
	const shown = rows.slice(0, AUDIT_PAGE_SIZE);
	const [actorIds, actions] = await Promise.all([audit.actorIds(context), audit.actions(context)]);
	const actorNames = await directory.names(actorIds, context);
	return {
		lines: await lines(shown, context),
		/** The id to page on from, when there are older rows. */
		olderThan: rows.length > AUDIT_PAGE_SIZE ? shown.at(-1)!.id : null,
		actors: actorIds.map((id) => ({ id, name: actorNames.get(id) ?? `${FORMER} (${id.slice(0, 8)})` })).sort((a, b) => a.name.localeCompare(b.name)),
		kinds: kindChoices(actions)
	};
}

/** Every row the filters match (up to CSV_MAX_ROWS), newest first, as CSV with times in UTC. */
export async function csv(admin: Viewer, query: AuditQuery, context: Context = {}): Promise<string> {
	assertRole(admin, 'admin');
	const filter = filterOf(query);
	const all: AuditLine[] = [];
	let beforeId = query.before;
	while (all.length < CSV_MAX_ROWS) {
		const rows = await audit.search(filter, { beforeId, limit: CSV_BATCH }, context);
		all.push(...(await lines(rows, context)));
		if (rows.length < CSV_BATCH) break;
		beforeId = rows.at(-1)!.id;
	}
	return toCsv(
		['id', 'time (UTC)', 'who', 'action', 'subject', 'detail', 'before', 'after'],
		all.map((l) => [l.id, l.at.toISOString(), l.actor, l.action, l.subject, l.detail, l.before, l.after])
	);
}
