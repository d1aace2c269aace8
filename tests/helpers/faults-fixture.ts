// Run as its own process (node --import tsx) with DATABASE_URL pointing at a database of a fault
// test: a contest in judging with three judges and entries, and three members with a tank each,
// made through the domain functions. Prints what the test needs as one JSON line.
import { registerMediaScopes } from '../../src/lib/server/media-scopes';
import { pool } from '../../src/lib/server/db';
import { contestFixture, openTank } from './contests';
import { makePerson } from './people';

registerMediaScopes();
const fixture = await contestFixture({ judges: 3, state: 'judging' });
const members = await Promise.all(
	['Fennel', 'Marram', 'Sedge'].map(async (name) => {
		const person = await makePerson({ label: 'faults', displayName: `${name} Keeper ${crypto.randomUUID().slice(0, 4)}` });
		return { id: person.id, cookie: person.cookie, tankId: await openTank(person, `${name}'s tank`) };
	})
);
console.log(
	JSON.stringify({
		contestId: fixture.contestId,
		criteria: fixture.criteria,
		judges: fixture.judges.map((j) => ({ id: j.id, cookie: j.cookie })),
		entries: fixture.entries.map((e) => ({ number: e.number, entrantId: e.entrant.id })),
		members
	})
);
await pool.end();
