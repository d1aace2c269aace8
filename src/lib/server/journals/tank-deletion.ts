// Deleting a tank for good: the tank, its lists and its whole journal (entries with their events
// and comments, water tests, the schedule, admirers and followers go with the tank's row), and
// every photo of it — the cover's and every entry's. Rows go in one transaction; the photos'
// objects are deleted from the bucket once it has committed. Retiring (./tanks.ts) keeps it all.
import { eq } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import * as media from '../media';
import type { Purge } from '../media';
import type { Viewer } from '../club/users';
import { journalEntries, tanks } from './schema';
import { lockOwn } from './tanks';

/** Deletes the viewer's own tank with its journal and every photo; "not found" for anyone else's. */
export async function deleteTank(viewer: Pick<Viewer, 'id'>, tankId: number, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	const purge: Purge = await db.transaction(async (tx) => {
		const inTx = within(context, tx);
		await lockOwn(viewer, tankId, inTx);
		const keys: Purge = [];
		const entryIds = (await tx.select({ id: journalEntries.id }).from(journalEntries).where(eq(journalEntries.tankId, tankId))).map((r) => r.id);
		for (const id of entryIds) keys.push(...(await media.deleteFor('entry', id, inTx)));
		keys.push(...(await media.deleteFor('tank', tankId, inTx)));
		await tx.delete(tanks).where(eq(tanks.id, tankId));
		return keys;
	});
	await media.purge(purge).catch((error: unknown) => console.error(`[tanks] removing photos of deleted tank ${tankId} failed:`, error));
}
