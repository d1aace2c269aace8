// Invitations: a link works once, an expired one and a withdrawn one do not, resending replaces
// the link, and every admin step is one audit row.
import { describe, expect, test } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { invitations, users } from '../../src/lib/server/club/schema';
import { auditLog } from '../../src/lib/server/audit/schema';
import * as invites from '../../src/lib/server/club/invitations';
import { request } from '../helpers/http';
import { linksIn, mailsTo, waitForMail } from '../helpers/mail';
import { makePerson, uniqueEmail } from '../helpers/people';
import { viewerOf } from '../helpers/swaps';

const joinPathIn = async (email: string) => {
	const mail = await waitForMail(email, { subject: /Invitation to join/ });
	const link = linksIn(mail).find((l) => l.includes('/join/'))!;
	expect(link).toBeTruthy();
	return { path: link.replace(/^https?:\/\/[^/]+/, ''), mail };
};
const auditsOf = (id: number) =>
	db
		.select()
		.from(auditLog)
		.where(and(eq(auditLog.subjectType, 'invitation'), eq(auditLog.subjectId, String(id))));
const rowFor = async (email: string) => (await db.select().from(invitations).where(eq(invitations.email, email)))[0]!;

describe('invitations', () => {
	test('pasted addresses: invalid and repeated ones reported, members left out, the rest sent and audited once each', async () => {
		const admin = await makePerson({ role: 'admin' });
		const member = await makePerson();
		const [a, b] = [uniqueEmail('invite-a'), uniqueEmail('invite-b')];
		const response = await request('/admin/invitations?/invite', {
			cookie: admin.cookie,
			form: { addresses: `${a}\n${b.toUpperCase()}, not-an-address; ${a}\n${member.email}` }
		});
		expect(response.status).toBe(200);
		const page = await response.text();
		expect(page).toContain('Sent 2 invitations');
		expect(page).toContain('not-an-address');
		for (const email of [a, b]) {
			const row = await rowFor(email);
			expect(row.state).toBe('pending');
			expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
			expect(await auditsOf(row.id)).toHaveLength(1);
			const { path } = await joinPathIn(email);
			// Only the hash is stored: the link's token is not in the table.
			expect(path).not.toContain(row.tokenHash);
		}
	});

	test('a link works once: it makes the person a member, signs them in, and then no longer works', async () => {
		const admin = await makePerson({ role: 'admin' });
		const email = uniqueEmail('invitee');
		await invites.invite(viewerOf(admin), email);
		const { path } = await joinPathIn(email);

		// Opening the link changes nothing (mail scanners open links).
		expect((await request(path)).status).toBe(200);
		expect((await request(path)).status).toBe(200);
		const accepted = await request(path, { form: {} });
		expect(accepted.status).toBe(303);
		expect(accepted.headers.get('location')).toBe('/welcome');
		const cookie = /(authjs\.session-token=[^;]+)/.exec(accepted.headers.get('set-cookie') ?? '')![1]!;
		expect((await request('/welcome', { cookie, form: { displayName: 'Invited Newcomer' } })).status).toBe(303);
		expect((await request('/journals', { cookie })).status).toBe(200);
		const [person] = await db.select().from(users).where(eq(users.email, email));
		expect(person!.state).toBe('active');
		expect((await rowFor(email)).state).toBe('accepted');

		expect((await request(path)).status).toBe(404);
		expect((await request(path, { form: {} })).status).toBe(404);
	});

	test('an expired link and a withdrawn one do not work; resending gives a new link and retires the old', async () => {
		const admin = await makePerson({ role: 'admin' });
		const [late, withdrawn, resent] = [uniqueEmail('late'), uniqueEmail('withdrawn'), uniqueEmail('resent')];
		await invites.invite(viewerOf(admin), `${late} ${withdrawn} ${resent}`);

		const { path: latePath } = await joinPathIn(late);
		await db
			.update(invitations)
			.set({ expiresAt: new Date(Date.now() - 1000) })
			.where(eq(invitations.email, late));
		expect((await request(latePath, { form: {} })).status).toBe(404);
		expect((await db.select().from(users).where(eq(users.email, late))).length).toBe(0);

		const { path: withdrawnPath } = await joinPathIn(withdrawn);
		const row = await rowFor(withdrawn);
		expect((await request('/admin/invitations?/revoke', { cookie: admin.cookie, form: { id: String(row.id) } })).status).toBe(200);
		expect((await auditsOf(row.id)).map((r) => r.action)).toEqual(['invitation.send', 'invitation.revoke']);
		expect((await request(withdrawnPath, { form: {} })).status).toBe(404);
		// Withdrawing twice is refused.
		expect((await request('/admin/invitations?/revoke', { cookie: admin.cookie, form: { id: String(row.id) } })).status).toBe(409);

		const { path: firstPath } = await joinPathIn(resent);
		const resentRow = await rowFor(resent);
		await invites.resend(viewerOf(admin), resentRow.id);
		expect((await auditsOf(resentRow.id)).map((r) => r.action)).toEqual(['invitation.send', 'invitation.resend']);
		expect((await request(firstPath, { form: {} })).status).toBe(404);
		const mails = await (async () => {
			for (let i = 0; i < 60; i++) {
				const all = (await mailsTo(resent)).filter((m) => /Invitation/.test(m.subject));
				if (all.length >= 2) return all;
				await new Promise((r) => setTimeout(r, 250));
			}
			throw new Error('The second invitation did not arrive.');
		})();
		const newPath = linksIn(mails[0]!)
			.find((l) => l.includes('/join/'))!
			.replace(/^https?:\/\/[^/]+/, '');
		expect(newPath).not.toBe(firstPath);
		expect((await request(newPath, { form: {} })).status).toBe(303);
	});

	test('only admins invite', async () => {
		const judge = await makePerson({ role: 'judge' });
		await expect(invites.invite(viewerOf(judge), uniqueEmail('nope'))).rejects.toMatchObject({ status: 403 });
	});
});
