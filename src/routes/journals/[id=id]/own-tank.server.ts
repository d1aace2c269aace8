// The one way a keeper's page or action under /journals/<id> gets the keeper and the tank: the
// signed-in member (or a redirect to sign in) and their own tank named in the URL; anyone else's
// tank, or none, is "not found", as if it did not exist.
import { error, type RequestEvent } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';

type TankEvent = Pick<RequestEvent, 'locals' | 'url'> & { params: { id: string } };

/** The keeper and their tank with its lists and photos. */
export async function ownTank(event: TankEvent) {
	const viewer = requireUser(event);
	const tank = await tanks.getOwn(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	return { viewer, tank };
}

/** The keeper and their tank's bare row, for pages that need no lists or photos. */
export async function ownTankRow(event: TankEvent) {
	const viewer = requireUser(event);
	const tank = await tanks.findOwn(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	return { viewer, tank };
}
