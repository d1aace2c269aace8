import { describe, expect, test } from 'vitest';
import { type MaintenanceTask, SUGGESTED_INTERVALS, describeDueStatus, scheduleAll, scheduleTask } from './maintenance';

const now = new Date('2024-06-15T18:30:00Z');
const task = (over: Partial<MaintenanceTask>): MaintenanceTask => ({
	id: 't1',
	tankId: 'tank-a',
	label: 'Water change',
	intervalDays: 7,
	lastDoneOn: '2024-06-10',
	...over
});

describe('scheduleTask', () => {
	test('done 10 June every 7 days → due 17 June, in 2 days (calendar arithmetic by hand)', () => {
		const s = scheduleTask(task({}), now);
		expect(s.nextDueOn).toBe('2024-06-17');
		expect(s.status).toEqual({ kind: 'due-in', days: 2 });
		expect(s.statusLabel).toBe('due in 2 days');
	});
	test('due today, tomorrow, and overdue across a month end', () => {
		expect(scheduleTask(task({ lastDoneOn: '2024-06-08' }), now).status).toEqual({ kind: 'due-today' });
		expect(scheduleTask(task({ lastDoneOn: '2024-06-09' }), now).statusLabel).toBe('due tomorrow');
		const late = scheduleTask(task({ lastDoneOn: '2024-05-20', intervalDays: 14 }), now);
		expect(late.nextDueOn).toBe('2024-06-03');
		expect(late.status).toEqual({ kind: 'overdue', days: 12 });
		expect(late.statusLabel).toBe('overdue by 12 days');
		expect(describeDueStatus({ kind: 'overdue', days: 1 })).toBe('overdue by 1 day');
	});
	test('a task never done is due today', () => {
		expect(scheduleTask(task({ lastDoneOn: null }), now)).toMatchObject({ nextDueOn: '2024-06-15', status: { kind: 'due-today' } });
	});
	test('rejects intervals that are not whole days of at least one', () => {
		expect(() => scheduleTask(task({ intervalDays: 0 }), now)).toThrow(/at least 1/);
		expect(() => scheduleTask(task({ intervalDays: 2.5 }), now)).toThrow(/whole number/);
		expect(() => scheduleTask(task({ lastDoneOn: '2024-13-01' }), now)).toThrow(/not a calendar date/);
	});
});

describe('scheduleAll', () => {
	test('sorted across tanks by due day, then tank, then task (1 Jun + 7 d = 8 Jun, 7 days late on 15 Jun)', () => {
		const list = scheduleAll(
			[
				task({ id: 'a', tankId: 'tank-b', label: 'Trim plants', intervalDays: 14, lastDoneOn: '2024-06-10' }),
				task({ id: 'b', tankId: 'tank-a', label: 'Wipe the glass', lastDoneOn: '2024-06-01' }),
				task({ id: 'c', tankId: 'tank-b', label: 'Water change', lastDoneOn: '2024-06-01' }),
				task({ id: 'd', tankId: 'tank-a', label: 'Rinse filter media', intervalDays: 30, lastDoneOn: null })
			],
			now
		);
		expect(list.map((s) => s.task.id)).toEqual(['b', 'c', 'd', 'a']);
		expect(list.map((s) => s.statusLabel)).toEqual(['overdue by 7 days', 'overdue by 7 days', 'due today', 'due in 9 days']);
	});
	test('done today: the interval starts again from today', () => {
		expect(scheduleTask(task({ lastDoneOn: '2024-06-15' }), now).status).toEqual({ kind: 'due-in', days: 7 });
	});
	test('suggested intervals are whole days (common practice, no source)', () => {
		for (const s of SUGGESTED_INTERVALS) expect(Number.isInteger(s.intervalDays) && s.intervalDays > 0).toBe(true);
	});
});
