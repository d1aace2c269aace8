// Every column of members' markdown whose rendered HTML is stored beside it. Features write the
// HTML when they write the source (renderMarkdown, once per write); reads serve what is stored.
// The migration runner (scripts/migrate.ts) calls renderStoredMarkdown() after the migrations:
// a field whose HTML was made by an older RENDERER_VERSION is rendered again from source, row by
// row in batches, and rows without HTML (written by bulk SQL, or before the column existed) get
// theirs. A feature that stores another markdown field adds one line below.
import type { Connection, Pool, RowDataPacket } from 'mysql2/promise';
import { RENDERER_VERSION, renderMarkdown, statementShown } from './markdown';

interface StoredField {
	/** `table.column` of the source; the name its renderer version is kept under. */
	field: string;
	table: string;
	source: string;
	/** The columns to write for one row's source (null source: nothing to show). */
	render(source: string | null): Record<string, string | number | null>;
}

const html = (column: string) => (source: string | null) => ({ [column]: source ? renderMarkdown(source) : null });

const FIELDS: StoredField[] = [
	{ field: 'journal_entry.body', table: 'journal_entry', source: 'body', render: html('body_html') },
	{ field: 'entry_comment.body', table: 'entry_comment', source: 'body', render: html('body_html') },
	{ field: 'tank.description', table: 'tank', source: 'description', render: html('description_html') },
	{ field: 'listing.description', table: 'listing', source: 'description', render: html('description_html') },
	{ field: 'contest.rules', table: 'contest', source: 'rules', render: html('rules_html') },
	{ field: 'away_plan.body', table: 'away_plan', source: 'body', render: html('body_html') },
	{ field: 'news_post.body', table: 'news_post', source: 'body', render: html('body_html') },
	{
		field: 'contest_entry.statement',
		table: 'contest_entry',
		source: 'statement',
		render: (source) => {
			const shown = statementShown(source ?? '');
			return { statement_html: shown.statementHtml, statement_pictures: shown.statementPictures };
		}
	}
];

const BATCH = 500;

type Sql = Pick<Connection | Pool, 'query'>;

async function rows<T>(db: Sql, sql: string, params: unknown[] = []): Promise<T[]> {
	const [result] = await db.query<RowDataPacket[]>(sql, params);
	return result as T[];
}

/**
 * Renders stored markdown that is missing or was made by an older renderer version; returns the
 * rows written per field. Safe to run at every start: a current field with all its HTML costs one
 * query per field.
 */
export async function renderStoredMarkdown(db: Sql, now = new Date()): Promise<Record<string, number>> {
	const done = new Map((await rows<{ field: string; version: number }>(db, 'SELECT field, version FROM markdown_render')).map((r) => [r.field, r.version]));
	const written: Record<string, number> = {};
	for (const f of FIELDS) {
		const all = done.get(f.field) !== RENDERER_VERSION;
		const target = Object.keys(f.render(null))[0]!;
		const pending = all ? '' : `AND \`${target}\` IS NULL AND \`${f.source}\` IS NOT NULL`;
		let after = 0;
		let count = 0;
		for (;;) {
			const batch = await rows<{ id: number; source: string | null }>(
				db,
				`SELECT id, \`${f.source}\` AS source FROM \`${f.table}\` WHERE id > ? ${pending} ORDER BY id LIMIT ${BATCH}`,
				[after]
			);
			if (batch.length === 0) break;
			const rendered = batch.map((r) => ({ id: r.id, values: f.render(r.source) }));
			const columns = Object.keys(rendered[0]!.values);
			const sets = columns.map((c) => `\`${c}\` = CASE id ${rendered.map(() => 'WHEN ? THEN ?').join(' ')} END`).join(', ');
			const params = columns.flatMap((c) => rendered.flatMap((r) => [r.id, r.values[c]]));
			await db.query(`UPDATE \`${f.table}\` SET ${sets} WHERE id IN (${rendered.map(() => '?').join(', ')})`, [...params, ...rendered.map((r) => r.id)]);
			count += batch.length;
			after = batch.at(-1)!.id;
		}
		if (all) {
			await db.query(
				'INSERT INTO markdown_render (field, version, rendered_at) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE version = VALUES(version), rendered_at = VALUES(rendered_at)',
				[f.field, RENDERER_VERSION, now]
			);
		}
		written[f.field] = count;
	}
	return written;
}
