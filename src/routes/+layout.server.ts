import { unreadCount } from '$lib/server/swaps/threads';
import type { LayoutServerLoad } from './$types';

export const load = (async ({ locals, depends }) => {
	const user = locals.user;
	// Swap pages that mark messages read invalidate this to refresh the header's count.
	depends('swaps:unread');
	return {
		viewer: user ? { id: user.id, displayName: user.displayName, role: user.role, units: user.units } : null,
		// Signed in but not (yet) a member: the header links to their membership page instead.
		applicant: !user && locals.account ? { state: locals.account.state } : null,
		unreadSwaps: user ? await unreadCount(user.id) : 0
	};
}) satisfies LayoutServerLoad;
