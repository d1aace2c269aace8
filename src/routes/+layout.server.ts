import { unreadCount } from '$lib/server/swaps/threads';
import { zoneOf } from '$lib/club/viewer';
import type { LayoutServerLoad } from './$types';

export const load = (async ({ locals, depends }) => {
	const user = locals.user;
	// Swap pages that mark messages read invalidate this to refresh the header's count.
	depends('swaps:unread');
	return {
		viewer: user ? { id: user.id, displayName: user.displayName, role: user.role, units: user.units } : null,
		// Signed in but not (yet) a member: the header links to their membership page instead.
		applicant: !user && locals.account ? { state: locals.account.state } : null,
		// Times are shown in the member's zone, on the server and after hydration alike. Visitors see
		// UTC with the zone named: the server cannot know their zone, and switching after hydration
		// would change every time on the page as it is read.
		timeZone: zoneOf(user),
		/** The member has no zone yet: the browser sends its own once (see +layout.svelte). */
		askTimeZone: user ? !user.timeZone : false,
		unreadSwaps: user ? await unreadCount(user.id) : 0
	};
}) satisfies LayoutServerLoad;
