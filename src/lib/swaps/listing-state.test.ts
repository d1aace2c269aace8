import { describe, expect, test } from 'vitest';
import {
	availableActions,
	checkAction,
	effectiveState,
	isReservationOverdue,
	transition,
	type Actor,
	type Listing,
	type ListingAction,
	type ListingActionType,
	type ListingState,
	type TransitionErrorCode
} from './listing-state';

const DAY = 86_400_000;
const now = new Date('2031-05-10T12:00:00Z');
const later = new Date(now.getTime() + 3 * DAY);
const earlier = new Date(now.getTime() - DAY);

// Invented members: owner "ola", requester "rue", someone else "sam".
const owner: Actor = { kind: 'member', userId: 'ola' };
const requester: Actor = { kind: 'member', userId: 'rue' };
const stranger: Actor = { kind: 'member', userId: 'sam' };
const system: Actor = { kind: 'system' };
const actors = { owner, requester, stranger, system } as const;

const base: Listing = { id: 'l1', ownerId: 'ola', kind: 'offer', category: 'plants', state: 'open', availableUntil: later, reservation: null };
const reservation = (owner: Date | null, requester: Date | null) => ({
	requestId: 'q1',
	requesterId: 'rue',
	acceptedAt: earlier,
	ownerConfirmedAt: owner,
	requesterConfirmedAt: requester
});

const situations = {
	open: base,
	'open, date passed': { ...base, availableUntil: earlier },
	reserved: { ...base, state: 'reserved', reservation: reservation(null, null) },
	'reserved, owner confirmed': { ...base, state: 'reserved', reservation: reservation(earlier, null) },
	'reserved, requester confirmed': { ...base, state: 'reserved', reservation: reservation(null, earlier) },
	'reserved, date passed': { ...base, state: 'reserved', availableUntil: earlier, reservation: reservation(null, null) },
	'handed over': { ...base, state: 'handed-over', reservation: reservation(earlier, earlier) },
	withdrawn: { ...base, state: 'withdrawn' },
	expired: { ...base, state: 'expired', availableUntil: earlier }
} satisfies Record<string, Listing>;

const actions: Record<ListingActionType, ListingAction> = {
	accept: { type: 'accept', requestId: 'q1', requesterId: 'rue' },
	release: { type: 'release' },
	'confirm-handover': { type: 'confirm-handover' },
	withdraw: { type: 'withdraw' },
	extend: { type: 'extend', availableUntil: new Date(now.getTime() + 10 * DAY) },
	expire: { type: 'expire' }
};

/** Expected outcome per actor [owner, requester, stranger, system]: "→state" or an error code. */
type Outcome = `→${ListingState}` | TransitionErrorCode;
type Row = [Outcome, Outcome, Outcome, Outcome];
const ownerOnly = (o: Outcome): Row => [o, 'not-owner', 'not-owner', 'not-owner'];
const expireRow = (system: Outcome): Row => ['system-only', 'system-only', 'system-only', system];
const party: [Outcome, Outcome] = ['not-a-party', 'not-a-party'];

