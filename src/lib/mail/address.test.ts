import { expect, test } from 'vitest';
import { addressParts } from './address';

// The pieces join back to the address; lines may end after "@" and before a dot only
// (common practice in typesetting addresses, no source).
test('an address breaks after the @ and before the dots of its domain', () => {
	expect(addressParts('mara.quillfeather@kettlewater.test')).toEqual(['mara.quillfeather@', 'kettlewater', '.test']);
	expect(addressParts('a@b.c.d').join('')).toBe('a@b.c.d');
	expect(addressParts('no-at-sign')).toEqual(['no-at-sign']);
});
