import { expect, test } from 'vitest';
import { displayNameSchema } from './profile';

// U+0301 COMBINING ACUTE ACCENT composes with "e" to U+00E9 under NFC (Unicode Standard Annex #15);
// U+202E is RIGHT-TO-LEFT OVERRIDE, U+200D ZERO WIDTH JOINER.
test('a display name typed with a combining accent is kept composed; direction controls and joiners are refused', () => {
	expect(displayNameSchema.parse(' Jose\u0301 Marti ')).toBe('Jos\u00E9 Marti');
	expect(displayNameSchema.safeParse('Anna\u202Egpj').success).toBe(false);
	expect(displayNameSchema.safeParse('An\u200Dna').success).toBe(false);
});
