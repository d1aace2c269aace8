import { describe, expect, test } from 'vitest';
import { auditQuery, auditRange, kindChoices } from './audit-filter';

describe('audit filters', () => {
	test('days become a half-open range of instants that includes the whole last day', () => {
		expect(auditRange({ from: '2026-03-01', to: '2026-03-31' })).toEqual({
			from: new Date('2026-03-01T00:00:00.000Z'),
			until: new Date('2026-04-01T00:00:00.000Z')
		});
		expect(auditRange({})).toEqual({ from: undefined, until: undefined });
	});

	test('malformed values are ignored rather than refused', () => {
		expect(auditQuery.parse({ from: '2026-13-45', kind: 'DROP TABLE', before: '-3' })).toEqual({
			actor: undefined,
			kind: undefined,
			from: undefined,
			to: undefined,
			before: undefined
		});
		expect(auditQuery.parse({ kind: 'role.change', from: '2026-02-28' })).toMatchObject({ kind: 'role.change', from: '2026-02-28' });
	});

	test('kinds offer each action and each group once, sorted', () => {
		expect(kindChoices(['role.change', 'contest.open', 'contest.publish', 'role.change'])).toEqual([
			'contest',
			'contest.open',
			'contest.publish',
			'role',
			'role.change'
		]);
	});
});
