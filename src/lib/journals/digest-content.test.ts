import { describe, expect, test } from 'vitest';
import { digestContent, weekOf } from './digest-content';

describe('weekOf', () => {
	test('the Monday of the ISO 8601 week (weeks start on Monday), checked against a calendar', () => {
		// 2026-03-19 is a Thursday; its week starts Monday 2026-03-16.
		expect(weekOf(new Date('2026-03-19T15:00:00Z'))).toBe('2026-03-16');
		expect(weekOf(new Date('2026-03-16T00:00:00Z'))).toBe('2026-03-16');
		// Sunday 2026-03-22 23:59 still belongs to that week; Monday 00:00 starts the next.
		expect(weekOf(new Date('2026-03-22T23:59:59Z'))).toBe('2026-03-16');
		expect(weekOf(new Date('2026-03-23T00:00:00Z'))).toBe('2026-03-23');
		// Across a year end: Thursday 1 January 2026 is in the week of Monday 29 December 2025.
		expect(weekOf(new Date('2026-01-01T08:00:00Z'))).toBe('2025-12-29');
		// Before 1970 too (1969-12-31 was a Wednesday).
		expect(weekOf(new Date('1969-12-31T12:00:00Z'))).toBe('1969-12-29');
	});
});

describe('digestContent', () => {
	const base = { name: 'Mara', weekOf: '2026-03-16', homeUrl: 'https://riparia.test/' };
	test('nothing due and nothing followed: no mail', () => {
		expect(digestContent({ ...base, tasks: [], followed: [] })).toBeNull();
	});
	test('lists the tasks with their status, counts the overdue ones, and the followed entries', () => {
		const content = digestContent({
			...base,
			tasks: [
				{ tankName: 'Reedholme riverbank', label: 'Water change', statusLabel: 'overdue by 2 days', overdue: true },
				{ tankName: 'Reedholme riverbank', label: 'Trim plants', statusLabel: 'due in 3 days', overdue: false }
			],
			followed: [{ tankName: 'Brackenford stones', title: '', entryOn: '2026-03-18', url: 'https://riparia.test/journals/2/entries/9' }]
		})!;
		expect(content.subject).toBe('Your tanks this week: 2 tasks due');
		expect(content.paragraphs).toEqual([
			'Hello Mara, here is your week at the tanks from 16 Mar 2026.',
			'Upkeep due this week (2, of which 1 overdue):',
			'• Reedholme riverbank: Water change — overdue by 2 days',
			'• Reedholme riverbank: Trim plants — due in 3 days',
			'New in the tanks you follow (1):',
			'• Brackenford stones: entry of 18 Mar 2026 — https://riparia.test/journals/2/entries/9',
			'Before hands go in the water, unplug the heater, lights and filter.'
		]);
	});
	test('only followed news: says nothing is due', () => {
		const content = digestContent({ ...base, tasks: [], followed: [{ tankName: 'A', title: 'New stones', entryOn: '2026-03-18', url: 'u' }] })!;
		expect(content.subject).toBe('Your tanks this week: news from tanks you follow');
		expect(content.paragraphs[1]).toBe('Nothing on your schedules is due this week.');
	});
});
