import { describe, expect, test } from 'vitest';
import { composed, nameProblem } from './text';

// Code points from the Unicode Character Database (UnicodeData.txt): U+202E RIGHT-TO-LEFT
// OVERRIDE, U+2067 RIGHT-TO-LEFT ISOLATE, U+200D ZERO WIDTH JOINER, U+0301 COMBINING ACUTE ACCENT;
// NFC of "e" + U+0301 is U+00E9 (Unicode Standard Annex #15).
describe('names and titles', () => {
	test('direction controls are refused', () => {
		expect(nameProblem('Anna\u202Egpj.exe')).toMatch(/direction/);
		expect(nameProblem('\u2067Tank\u2069')).toMatch(/direction/);
	});

	test('text with nothing to read is refused', () => {
		expect(nameProblem('\u200D\u200D')).toMatch(/invisible/);
		expect(nameProblem('\u0301\u0301\u0301')).toMatch(/invisible/);
	});

	test('emoji, joined emoji, accents and other scripts are kept', () => {
		for (const ok of ['Shrimp 🦐 tank', 'Family 👩\u200D👩\u200D👧 tank', 'José', 'Jose\u0301', 'بركة', '水草']) expect(nameProblem(ok)).toBeNull();
	});

	test('names are kept composed', () => {
		expect(composed(' Jose\u0301 ')).toBe('Jos\u00E9');
		expect(composed('Jos\u00E9')).toBe('Jos\u00E9');
	});
});
