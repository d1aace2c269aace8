import { describe, expect, test } from 'vitest';
import { firstState, invitationState, parseAddresses } from './membership';

describe('pasted addresses', () => {
	test('splits on lines, commas, semicolons and spaces; reports invalid and duplicate ones', () => {
		const parsed = parseAddresses('ana@pond.test, Ben@Pond.test\nnot-an-address;ana@pond.test  ben@pond.test\n\n');
		expect(parsed.valid).toEqual(['ana@pond.test', 'ben@pond.test']);
		expect(parsed.invalid).toEqual(['not-an-address']);
		expect(parsed.duplicates).toEqual(['ana@pond.test', 'ben@pond.test']);
	});

	test('keeps the address of a "Name <address>" entry', () => {
		expect(parseAddresses('Cleo Marsh <cleo@marsh.test>, "Dan" <dan@marsh.test>').valid).toEqual(['cleo@marsh.test', 'dan@marsh.test']);
	});

	test('nothing pasted is nothing to send', () => {
		expect(parseAddresses('  \n ,; ')).toEqual({ valid: [], invalid: [], duplicates: [] });
	});
});

describe('states', () => {
	test('an open club admits at once; the others hold the person back', () => {
		expect(firstState('open')).toBe('active');
		expect(firstState('approval')).toBe('pending');
		expect(firstState('invitation')).toBe('pending');
	});

	test('a pending invitation past its end shows as expired; accepted and revoked stay as they are', () => {
		const now = new Date('2026-06-15T12:00:00Z');
		const past = new Date('2026-06-15T11:59:59Z');
		const future = new Date('2026-06-15T12:00:01Z');
		expect(invitationState({ state: 'pending', expiresAt: future }, now)).toBe('pending');
		expect(invitationState({ state: 'pending', expiresAt: now }, now)).toBe('expired');
		expect(invitationState({ state: 'accepted', expiresAt: past }, now)).toBe('accepted');
		expect(invitationState({ state: 'revoked', expiresAt: future }, now)).toBe('revoked');
	});
});