const expected: Record<keyof typeof situations, Record<ListingActionType, Row>> = {
	open: {
		accept: ownerOnly('→reserved'),
		release: ownerOnly('not-reserved'),
		'confirm-handover': ['not-reserved', 'not-a-party', ...party],
		withdraw: ownerOnly('→withdrawn'),
		extend: ownerOnly('→open'),
		expire: expireRow('not-due')
	},
	'open, date passed': {
		accept: ownerOnly('closed'),
		release: ownerOnly('closed'),
		'confirm-handover': ['closed', 'not-a-party', ...party],
		withdraw: ownerOnly('closed'),
		extend: ownerOnly('→open'),
		expire: expireRow('→expired')
	},
	reserved: {
		accept: ownerOnly('already-reserved'),
		release: ownerOnly('→open'),
		'confirm-handover': ['→reserved', '→reserved', ...party],
		withdraw: ownerOnly('→withdrawn'),
		extend: ownerOnly('→reserved'),
		expire: expireRow('not-due')
	},
	'reserved, owner confirmed': {
		accept: ownerOnly('already-reserved'),
		release: ownerOnly('→open'),
		'confirm-handover': ['already-confirmed', '→handed-over', ...party],
		withdraw: ownerOnly('→withdrawn'),
		extend: ownerOnly('→reserved'),
		expire: expireRow('not-due')
	},
	'reserved, requester confirmed': {
		accept: ownerOnly('already-reserved'),
		release: ownerOnly('→open'),
		'confirm-handover': ['→handed-over', 'already-confirmed', ...party],
		withdraw: ownerOnly('→withdrawn'),
		extend: ownerOnly('→reserved'),
		expire: expireRow('not-due')
	},
	'reserved, date passed': {
		accept: ownerOnly('already-reserved'),
		release: ownerOnly('→expired'),
		'confirm-handover': ['→reserved', '→reserved', ...party],
		withdraw: ownerOnly('→withdrawn'),
		extend: ownerOnly('→reserved'),
		expire: expireRow('not-due')
	},
	'handed over': {
		accept: ownerOnly('closed'),
		release: ownerOnly('closed'),
		'confirm-handover': ['closed', 'closed', ...party],
		withdraw: ownerOnly('closed'),
		extend: ownerOnly('closed'),
		expire: expireRow('closed')
	},
	withdrawn: {
		accept: ownerOnly('closed'),
		release: ownerOnly('closed'),
		'confirm-handover': ['closed', 'not-a-party', ...party],
		withdraw: ownerOnly('closed'),
		extend: ownerOnly('closed'),
		expire: expireRow('closed')
	},
	expired: {
		accept: ownerOnly('closed'),
		release: ownerOnly('closed'),
		'confirm-handover': ['closed', 'not-a-party', ...party],
		withdraw: ownerOnly('closed'),
		extend: ownerOnly('→open'),
		expire: expireRow('closed')
	}
};

describe('transition: every state × action × actor', () => {
	const cases = Object.entries(situations).flatMap(([name, listing]) =>
		(Object.keys(actions) as ListingActionType[]).flatMap((type) =>
			(Object.keys(actors) as (keyof typeof actors)[]).map((who, i) => ({
				name,
				listing: listing as Listing,
				type,
				who,
				want: expected[name as keyof typeof situations][type][i]!
			}))
		)
	);
	test('the table covers 9 situations × 6 actions × 4 actors', () => {
		expect(cases).toHaveLength(9 * 6 * 4);
	});
	test.each(cases)('$name · $type by $who → $want', ({ listing, type, who, want }) => {
		const result = transition(listing, actions[type], actors[who], now);
		const got: Outcome = result.ok ? `→${result.listing.state}` : result.error.code;
		expect(got).toBe(want);
		if (result.ok) {
			expect(result.event).toMatchObject({ listingId: 'l1', action: type, at: now, to: result.listing.state });
			const actor = actors[who];
			expect(result.event.actorId).toBe(actor.kind === 'member' ? actor.userId : null);
		} else {
			expect(result.error.message).toMatch(/^[A-Z].*\.$/); // a whole sentence for the member
		}
		// availableActions offers exactly the action types this check allows.
		expect(availableActions(listing, actors[who], now).includes(type)).toBe(checkAction(listing, type, actors[who], now) === null);
	});
});

