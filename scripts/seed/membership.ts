// The demo club's membership: it admits by approval, two people are waiting for an answer, and
// most members have chosen to appear in the member directory.
import { inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import { clubSettings, joinRequests, users } from '../../src/lib/server/club/schema';
import { renderMarkdown } from '../../src/lib/server/markdown';
import { CLUB_NAME, DEMO_PEOPLE } from './people';

const DESCRIPTION = `We are a club of planted-tank keepers around Kettlewater: we swap trimmings, keep journals of our tanks and hold two contests a year.

New members are welcome. Tell us a little about your tanks when you ask to join.`;

export const DEMO_APPLICANTS = [
	{
		email: 'wren.halloway@kettlewater.test',
		displayName: 'Wren Halloway',
		note: 'I keep a 60-litre low-tech tank with crypts and a few shrimp, and I would like to swap trimmings with people nearby.',
		askedOn: Date.UTC(2026, 10, 24)
	},
	{
		email: 'teodor.brisk@kettlewater.test',
		displayName: 'Teodor Brisk',
		note: 'Met Mara at the autumn plant sale. Setting up my first CO2 tank and would love advice.',
		askedOn: Date.UTC(2026, 10, 29)
	}
];

/** Members who chose not to appear in the directory (everyone else in the demo club did). */
const UNLISTED = new Set(['nell', 'pim']);

export async function seedMembership(db: DbOrTx): Promise<void> {
	await db.insert(clubSettings).values({
		id: 1,
		name: CLUB_NAME,
		description: DESCRIPTION,
		descriptionHtml: renderMarkdown(DESCRIPTION, { images: false }),
		contactEmail: 'committee@kettlewater.test',
		joinPolicy: 'approval'
	});
	const listed = DEMO_PEOPLE.filter((p) => !UNLISTED.has(p.key)).map((p) => p.email);
	await db.update(users).set({ inDirectory: true }).where(inArray(users.email, listed));
	for (const applicant of DEMO_APPLICANTS) {
		const id = crypto.randomUUID();
		const askedAt = new Date(applicant.askedOn);
		await db
			.insert(users)
			.values({ id, email: applicant.email, emailVerified: askedAt, displayName: applicant.displayName, state: 'pending', createdAt: askedAt });
		await db.insert(joinRequests).values({ userId: id, note: applicant.note, createdAt: askedAt });
	}
}
