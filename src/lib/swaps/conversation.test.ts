import { describe, expect, test } from 'vitest';
import { canArrangePickup, canWrite, conversationStatus, moderatorWithdraw, statusChips } from './conversation';
import { STATE_LABELS } from './labels';
import type { Listing } from './listing-state';

// Our own rules (no source), derived from the listing state machine.
const now = new Date('2031-04-01T12:00:00Z');
const base: Listing = {
	id: '1',
	ownerId: 'owner',
	kind: 'offer',
	category: 'plants',
	state: 'open',
	availableUntil: new Date('2031-04-05T00:00:00Z'),
	reservation: null
};
const reserved = (requestId: string, state: Listing['state'] = 'reserved'): Listing => ({
	...base,
	state,
	reservation: { requestId, requesterId: 'req', acceptedAt: now, ownerConfirmedAt: null, requesterConfirmedAt: null }
});

describe('conversation status', () => {
	test('open listing: every request is waiting', () => {
		expect(conversationStatus(base, '7', now)).toBe('waiting');
	});
	test('reserved: the chosen one is accepted, the others not chosen', () => {
		expect(conversationStatus(reserved('7'), '7', now)).toBe('accepted');
		expect(conversationStatus(reserved('7'), '8', now)).toBe('not-chosen');
		expect(conversationStatus(reserved('7', 'handed-over'), '7', now)).toBe('handed-over');
		expect(conversationStatus(reserved('7', 'handed-over'), '8', now)).toBe('not-chosen');
	});
	test('a lapsed open listing closes its conversations without a write; a reserved one does not lapse', () => {
		const late = new Date('2031-04-06T00:00:00Z');
		expect(conversationStatus(base, '7', late)).toBe('closed');
		expect(conversationStatus(reserved('7'), '7', late)).toBe('accepted');
		expect(conversationStatus({ ...base, state: 'withdrawn' }, '7', now)).toBe('closed');
	});
	test('who may write and arrange a pickup', () => {
		expect(['waiting', 'accepted', 'handed-over', 'not-chosen', 'closed'].map((s) => canWrite(s as never))).toEqual([true, true, true, false, false]);
		expect(canArrangePickup('accepted')).toBe(true);
		expect(canArrangePickup('waiting')).toBe(false);
		expect(canArrangePickup('handed-over')).toBe(false);
	});
});

describe('an admin withdrawing a listing', () => {
	test('open, reserved and expired listings; the reservation is cancelled and named in the event', () => {
		const result = moderatorWithdraw(reserved('7'), 'admin', now);
		expect(result).toMatchObject({
			ok: true,
			listing: { state: 'withdrawn', reservation: null },
			event: { action: 'withdraw', actorId: 'admin', from: 'reserved', to: 'withdrawn', requesterId: 'req' }
		});
		expect(moderatorWithdraw(base, 'admin', new Date('2031-04-06T00:00:00Z'))).toMatchObject({ ok: true, event: { from: 'expired' } });
	});
	test('not once handed over or withdrawn', () => {
		expect(moderatorWithdraw(reserved('7', 'handed-over'), 'admin', now)).toMatchObject({ ok: false, error: { code: 'closed' } });
		expect(moderatorWithdraw({ ...base, state: 'withdrawn' }, 'admin', now)).toMatchObject({ ok: false });
	});
});

describe('statusChips', () => {
	test('a finished conversation says "Handed over" once; otherwise the listing’s state and the conversation’s', () => {
		expect(statusChips(STATE_LABELS['handed-over'], 'handed-over')).toEqual(['Handed over']);
		expect(statusChips(STATE_LABELS.reserved, 'accepted')).toEqual([STATE_LABELS.reserved, 'Accepted: agree a pickup']);
		expect(statusChips(STATE_LABELS.open, 'waiting')).toEqual([STATE_LABELS.open, 'Waiting for an answer']);
	});
});
