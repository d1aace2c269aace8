// Seeds the demo club step by step. Each step runs once per database (recorded in seed_run),
// so a second start adds nothing and a later feature's step still runs on an older database.
import { eq } from 'drizzle-orm';
import { connect, type DbOrTx } from '../src/lib/server/db';
import { seedRuns } from '../src/lib/server/db/meta';
import { promoteConfiguredAdmin } from '../src/lib/server/club/users';
import { seedClub } from './seed/club';
import { seedSpecies } from './seed/species';
import { seedJournalTanks, seedJournals } from './seed/journals';
import { seedRestrictedSpecies } from './seed/restricted';
import { seedSwaps } from './seed/swaps';
import { seedContests } from './seed/contests';
import { seedMembership } from './seed/membership';
import { component, reason } from '../src/lib/server/ops/log';
import { registerMediaScopes } from '../src/lib/server/media-scopes';

const log = component('seed');
registerMediaScopes();

interface SeedStep {
	name: string;
	/** Demo data (invented people, tanks, listings) rather than reference data every club needs. */
	demo: boolean;
	run(db: DbOrTx): Promise<void>;
}

const steps: SeedStep[] = [
	{ name: 'club', demo: true, run: seedClub },
	{ name: 'species', demo: false, run: seedSpecies },
	{ name: 'journal-tanks', demo: true, run: seedJournalTanks },
	{ name: 'journals', demo: true, run: seedJournals },
	{ name: 'swap-restricted-species', demo: false, run: seedRestrictedSpecies },
	{ name: 'swap-demo', demo: true, run: seedSwaps },
	{ name: 'contests', demo: true, run: seedContests },
	{ name: 'membership', demo: true, run: seedMembership }
];

// Reference data always; the demo club only when asked for (`npm start` and `npm test` ask on their
// own local database). A production database thus gets reference data only.
const withDemo = ['1', 'true', 'yes', 'on'].includes(process.env.SEED_DEMO ?? '');

const { db, close } = connect();
try {
	for (const step of steps) {
		if (step.demo && !withDemo) continue;
		const [done] = await db.select().from(seedRuns).where(eq(seedRuns.name, step.name));
		if (done) continue;
		const started = Date.now();
		// One transaction per step: a step that fails leaves nothing behind and runs again next time.
		await db.transaction(async (tx) => {
			await step.run(tx);
			await tx.insert(seedRuns).values({ name: step.name, ranAt: new Date() });
		});
		log.info({ step: step.name, seconds: Number(((Date.now() - started) / 1000).toFixed(1)) }, `seeded ${step.name}`);
	}
	await promoteConfiguredAdmin(process.env.ADMIN_EMAIL, { db });
} catch (error) {
	log.fatal({ err: error, reason: reason(error) }, 'seeding failed');
	process.exitCode = 1;
} finally {
	await close();
}
