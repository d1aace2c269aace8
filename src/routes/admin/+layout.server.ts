import { requireRole } from '$lib/server/club/guards';
import type { LayoutServerLoad } from './$types';

// The admin section is refused in hooks.server.ts before any of it runs; this renders that
// refusal as the site's error page for a page view, whichever admin page was asked for.
export const load = ((event) => {
	requireRole(event, 'admin');
}) satisfies LayoutServerLoad;
