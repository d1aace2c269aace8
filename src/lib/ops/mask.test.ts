import { describe, expect, test } from 'vitest';
import { maskAddress, maskAddresses } from './mask';

describe('maskAddress', () => {
	test('keeps the first letter and the domain', () => {
		expect(maskAddress('mara.quillfeather@kettlewater.test')).toBe('m***@kettlewater.test');
		expect(maskAddress('x@y.test')).toBe('x***@y.test');
	});
	test('something that is not an address is hidden whole', () => {
		expect(maskAddress('no-at-sign')).toBe('***');
		expect(maskAddress('@kettlewater.test')).toBe('***');
	});
});

describe('maskAddresses', () => {
	test('masks each address in a server reply and leaves the rest', () => {
		const reply = '550 5.1.1 <oriel.vantwist@kettlewater.test>: Recipient address rejected; also tried sefa@fen.test';
		const masked = maskAddresses(reply);
		expect(masked).toBe('550 5.1.1 <o***@kettlewater.test>: Recipient address rejected; also tried s***@fen.test');
		expect(masked).not.toContain('oriel');
		expect(masked).not.toContain('sefa');
	});
	test('text without addresses is unchanged', () => {
		expect(maskAddresses('connect ECONNREFUSED 127.0.0.1:2525')).toBe('connect ECONNREFUSED 127.0.0.1:2525');
	});
});
