import { describe, expect, test } from 'vitest';
import { scheduleTask } from '../journals/calc';
import {
	carePlanMarkdown,
	checklistOf,
	daysAway,
	doseAdvice,
	draftCarePlan,
	dueOn,
	tasksInPeriod,
	topUpFor,
	type CarePlanInput,
	type PlanTask
} from './care-plan';

// Day counts are checked against the JavaScript Date (ECMA-262 time values: 86,400,000 ms a day),
// which the plan does not use. The decisions themselves are our own rules of thumb (common
// practice, no source), tested as written down in care-plan.ts.
const dateDays = (from: string, to: string) => (Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000;

const task = (label: string, kind: PlanTask['kind'], intervalDays: number, lastDoneOn: string | null): PlanTask => ({ label, kind, intervalDays, lastDoneOn });

const base: CarePlanInput = {
	tankName: 'Fernbrook 60',
	leaving: '2026-07-04',
	returning: '2026-07-14',
	tasks: [],
	fertilisers: [],
	lights: [{ label: 'Top light', watts: 30, hoursPerDay: 8 }],
	filters: [{ label: 'Canister' }],
	livestock: [{ name: 'Ember tetra', count: 12 }],
	co2: { method: 'pressurised', bubblesPerSecond: 2 },
	heater: { watts: 100, note: 'set to 24 °C' },
	feeding: 'none',
	lighting: 'shorten',
	evaporationLitresPerDay: null,
	keeperPhone: '+44 7700 900123'
};

describe('days away', () => {
	test('agree with Date across a month end and a leap day', () => {
		const pairs: [string, string][] = [
			['2026-07-04', '2026-07-14'],
			['2026-01-25', '2026-02-03'],
			['2028-02-25', '2028-03-02']
		];
		for (const [a, b] of pairs) expect(daysAway(a, b)).toBe(dateDays(a, b));
	});
});

describe('which tasks fall due while away, and which can wait', () => {
	test('a task falls due its interval after it was last done, as the upkeep schedule has it', () => {
		const t = task('Water change', 'water-change', 7, '2026-07-01');
		expect(dueOn(t, base.leaving)).toBe(
			scheduleTask({ id: '1', tankId: '1', label: t.label, intervalDays: 7, lastDoneOn: '2026-07-01' }, new Date('2026-07-01T12:00:00Z')).nextDueOn
		);
		expect(dateDays('2026-07-01', dueOn(t, base.leaving))).toBe(7);
	});
	test('a weekly water change due early in a ten-day trip is the sitter’s; a fortnightly glass clean due late waits', () => {
		const decisions = tasksInPeriod(
			[task('Water change', 'water-change', 7, '2026-07-01'), task('Glass', 'glass', 14, '2026-06-26'), task('Trim stems', 'trim', 14, '2026-07-03')],
			'2026-07-04',
			'2026-07-14'
		);
		// Water change due 8 July, 6 days late at return > 3 (half of 7): the sitter does it.
		// Glass due 10 July, 4 days late at return ≤ 7: waits. Trim due 17 July: after the return, not listed.
		expect(decisions).toEqual([
			{ label: 'Water change', kind: 'water-change', dueOn: '2026-07-08', who: 'sitter' },
			{ label: 'Glass', kind: 'glass', dueOn: '2026-07-10', who: 'waits' }
		]);
	});
	test('an overdue or never-done task counts from the first day away; CO2 gear never waits', () => {
		const decisions = tasksInPeriod([task('', 'co2-check', 14, null), task('Filter', 'filter-clean', 30, '2026-05-01')], '2026-07-04', '2026-07-06');
		expect(decisions).toEqual([
			{ label: 'Check the CO2 gear', kind: 'co2-check', dueOn: '2026-07-04', who: 'sitter' },
			{ label: 'Filter', kind: 'filter-clean', dueOn: '2026-07-04', who: 'waits' }
		]);
	});
	test('a task due on the day back is the keeper’s own', () => {
		expect(tasksInPeriod([task('Glass', 'glass', 7, '2026-07-07')], '2026-07-04', '2026-07-14')).toEqual([]);
	});
});

describe('doses while away', () => {
	test('liquids are paused on a short trip and halved on a long one; root tabs are left alone', () => {
		const ferts = [
			{ item: 'All-in-one liquid', amount: '2 mL', frequency: 'daily' },
			{ item: 'Root tabs', amount: '1', frequency: 'every 8 weeks' }
		];
		expect(doseAdvice(ferts, 7).map((d) => d.advice)).toEqual(['pause', 'leave']);
		expect(doseAdvice(ferts, 8).map((d) => d.advice)).toEqual(['halve', 'leave']);
	});
});

describe('top-up water', () => {
	test('rate × days, rounded up to the half litre; unknown stays unknown', () => {
		expect(topUpFor(10, 0.42)).toBe(4.5);
		expect(topUpFor(10, 0.4)).toBe(4);
		expect(topUpFor(10, null)).toBeNull();
	});
});

describe('the draft', () => {
	test('shortens the light to the short day keepers give a new tank, never lengthens it', () => {
		expect(draftCarePlan(base).photoperiodHours).toBe(6);
		expect(draftCarePlan({ ...base, lights: [{ label: '', watts: 20, hoursPerDay: 5 }] }).photoperiodHours).toBe(5);
		expect(draftCarePlan({ ...base, lighting: 'keep' }).photoperiodHours).toBe(8);
		expect(draftCarePlan({ ...base, lights: [] }).photoperiodHours).toBeNull();
	});
	test('refuses a day back before the day of leaving', () => {
		expect(() => draftCarePlan({ ...base, returning: base.leaving })).toThrow(RangeError);
	});
	test('the markdown has the checks, the cautions and the keeper’s number, and asks for top-up figures it lacks', () => {
		const text = carePlanMarkdown({ ...base, tasks: [task('Water change', 'water-change', 7, '2026-07-01')] });
		expect(text).toContain('- [ ] Water change (due Wed 8 Jul)');
		expect(text).toContain('about 2 bubbles a second');
		expect(text).toContain('unplug everything at the wall first');
		expect(text).toContain('Never pour plants, animals or tank water');
		expect(text).toContain('several days without food');
		expect(text).toContain('+44 7700 900123');
		expect(text).toContain('I will say how much the tank usually needs');
		expect(carePlanMarkdown({ ...base, evaporationLitresPerDay: 0.5 })).toContain('About 5 L over the whole period');
	});
	test('what the keeper typed cannot add markup to the plan', () => {
		expect(carePlanMarkdown({ ...base, tankName: '<img src=x onerror=alert(1)> *bold*' })).toContain('\\<img src=x onerror=alert(1)\\> \\*bold\\*');
	});
});

describe('the checklist a sitter ticks', () => {
	test('is the plan’s tick-box lines, as they read, once each', () => {
		const text = carePlanMarkdown({ ...base, tankName: 'Tank *one*', tasks: [task('Water change', 'water-change', 7, '2026-07-01')] });
		const list = checklistOf(text + '\n- [ ] Water change (due Wed 8 Jul)\n* [ ] Feed the snails\n- plain line\n');
		expect(list).toContain('Water change (due Wed 8 Jul)');
		expect(list).toContain('Feed the snails');
		expect(list).not.toContain('plain line');
		expect(list.filter((l) => l.startsWith('Water change'))).toHaveLength(1);
		expect(list.some((l) => l.includes('heater is on'))).toBe(true);
	});
});
