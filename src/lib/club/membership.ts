// Who is a member and how people join: the vocabulary shared by the server and the pages.
import { z } from 'zod';
import { displayNameSchema } from './profile';

/**
 * Where a signed-in person stands. Only `active` people are members; `pending` have signed in
 * but are not admitted yet (a request waiting, or a club that admits by invitation only),
 * `declined` were refused, `suspended` were stopped by an admin and cannot sign in.
 */
export const MEMBER_STATES = ['active', 'pending', 'declined', 'suspended'] as const;
export type MemberState = (typeof MEMBER_STATES)[number];

export const MEMBER_STATE_LABELS: Record<MemberState, string> = {
	active: 'Active',
	pending: 'Waiting to join',
	declined: 'Turned down',
	suspended: 'Suspended'
};

export const JOIN_POLICIES = ['open', 'approval', 'invitation'] as const;
export type JoinPolicy = (typeof JOIN_POLICIES)[number];

export const JOIN_POLICY_LABELS: Record<JoinPolicy, string> = {
	open: 'Open: whoever signs in becomes a member',
	approval: 'By approval: an admin accepts each request',
	invitation: 'By invitation only: admins invite by e-mail'
};

/** The state a newly signed-in person starts in under each policy (an invitation always admits). */
export const firstState = (policy: JoinPolicy): MemberState => (policy === 'open' ? 'active' : 'pending');

/**
 * A signed-in person whatever their standing (`event.locals.account`). Members are also
 * `locals.user`; applicants are only this, so members-only pages treat them as signed out.
 */
export interface Account {
	id: string;
	email: string;
	displayName: string | null;
	state: MemberState;
}

export const NOTE_MAX = 500;
export const MESSAGE_MAX = 1000;
export const REASON_MAX = 500;

export const INVITATION_STATES = ['pending', 'accepted', 'expired', 'revoked'] as const;
export type InvitationState = (typeof INVITATION_STATES)[number];

/** An invitation's state as shown: a pending one past its end has expired (nothing is written for that). */
export function invitationState(row: { state: 'pending' | 'accepted' | 'revoked'; expiresAt: Date }, now: Date): InvitationState {
	return row.state === 'pending' && row.expiresAt.getTime() <= now.getTime() ? 'expired' : row.state;
}

export const INVITATION_DAYS_DEFAULT = 14;
/** How many addresses one paste may invite. */
export const INVITATIONS_PER_PASTE = 100;

const address = z.string().max(254).email();

export interface PastedAddresses {
	/** Valid, distinct addresses, lower-cased, in the order pasted. */
	valid: string[];
	invalid: string[];
	/** Addresses given more than once in the paste (each listed once). */
	duplicates: string[];
}

/**
 * Reads addresses pasted one per line or separated by commas, semicolons or spaces. A
 * "Name <address>" form keeps the address. Case does not make a different address.
 */
export function parseAddresses(text: string): PastedAddresses {
	const result: PastedAddresses = { valid: [], invalid: [], duplicates: [] };
	const seen = new Set<string>();
	const parts = text
		.replace(/[^<>\s,;]*<([^<>]*)>/g, ' $1 ')
		.split(/[\s,;]+/)
		.map((p) => p.trim())
		.filter(Boolean);
	for (const part of parts) {
		const normal = part.toLowerCase();
		if (!address.safeParse(normal).success) {
			result.invalid.push(part);
		} else if (seen.has(normal)) {
			if (!result.duplicates.includes(normal)) result.duplicates.push(normal);
		} else {
			seen.add(normal);
			result.valid.push(normal);
		}
	}
	return result;
}

/** The applicant's request: the name members will know them by and a short note for the admins. */
export const requestForm = z.object({
	displayName: displayNameSchema,
	note: z.string().trim().max(NOTE_MAX, `Keep the note to ${NOTE_MAX} characters.`)
});
