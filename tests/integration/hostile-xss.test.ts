// The XSS corpus (tests/fixtures/hostile/xss-vectors.ts: the OWASP XSS Filter Evasion Cheat Sheet
// and sanitize-html's past bypasses) through every place a member writes text someone else reads:
// markdown bodies, comments, tank fields, photo captions and alt text, listing fields, messages,
// pickup places, contest statements, report reasons and display names. Every page that shows
// them, to the member, admin or judge who reads it, and every mail they caused, carries nothing
// that could run. (tests/e2e/xss.spec.ts loads the same pages in Chromium; the renderer's own
// vectors are in src/lib/server/markdown.test.ts.)
import { beforeAll, describe, expect, test } from 'vitest';
import { request } from '../helpers/http';
import { mailsTo } from '../helpers/mail';
import { XSS_VECTORS } from '../fixtures/hostile/xss-vectors';
import { nonceOf, plantVectors, scriptableParts, type Planted } from '../fixtures/hostile/xss-setup';

let planted: Planted;

beforeAll(async () => {
	planted = await plantVectors();
}, 240_000);

describe('the corpus', () => {
	test('has at least 50 vectors, each different', () => {
		expect(XSS_VECTORS.length).toBeGreaterThanOrEqual(50);
		expect(new Set(XSS_VECTORS).size).toBe(XSS_VECTORS.length);
	});

	test('the check finds what could run', () => {
		const page = (body: string) => `<!doctype html><html><head><script nonce="n1">ok()</script></head><body>${body}</body></html>`;
		expect(scriptableParts(page('<p>fine</p>'), 'n1')).toEqual([]);
		expect(scriptableParts(page('<script>alert(1)</script>'), 'n1')).toHaveLength(1);
		expect(scriptableParts(page('<img src=x onerror=alert(1)>'), 'n1')).toEqual(['onerror= on <img>']);
		expect(scriptableParts(page('<a href="jav&#x09;ascript:alert(1)">x</a>'), 'n1')).toHaveLength(1);
		expect(scriptableParts(page('<svg><animate attributeName=href values=javascript:alert(1) /></svg>'), 'n1')).toEqual(['<animate>']);
		expect(scriptableParts(page('<iframe srcdoc="x"></iframe>'), 'n1')).toHaveLength(2);
		expect(scriptableParts(page('<div style="background:url(javascript:alert(1))">'), 'n1')).toHaveLength(1);
		expect(scriptableParts(page(''), 'another')).toHaveLength(1);
	});
});

describe('pages showing hostile text carry nothing that runs', () => {
	for (const who of ['reader', 'admin', 'judge'] as const) {
		test(`as the ${who}`, async () => {
			const person = planted[who];
			const problems: string[] = [];
			let shown = 0;
			for (const path of planted.pages[who]) {
				const response = await request(path, { cookie: person.cookie });
				expect(response.status, path).toBe(200);
				const html = await response.text();
				const found = scriptableParts(html, nonceOf(response.headers.get('content-security-policy')));
				problems.push(...found.map((p) => `${path}: ${p}`));
				if (/alert\(|xss\.invalid/.test(html)) shown++;
			}
			expect(problems).toEqual([]);
			// The vectors are there, as text, so the check looked at them (those the sanitiser drops whole, as in the judges' statements, leave nothing to see).
			expect(shown).toBeGreaterThan(0);
		}, 240_000);
	}

	test('the markdown preview answers with harmless HTML for every vector', async () => {
		for (const vector of XSS_VECTORS) {
			const response = await request('/api/markdown/preview', { cookie: planted.reader.cookie, json: { text: vector }, accept: 'application/json' });
			const { html } = (await response.json()) as { html: string };
			expect(scriptableParts(html, null), vector).toEqual([]);
		}
	});
});

describe('mail', () => {
	test('every mail the hostile messages caused is harmless HTML', async () => {
		// The reader is mailed about messages at once; the outbox delivers within seconds.
		const deadline = Date.now() + 30_000;
		let mails = await mailsTo(planted.reader.email);
		while (mails.length === 0 && Date.now() < deadline) {
			await new Promise((r) => setTimeout(r, 500));
			mails = await mailsTo(planted.reader.email);
		}
		expect(mails.length).toBeGreaterThan(0);
		const problems = mails.flatMap((m) => scriptableParts(m.html, null).map((p) => `${m.subject}: ${p}`));
		expect(problems).toEqual([]);
	}, 60_000);
});
