// The periodic jobs the app runs (digests, expiries, batched notifications, clean-ups). A feature
// adds its job here; the runner makes sure only one app instance runs each one at a time.
import { lt } from 'drizzle-orm';
import { db } from '../db';
import { signInRequests } from '../club/schema';
import { sweepPending } from '../media';
import { sendDueReminders } from '../contests/reminders';
import type { Job } from './runner';

const pruneSignInRequests: Job = {
	name: 'prune-sign-in-requests',
	everyMs: 60 * 60_000,
	run: async (now) => {
		await db.delete(signInRequests).where(lt(signInRequests.createdAt, new Date(now.getTime() - 2 * 60 * 60_000)));
	}
};

/** Photo uploads never saved with anything are removed after a day, objects first. */
const sweepPendingMedia: Job = {
	name: 'sweep-pending-media',
	everyMs: 60 * 60_000,
	run: (now) => sweepPending({ now })
};

/** Contest windows whose date passed without the state moving, and judges with open cards. */
const contestReminders: Job = {
	name: 'contest-reminders',
	everyMs: 15 * 60_000,
	run: (now) => sendDueReminders(now)
};

export const jobs: Job[] = [pruneSignInRequests, sweepPendingMedia, contestReminders];
