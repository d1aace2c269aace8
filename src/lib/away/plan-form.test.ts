import { describe, expect, test } from 'vitest';
import { awayPlanForm } from './plan-form';

describe('the away form', () => {
	const good = {
		startsOn: '2026-07-04',
		endsOn: '2026-07-14',
		feeding: 'none',
		lighting: 'shorten',
		keeperPhone: '+44 (0)7700 900123',
		evaporationLitresPerDay: '0,4'
	};
	test('reads a filled form, with a decimal comma', () => {
		expect(awayPlanForm.parse(good)).toEqual({ ...good, keeperPhone: '+44 (0)7700 900123', evaporationLitresPerDay: 0.4, visitMail: 'each' });
		expect(awayPlanForm.parse({ ...good, visitMail: 'daily' }).visitMail).toBe('daily');
	});
	test('an empty evaporation stays unknown', () => {
		expect(awayPlanForm.parse({ ...good, evaporationLitresPerDay: '' }).evaporationLitresPerDay).toBeNull();
	});
	test('refuses impossible days, unknown choices and letters in the number', () => {
		const result = awayPlanForm.safeParse({ ...good, startsOn: '2026-02-30', feeding: 'lots', keeperPhone: 'call me', visitMail: 'weekly' });
		expect(result.success).toBe(false);
		const fields = result.success ? [] : result.error.issues.map((i) => i.path[0]);
		expect(fields).toEqual(expect.arrayContaining(['startsOn', 'feeding', 'keeperPhone', 'visitMail']));
	});
});
