import type { LayoutServerLoad } from './$types';

export const load = (async ({ locals }) => {
	const user = locals.user;
	return {
		viewer: user ? { id: user.id, displayName: user.displayName, role: user.role, units: user.units } : null
	};
}) satisfies LayoutServerLoad;
