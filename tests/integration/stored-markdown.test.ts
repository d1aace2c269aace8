// Members' markdown is rendered once when it is written and stored beside its source; the
// migration runner renders it again from source when the renderer's version changes, and fills in
// rows written without it. In a database of its own, so "every row" means this test's rows.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { count, eq, isNull } from 'drizzle-orm';
import { markdownRenders } from '../../src/lib/server/db/meta';
import { users } from '../../src/lib/server/club/schema';
import { entryComments, journalEntries, tanks as tankTable } from '../../src/lib/server/journals/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import { RENDERER_VERSION, renderMarkdown } from '../../src/lib/server/markdown';
import { renderStoredMarkdown } from '../../src/lib/server/markdown-fields';
import { applyMigrations } from '../../scripts/migrate';
import { scratchDatabase } from '../helpers/scratch-db';
import { tankInput } from '../helpers/tanks';

let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
const owner = { id: crypto.randomUUID() };
const body = '## Week two\n\nTrimmed the *stems*; see [the club](https://example.org/x). <script>alert(1)</script>';

beforeAll(async () => {
	scratch = await scratchDatabase();
	await scratch.db.insert(users).values({ id: owner.id, email: `md-${owner.id.slice(0, 8)}@tests.riparia.test`, displayName: 'Marsh Tester' });
});
afterAll(() => scratch?.drop());

const entryHtml = async (id: number) =>
	(await scratch.db.select({ html: journalEntries.bodyHtml }).from(journalEntries).where(eq(journalEntries.id, id)))[0]!.html;

describe('stored markdown', () => {
	test('written with its HTML; served from what is stored', async () => {
		const context = { db: scratch.db };
		const tankId = await tanks.create(owner, tankInput({ name: 'Stored text', description: 'A *quiet* corner.' }), [], context);
		const entryId = await entries.create(owner, tankId, { entryOn: '2026-11-20', title: 'Two', body, events: [] }, [], context);
		await entries.addComment(owner, tankId, entryId, 'Lovely **carpet**', context);
		expect(await entryHtml(entryId)).toBe(renderMarkdown(body));
		expect((await scratch.db.select({ html: tankTable.descriptionHtml }).from(tankTable).where(eq(tankTable.id, tankId)))[0]!.html).toBe(
			renderMarkdown('A *quiet* corner.')
		);
		// Reads serve the stored HTML, not a fresh rendering of the source.
		await scratch.db.update(journalEntries).set({ bodyHtml: '<p>as stored</p>' }).where(eq(journalEntries.id, entryId));
		const [shown] = await entries.many([entryId], context);
		expect(shown!.html).toBe('<p>as stored</p>');
		const [comment] = await entries.comments(null, { ownerId: owner.id }, entryId, context);
		expect(comment!.html).toBe(renderMarkdown('Lovely **carpet**'));
	});

	test('a new renderer version renders every stored field again from source; rows without HTML are filled in', async () => {
		const context = { db: scratch.db };
		const tankId = await tanks.create(owner, tankInput({ name: 'Rules changed' }), [], context);
		const stale = await entries.create(owner, tankId, { entryOn: '2026-11-21', title: 'Stale', body, events: [] }, [], context);
		const current = await entries.create(owner, tankId, { entryOn: '2026-11-22', title: 'Current', body: 'Plain *text*', events: [] }, [], context);
		// A row written by SQL, without its HTML.
		await scratch.db.insert(entryComments).values({ entryId: current, authorId: owner.id, body: 'By **bulk** insert' });

		// Nothing out of date: only the row without HTML is written.
		await scratch.db.update(journalEntries).set({ bodyHtml: '<p>made by older rules</p>' }).where(eq(journalEntries.id, stale));
		const filled = await renderStoredMarkdown(scratch.pool);
		expect(filled['entry_comment.body']).toBe(1);
		expect(filled['journal_entry.body']).toBe(0);
		expect(await entryHtml(stale)).toBe('<p>made by older rules</p>');
		const [bulk] = await scratch.db.select({ html: entryComments.bodyHtml }).from(entryComments).where(eq(entryComments.entryId, current));
		expect(bulk!.html).toBe(renderMarkdown('By **bulk** insert'));

		// The rules changed (the version stored is older than the renderer's): the migration runner renders everything again.
		await scratch.db.update(markdownRenders).set({ version: RENDERER_VERSION - 1 });
		await applyMigrations(scratch.url);
		expect(await entryHtml(stale)).toBe(renderMarkdown(body));
		expect(await entryHtml(current)).toBe(renderMarkdown('Plain *text*'));
		const versions = await scratch.db.select({ field: markdownRenders.field, version: markdownRenders.version }).from(markdownRenders);
		expect(versions.length).toBeGreaterThanOrEqual(6);
		expect(new Set(versions.map((v) => v.version))).toEqual(new Set([RENDERER_VERSION]));
		const [missing] = await scratch.db.select({ n: count() }).from(journalEntries).where(isNull(journalEntries.bodyHtml));
		expect(missing!.n).toBe(0);
	});
});
