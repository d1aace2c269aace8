// Run as its own process (node --import tsx) with DATABASE_URL pointing at the mail-outage test's
// scratch database: a published contest (two judges, three entrants; its results mails not sent
// yet), an owner with an open listing who wants every message mailed at once, and three members
// who will ask for it. Made through the domain functions; prints what the test needs as one JSON line.
import { registerMediaScopes } from '../../src/lib/server/media-scopes';
import { pool } from '../../src/lib/server/db';
import { transition } from '../../src/lib/server/contests/review';
import { contestFixture, scoreAll, viewerOf } from './contests';
import { makePerson } from './people';
import { createListing, memberAt } from './swaps';

registerMediaScopes();
const contest = await contestFixture({ judges: 2, state: 'judging' });
await scoreAll(contest, (j, e) => [5 + e, 2 + j]);
await transition(viewerOf(contest.admin), contest.contestId, 'publish');

const owner = await memberAt({ lat: 47.61, lng: -31.24 }, 'outage-owner', 'immediately');
const listing = await createListing(owner, { title: 'Spare stem plants after a trim' });
const askers = await Promise.all(['Rush', 'Sorrel', 'Tansy'].map((name) => makePerson({ label: 'outage-asker', displayName: `${name} Asker` })));

console.log(
	JSON.stringify({
		contestId: contest.contestId,
		admin: { cookie: contest.admin.cookie },
		owner: { email: owner.email, cookie: owner.cookie },
		listingId: listing,
		askers: askers.map((a) => ({ id: a.id, cookie: a.cookie }))
	})
);
await pool.end();
