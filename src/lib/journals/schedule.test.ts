import { describe, expect, test } from 'vitest';
import { scheduleTask } from './calc';
import { asMaintenanceTask, defaultSchedule, doneEventKind, lastDoneOn, parseScheduleRows, resets, taskRowsFrom, dueWithin, type TaskRule } from './schedule';

const water: TaskRule = { id: 1, kind: 'water-change', filterPart: null };
const prefilter: TaskRule = { id: 2, kind: 'filter-clean', filterPart: 'prefilter' };
const anyFilter: TaskRule = { id: 3, kind: 'filter-clean', filterPart: null };
const glass: TaskRule = { id: 4, kind: 'glass', filterPart: null };
const other: TaskRule = { id: 5, kind: 'other', filterPart: null };
const test_: TaskRule = { id: 6, kind: 'water-test', filterPart: null };

describe('which event resets which task (our own rules, no source)', () => {
	test('an event of the task’s kind resets it; another kind does not', () => {
		expect(resets(water, { kind: 'water-change', on: '2026-03-01' })).toBe(true);
		expect(resets(water, { kind: 'trim', on: '2026-03-01' })).toBe(false);
		expect(resets(glass, { kind: 'glass', on: '2026-03-01' })).toBe(true);
	});
	test('a filter task for one part: that part or the whole filter, not another part', () => {
		expect(resets(prefilter, { kind: 'filter-clean', on: '2026-03-01', filterPart: 'prefilter' })).toBe(true);
		expect(resets(prefilter, { kind: 'filter-clean', on: '2026-03-01', filterPart: 'whole' })).toBe(true);
		expect(resets(prefilter, { kind: 'filter-clean', on: '2026-03-01', filterPart: 'impeller' })).toBe(false);
		expect(resets(anyFilter, { kind: 'filter-clean', on: '2026-03-01', filterPart: 'impeller' })).toBe(true);
	});
	test('a task by name only through "done today" for it; water tests reset test tasks', () => {
		expect(resets(other, { kind: 'upkeep', on: '2026-03-01' })).toBe(false);
		expect(resets(other, { kind: 'upkeep', on: '2026-03-01', taskId: 5 })).toBe(true);
		expect(resets(other, { kind: 'upkeep', on: '2026-03-01', taskId: 4 })).toBe(false);
		expect(resets(test_, { kind: 'water-test', on: '2026-03-01' })).toBe(true);
		expect(resets(glass, { kind: 'upkeep', on: '2026-03-01', taskId: 4 })).toBe(true);
	});
	test('a clean of the whole filter resets every filter task; a note resets none', () => {
		const all = [water, prefilter, anyFilter, glass, other];
		expect(all.filter((t) => resets(t, { kind: 'filter-clean', on: '2026-03-01', filterPart: 'whole' })).map((t) => t.id)).toEqual([2, 3]);
		expect(all.filter((t) => resets(t, { kind: 'note', on: '2026-03-01' }))).toEqual([]);
	});
	test('"done today" logs the task’s own kind, or upkeep for tests and named tasks', () => {
		expect(doneEventKind('water-change')).toBe('water-change');
		expect(doneEventKind('filter-clean')).toBe('filter-clean');
		expect(doneEventKind('water-test')).toBe('upkeep');
		expect(doneEventKind('other')).toBe('upkeep');
	});
});

describe('lastDoneOn from what is logged', () => {
	const logged = [
		{ kind: 'water-change', on: '2026-03-01' },
		{ kind: 'water-change', on: '2026-03-15' },
		{ kind: 'water-change', on: '2026-03-08' },
		{ kind: 'trim', on: '2026-03-20' }
	] as const;
	test('the latest matching day, whatever the order', () => {
		expect(lastDoneOn(water, logged)).toBe('2026-03-15');
		expect(lastDoneOn(glass, logged)).toBeNull();
	});
	test('removing the latest event moves the day back (the interval restarts from the one before)', () => {
		expect(
			lastDoneOn(
				water,
				logged.filter((l) => l.on !== '2026-03-15')
			)
		).toBe('2026-03-08');
	});
	test('a day after today is ignored', () => {
		expect(lastDoneOn(water, [...logged, { kind: 'water-change', on: '2026-04-30' }], '2026-03-21')).toBe('2026-03-15');
	});
	test('logging resets the due date: done 15 March every 7 days is due 22 March (calendar arithmetic by hand)', () => {
		const before = scheduleTask(
			asMaintenanceTask({ id: 1, tankId: 9, label: 'Water change', intervalDays: 7, lastDoneOn: '2026-03-08' }),
			new Date('2026-03-21T10:00:00Z')
		);
		expect(before.status).toEqual({ kind: 'overdue', days: 6 });
		const after = scheduleTask(
			asMaintenanceTask({ id: 1, tankId: 9, label: 'Water change', intervalDays: 7, lastDoneOn: lastDoneOn(water, logged) }),
			new Date('2026-03-21T10:00:00Z')
		);
		expect(after.nextDueOn).toBe('2026-03-22');
		expect(after.statusLabel).toBe('due tomorrow');
	});
});

