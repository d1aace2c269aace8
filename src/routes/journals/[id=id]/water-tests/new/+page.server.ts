import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import * as water from '$lib/server/journals/water';
import { emptyWaterTestDraft, parseWaterTest, waterTestDraftFrom } from '$lib/journals/water-tests';
import type { Actions, PageServerLoad } from './$types';

async function ownTank(event: { locals: App.Locals; url: URL; params: { id: string } }) {
	const viewer = requireUser(event);
	const tank = await tanks.findOwn(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	return { viewer, tank };
}

export const load = (async (event) => {
	const { viewer, tank } = await ownTank(event);
	const today = new Date().toISOString().slice(0, 10);
	return { tank: { id: tank.id, name: tank.name, setUpOn: tank.setUpOn }, draft: emptyWaterTestDraft(today), today, units: viewer.units };
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const draft = waterTestDraftFrom(await event.request.formData());
		const parsed = parseWaterTest(draft, viewer.units, { today: new Date().toISOString().slice(0, 10), notBefore: tank.setUpOn });
		if (!parsed.ok) return fail(400, { errors: parsed.errors, draft });
		await water.create(viewer, tank.id, parsed.input);
		redirect(303, `/journals/${tank.id}?tested=1#latest-heading`);
	}
} satisfies Actions;