describe('transition details', () => {
	test('accept records the reservation and an event naming the requester', () => {
		const result = transition(base, actions.accept, owner, now);
		expect(result).toEqual({
			ok: true,
			listing: {
				...base,
				state: 'reserved',
				reservation: { requestId: 'q1', requesterId: 'rue', acceptedAt: now, ownerConfirmedAt: null, requesterConfirmedAt: null }
			},
			event: { listingId: 'l1', action: 'accept', actorId: 'ola', at: now, from: 'open', to: 'reserved', requesterId: 'rue' }
		});
	});
	test('the owner cannot accept their own request', () => {
		const result = transition(base, { type: 'accept', requestId: 'q9', requesterId: 'ola' }, owner, now);
		expect(result.ok || result.error.code).toBe('own-request');
	});
	test('handover takes both confirmations, in either order', () => {
		let listing: Listing = situations.reserved;
		const first = transition(listing, actions['confirm-handover'], requester, now);
		if (!first.ok) throw new Error(first.error.message);
		expect(first.listing.state).toBe('reserved');
		expect(first.listing.reservation).toMatchObject({ requesterConfirmedAt: now, ownerConfirmedAt: null });
		expect(first.event).toMatchObject({ actorId: 'rue', from: 'reserved', to: 'reserved', requesterId: 'rue' });
		listing = first.listing;
		const second = transition(listing, actions['confirm-handover'], owner, later);
		if (!second.ok) throw new Error(second.error.message);
		expect(second.listing.state).toBe('handed-over');
		expect(second.listing.reservation).toMatchObject({ requesterConfirmedAt: now, ownerConfirmedAt: later });
		expect(second.event).toMatchObject({ actorId: 'ola', at: later, from: 'reserved', to: 'handed-over' });
	});
	test('release and withdraw clear the reservation and name who must be told', () => {
		for (const type of ['release', 'withdraw'] as const) {
			const result = transition(situations.reserved, actions[type], owner, now);
			if (!result.ok) throw new Error(result.error.message);
			expect(result.listing.reservation).toBeNull();
			expect(result.event.requesterId).toBe('rue');
		}
	});
	test('a lapsed open listing is expired without a write; the expiry job records it from "open"', () => {
		const lapsed = situations['open, date passed'];
		expect(lapsed.state).toBe('open');
		expect(effectiveState(lapsed, now)).toBe('expired');
		expect(effectiveState(lapsed, new Date(lapsed.availableUntil.getTime() - 1))).toBe('open');
		expect(effectiveState(lapsed, lapsed.availableUntil)).toBe('expired'); // "until" is exclusive
		const result = transition(lapsed, actions.expire, system, now);
		expect(result.ok && result.event).toEqual({ listingId: 'l1', action: 'expire', actorId: null, at: now, from: 'open', to: 'expired', requesterId: null });
	});
	test('a reserved listing does not expire, and is overdue once its date passes', () => {
		const listing = situations['reserved, date passed'];
		expect(effectiveState(listing, now)).toBe('reserved');
		expect(isReservationOverdue(listing, now)).toBe(true);
		expect(isReservationOverdue(situations.reserved, now)).toBe(false);
		expect(isReservationOverdue(situations['open, date passed'], now)).toBe(false);
	});
	test('extending reopens an expired listing, the event reads from "expired"', () => {
		const until = new Date(now.getTime() + 5 * DAY);
		const result = transition(situations['open, date passed'], { type: 'extend', availableUntil: until }, owner, now);
		expect(result.ok && result.listing).toMatchObject({ state: 'open', availableUntil: until });
		expect(result.ok && result.event).toMatchObject({ from: 'expired', to: 'open' });
	});
	test('extend checks the new date', () => {
		const attempt = (d: Date) => {
			const r = transition(base, { type: 'extend', availableUntil: d }, owner, now);
			return r.ok ? 'ok' : `${r.error.code}: ${r.error.message}`;
		};
		expect(attempt(earlier)).toBe('bad-date: Choose a date in the future.');
		expect(attempt(new Date(now.getTime() + 91 * DAY))).toBe('bad-date: Choose a date at most 90 days from now.');
		expect(attempt(new Date(Number.NaN))).toBe('bad-date: Choose a date.');
		expect(attempt(new Date(now.getTime() + 90 * DAY))).toBe('ok');
	});
	test('messages say why, in words', () => {
		const expired = transition(situations.expired, actions.accept, owner, now);
		expect(expired.ok || expired.error.message).toBe('This listing expired on 9 May 2031.');
		const reserved = transition(situations.reserved, actions.accept, owner, now);
		expect(reserved.ok || reserved.error.message).toBe('This listing is already reserved. Release that reservation before accepting another request.');
		const early = transition(base, actions.expire, system, now);
		expect(early.ok || early.error.message).toBe('This listing is available until 13 May 2031.');
	});
	test('the input listing is not modified', () => {
		const listing = structuredClone(situations.reserved);
		transition(listing, actions['confirm-handover'], owner, now);
		expect(listing).toEqual(situations.reserved);
	});
});