describe('defaultSchedule', () => {
	test('every suggestion of the calculator, with the CO2 check only for a tank on gas', () => {
		const gas = defaultSchedule({ co2Method: 'pressurised' });
		expect(gas.map((t) => t.kind)).toEqual(['water-change', 'glass', 'trim', 'filter-clean', 'co2-check']);
		expect(gas.find((t) => t.kind === 'water-change')?.intervalDays).toBe(7);
		expect(gas.find((t) => t.kind === 'filter-clean')?.filterPart).toBe('media');
		expect(defaultSchedule({ co2Method: 'liquid' }).map((t) => t.kind)).not.toContain('co2-check');
	});
});

describe('the schedule form', () => {
	const kinds = ['water-change', 'filter-clean', 'other'] as const;
	const parts = ['prefilter', 'media'] as const;
	test('reads rows in order and checks each', () => {
		const form = new FormData();
		form.set('tasks[1][kind]', 'filter-clean');
		form.set('tasks[1][filterPart]', 'prefilter');
		form.set('tasks[1][label]', 'Rinse the sponge');
		form.set('tasks[1][intervalDays]', '14');
		form.set('tasks[0][id]', '8');
		form.set('tasks[0][kind]', 'water-change');
		form.set('tasks[0][label]', 'Water change');
		form.set('tasks[0][intervalDays]', '7');
		form.set('tasks[2][kind]', '');
		form.set('tasks[2][label]', '');
		const rows = taskRowsFrom(form);
		expect(rows.map((r) => r.label)).toEqual(['Water change', 'Rinse the sponge']);
		expect(parseScheduleRows(rows, kinds, parts)).toEqual({
			ok: true,
			tasks: [
				{ id: 8, kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 },
				{ id: undefined, kind: 'filter-clean', filterPart: 'prefilter', label: 'Rinse the sponge', intervalDays: 14 }
			]
		});
	});
	test('refuses unknown kinds, empty names and intervals that are not whole days of 1 to 366', () => {
		const result = parseScheduleRows(
			[
				{ id: '', kind: 'polish', filterPart: '', label: 'x', intervalDays: '7' },
				{ id: '', kind: 'other', filterPart: '', label: ' ', intervalDays: '0' },
				{ id: '', kind: 'other', filterPart: '', label: 'y', intervalDays: '2.5' },
				{ id: '', kind: 'other', filterPart: '', label: 'z', intervalDays: '400' }
			],
			kinds,
			parts
		);
		expect(result.ok ? null : Object.keys(result.errors).sort()).toEqual([
			'tasks.0.kind',
			'tasks.1.intervalDays',
			'tasks.1.label',
			'tasks.2.intervalDays',
			'tasks.3.intervalDays'
		]);
	});
});

describe('dueWithin', () => {
	const at = (status: { kind: 'due-in'; days: number } | { kind: 'due-today' } | { kind: 'overdue'; days: number }) => ({
		task: { id: 't', tankId: 'a', label: 'x', intervalDays: 7, lastDoneOn: null },
		nextDueOn: '2026-03-01',
		status,
		statusLabel: ''
	});
	test('overdue and due today always; due in n days only up to the limit', () => {
		const list = [at({ kind: 'overdue', days: 5 }), at({ kind: 'due-today' }), at({ kind: 'due-in', days: 2 }), at({ kind: 'due-in', days: 3 })];
		expect(dueWithin(list, 2).map((s) => s.status)).toEqual([list[0]!.status, list[1]!.status, list[2]!.status]);
		expect(dueWithin(list, 0)).toHaveLength(2);
	});
});
