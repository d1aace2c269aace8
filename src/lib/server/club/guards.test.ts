import { describe, expect, test, vi } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import type { Role } from '../../club/roles';
import { guardSections, sectionOf } from './guards';

const person = (role: Role) => ({ id: 'p', email: 'p@riparia.test', displayName: 'P', role, units: 'metric' as const });

function run(path: string, options: { role?: Role; method?: string; headers?: Record<string, string>; dataRequest?: boolean; answer?: number } = {}) {
	const url = new URL(path, 'http://riparia.test');
	const event = {
		url,
		request: new Request(url, { method: options.method ?? 'GET', headers: options.headers ?? { accept: 'text/html' } }),
		locals: { user: options.role ? person(options.role) : null, sessionToken: null },
		isDataRequest: options.dataRequest ?? false
	} as unknown as RequestEvent;
	const resolve = vi.fn(async () => new Response('the route answered', { status: options.answer ?? 200 }));
	return { resolve, response: guardSections({ event, resolve }) as Promise<Response> };
}

describe('sections', () => {
	test('are found on the decoded path, whole segments only', () => {
		expect(sectionOf('/admin')?.prefix).toBe('/admin');
		expect(sectionOf('/admin/members')?.prefix).toBe('/admin');
		expect(sectionOf('/%61dmin/members')?.prefix).toBe('/admin');
		expect(sectionOf('/administrivia')).toBeUndefined();
		expect(sectionOf('/judging/3/7')?.roles).toEqual(['judge', 'admin']);
		expect(sectionOf('/api/judging/3/7/card')?.roles).toEqual(['judge', 'admin']);
		expect(sectionOf('/journals')).toBeUndefined();
	});
});

describe('the section guard', () => {
	test('lets the right roles through to the route', async () => {
		const admin = run('/admin/members', { role: 'admin' });
		expect((await admin.response).status).toBe(200);
		const judge = run('/judging', { role: 'judge' });
		expect((await judge.response).status).toBe(200);
		expect(judge.resolve).toHaveBeenCalledOnce();
		expect((await run('/journals', { role: 'member' }).response).status).toBe(200);
	});

	test('sends a signed-out visitor to sign-in, with the way back', async () => {
		const { resolve, response } = run('/admin/areas?x=1');
		const answer = await response;
		expect(answer.status).toBe(303);
		expect(answer.headers.get('location')).toBe('/signin?redirectTo=%2Fadmin%2Fareas%3Fx%3D1');
		expect(resolve).not.toHaveBeenCalled();
	});

	test('answers API-style requests with JSON: 401 signed out, 403 for the wrong role', async () => {
		const signedOut = await run('/api/judging/1/2/card', { headers: { accept: '*/*' } }).response;
		expect(signedOut.status).toBe(401);
		expect(await signedOut.json()).toMatchObject({ code: 'sign-in' });
		const member = await run('/api/judging/1/2/card', { role: 'member', method: 'PUT', headers: { accept: 'application/json' } }).response;
		expect(member.status).toBe(403);
		expect(await member.json()).toMatchObject({ code: 'forbidden', message: 'This part of Riparia is for judges and admins only.' });
		const data = await run('/admin/members', { role: 'judge', dataRequest: true }).response;
		expect(data.status).toBe(403);
	});

	test('answers a form posted with use:enhance with an ActionResult, and never runs the action', async () => {
		const enhanced = { accept: 'application/json', 'x-sveltekit-action': 'true' };
		const member = run('/admin/areas?/add', { role: 'member', method: 'POST', headers: enhanced });
		expect(await (await member.response).json()).toEqual({ type: 'error', error: { message: 'This part of Riparia is for admins only.' } });
		expect(member.resolve).not.toHaveBeenCalled();
		const signedOut = await run('/admin/areas?/add', { method: 'POST', headers: enhanced }).response;
		expect(await signedOut.json()).toMatchObject({ type: 'redirect', location: '/signin?redirectTo=%2Fadmin%2Fareas%3F%2Fadd' });
	});

	test('refuses a plain form post by the wrong role without running it', async () => {
		const { resolve, response } = run('/admin/members?/role', { role: 'judge', method: 'POST' });
		expect((await response).status).toBe(403);
		expect(resolve).not.toHaveBeenCalled();
	});

	test("shows a page's own refusal, and nothing else the page would have shown", async () => {
		const refused = await run('/admin', { role: 'member', answer: 403 }).response;
		expect(refused.status).toBe(403);
		expect(await refused.text()).toBe('the route answered');
		const unguarded = await run('/%61dmin/forgotten', { role: 'member', answer: 200 }).response;
		expect(unguarded.status).toBe(403);
		expect(await unguarded.text()).toBe('This part of Riparia is for admins only.');
	});
});
