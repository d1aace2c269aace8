// The periodic jobs the app runs (digests, expiries, batched notifications, clean-ups). A feature
// adds its job here; the runner makes sure only one app instance runs each one at a time. This is
// the wiring module: it may call any domain's functions, never touch a domain's tables.
import * as signInLimit from '../club/sign-in-limit';
import { sweepPending } from '../media';
import { sendWeeklyDigests } from '../journals/digest';
import { expireDue } from '../swaps/expiry';
import { sendDue } from '../swaps/notifications';
import { sendDueReminders } from '../contests/reminders';
import * as awayNotices from '../away/notices';
import type { Job } from './runner';

const pruneSignInRequests: Job = {
	name: 'prune-sign-in-requests',
	everyMs: 60 * 60_000,
	run: (context) => signInLimit.prune(context)
};

/** Photo uploads never saved with anything are removed after a day, objects first. */
const sweepPendingMedia: Job = {
	name: 'sweep-pending-media',
	everyMs: 60 * 60_000,
	run: (context) => sweepPending({}, context)
};

/** The weekly journal digest: each member who asked for it gets one per week (Monday, UTC), at the first run of the week. */
const weeklyJournalDigest: Job = {
	name: 'weekly-journal-digest',
	everyMs: 60 * 60_000,
	run: (context) => sendWeeklyDigests(context)
};

/** Open swap listings whose date has passed are recorded as expired (reads never wait for this). */
const expireSwapListings: Job = {
	name: 'expire-swap-listings',
	everyMs: 5 * 60_000,
	run: ({ now }) => expireDue({ now })
};

/** Swap messages that waited for their conversation's hour, or for an hourly summary. */
const mailSwapMessages: Job = {
	name: 'mail-swap-messages',
	everyMs: 2 * 60_000,
	run: ({ now }) => sendDue({ now })
};

/** Contest windows whose date passed without the state moving, and judges with open cards. */
const contestReminders: Job = {
	name: 'contest-reminders',
	everyMs: 15 * 60_000,
	run: ({ now }) => sendDueReminders({ now })
};

/** Away care: keepers' daily digests of visits, sitters' reminders of a missed visit day, and keepers' summaries once back. */
const awayCare: Job = {
	name: 'away-care',
	everyMs: 10 * 60_000,
	run: ({ now }) => awayNotices.runDue({ now })
};

export const jobs: Job[] = [pruneSignInRequests, sweepPendingMedia, weeklyJournalDigest, expireSwapListings, mailSwapMessages, contestReminders, awayCare];
