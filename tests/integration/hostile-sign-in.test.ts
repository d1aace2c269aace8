// Sign-in under a burst: the per-address and per-client limits hold when 100 requests arrive at
// once, not only one after another (sign-in.test.ts has the limits in sequence, and reused,
// expired and superseded links; security.test.ts the redirect target).
import { describe, expect, test } from 'vitest';
import { checkAndRecord } from '../../src/lib/server/club/sign-in-limit';
import { request } from '../helpers/http';
import { mailsTo } from '../helpers/mail';
import { uniqueEmail } from '../helpers/people';

const BURST = 100;

describe('a burst of 100 sign-in requests', () => {
	test('for one address: five links are sent, the rest are refused', async () => {
		const email = uniqueEmail('burst');
		const responses = await Promise.all(Array.from({ length: BURST }, () => request('/signin', { form: { email, redirectTo: '/' } })));
		const statuses = responses.map((r) => r.status);
		expect(statuses.filter((s) => s === 302)).toHaveLength(5);
		expect(statuses.filter((s) => s === 429)).toHaveLength(BURST - 5);
		// Mail is sent at once for an allowed request; give the last ones a moment.
		await new Promise((r) => setTimeout(r, 2_000));
		expect((await mailsTo(email)).length).toBe(5);
	});

	test('from one client: the limit holds for requests counted at the same moment', async () => {
		const client = `203.0.113.${Math.floor(Math.random() * 200)}-${crypto.randomUUID()}`;
		const verdicts = await Promise.all(
			Array.from({ length: BURST }, () => checkAndRecord(uniqueEmail('burst-client'), client, { perClient: 10, perAddress: 5 }))
		);
		expect(verdicts.filter((v) => v.allowed)).toHaveLength(10);
	});
});
