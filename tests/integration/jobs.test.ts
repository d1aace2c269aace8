import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { runDueJobs, type Job } from '../../src/lib/server/jobs/runner';
import { scratchDatabase } from '../helpers/scratch-db';

let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
beforeAll(async () => {
	scratch = await scratchDatabase();
});
afterAll(async () => {
	await scratch?.drop();
});

describe('periodic jobs', () => {
	test('of several instances ticking at once, exactly one runs a due job, and it is not due again until its interval passes', async () => {
		let runs = 0;
		const job: Job = {
			name: 'count-runs',
			everyMs: 60_000,
			run: async () => {
				runs++;
				await new Promise((r) => setTimeout(r, 50));
			}
		};
		const now = new Date();
		const results = await Promise.all(['a', 'b', 'c', 'd'].map((worker) => runDueJobs([job], { worker }, { now, db: scratch.db })));
		expect(runs).toBe(1);
		expect(results.flat()).toEqual(['count-runs']);

		expect(await runDueJobs([job], {}, { now: new Date(now.getTime() + 30_000), db: scratch.db })).toEqual([]);
		expect(await runDueJobs([job], {}, { now: new Date(now.getTime() + 61_000), db: scratch.db })).toEqual(['count-runs']);
		expect(runs).toBe(2);
	});

	test('a failing job is released, recorded, and runs again when due', async () => {
		let attempts = 0;
		const job: Job = {
			name: 'fails-once',
			everyMs: 1_000,
			run: async () => {
				attempts++;
				if (attempts === 1) throw new Error('first run breaks');
			}
		};
		const now = new Date();
		expect(await runDueJobs([job], {}, { now, db: scratch.db })).toEqual(['fails-once']);
		expect(await runDueJobs([job], {}, { now: new Date(now.getTime() + 2_000), db: scratch.db })).toEqual(['fails-once']);
		expect(attempts).toBe(2);
	});
});
