// The benchmark's statement counter (BENCH=1): every statement a piece of work sends through a
// counted pool, transactions included, and nothing from work running beside it.
import { afterAll, describe, expect, test } from 'vitest';
import { drizzle } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { sql } from 'drizzle-orm';
import { countStatements, measure } from '../../src/lib/server/db/query-count';
import { databaseUrl } from '../helpers/env';

const pool = mysql.createPool({ uri: databaseUrl(), connectionLimit: 2 });
countStatements(pool);
const db = drizzle(pool, { mode: 'default' });
afterAll(() => pool.end());

const pause = () => new Promise((r) => setTimeout(r, 5));

describe('statements per request', () => {
	test('counts plain statements and a transaction with its BEGIN and COMMIT', async () => {
		const { queries } = await measure(async () => {
			await db.execute(sql`SELECT 1`);
			await db.transaction(async (tx) => {
				await tx.execute(sql`SELECT 2`);
				await tx.execute(sql`SELECT 3`);
			});
		});
		expect(queries).toBe(5);
	});

	test('work running at the same time is counted apart', async () => {
		const statements = (n: number) =>
			measure(async () => {
				for (let i = 0; i < n; i++) {
					await db.execute(sql`SELECT ${i}`);
					await pause();
				}
			});
		const [two, five] = await Promise.all([statements(2), statements(5)]);
		expect([two.queries, five.queries]).toEqual([2, 5]);
	});

	test('statements outside a measurement are not counted anywhere', async () => {
		await db.execute(sql`SELECT 1`);
		expect((await measure(async () => undefined)).queries).toBe(0);
	});
});
