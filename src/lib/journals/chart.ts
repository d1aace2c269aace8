// Geometry of a water-test chart: one parameter over time, with the common target band shaded.
// Scales and ticks come from d3-scale, the line from d3-shape; this decides what the axes must
// show (every reading, the band, the danger line) and hands the component plain numbers.
import { scaleLinear, scaleUtc } from 'd3-scale';
import { curveStep, line } from 'd3-shape';
import { dayOf } from '../dates';
import type { BandStatus } from './calc';

export interface ChartPoint {
	id: number;
	on: string;
	value: number;
	status: BandStatus;
	/** A danger level of this reading's own (ammonia: it moves with the test's pH and temperature). */
	dangerAt?: number | null;
}

export interface ChartInput {
	points: readonly ChartPoint[];
	band: { low: number; high: number } | null;
	/** Danger levels drawn as lines when they fall near the readings. */
	danger: { low?: number; high?: number };
}

export interface ChartBox {
	width: number;
	height: number;
	margin: { top: number; right: number; bottom: number; left: number };
}

export const DEFAULT_BOX: ChartBox = { width: 640, height: 220, margin: { top: 12, right: 16, bottom: 28, left: 48 } };

export interface ChartGeometry {
	points: (ChartPoint & { x: number; y: number })[];
	path: string;
	band: { y: number; height: number } | null;
	dangerLines: { y: number; value: number }[];
	/** The per-reading danger levels as a stepped line (empty when the readings carry none); drawn clipped to the plot. */
	dangerPath: string;
	/** Where to label that line: the newest reading's level, when it is inside the plot. */
	dangerLabel: { y: number; value: number } | null;
	yTicks: { y: number; value: number }[];
	xTicks: { x: number; on: string }[];
	domain: [number, number];
	plot: { left: number; top: number; width: number; height: number };
}

const DAY_MS = 86_400_000;
const dayDate = (on: string) => new Date(`${on}T00:00:00Z`);

/**
 * The value range the y axis covers: every reading and the band, with a little room, from zero
 * for concentrations that cannot be negative. A danger level is included only when it is within
 * half the readings' span again, so one high reading does not flatten the rest.
 */
export function valueDomain(input: ChartInput, floorAtZero: boolean): [number, number] {
	const values = input.points.map((p) => p.value);
	if (input.band) values.push(input.band.low, input.band.high);
	if (values.length === 0) return [0, 1];
	let min = Math.min(...values);
	let max = Math.max(...values);
	const span = max - min || Math.abs(max) || 1;
	const ownLevels = input.points.flatMap((p) => (p.dangerAt == null ? [] : [p.dangerAt]));
	for (const level of [input.danger.low, input.danger.high, ...ownLevels]) {
		if (level !== undefined && level >= min - span / 2 && level <= max + span / 2) {
			min = Math.min(min, level);
			max = Math.max(max, level);
		}
	}
	const pad = (max - min || span) * 0.08;
	min -= pad;
	max += pad;
	if (floorAtZero && min < 0) min = 0;
	const nice = scaleLinear().domain([min, max]).nice(5).domain() as [number, number];
	return [floorAtZero ? Math.max(0, nice[0]) : nice[0], nice[1]];
}

export function chartGeometry(input: ChartInput, options: { box?: ChartBox; floorAtZero?: boolean } = {}): ChartGeometry {
	const box = options.box ?? DEFAULT_BOX;
	const plot = {
		left: box.margin.left,
		top: box.margin.top,
		width: box.width - box.margin.left - box.margin.right,
		height: box.height - box.margin.top - box.margin.bottom
	};
	const domain = valueDomain(input, options.floorAtZero ?? true);
	const y = scaleLinear()
		.domain(domain)
		.range([plot.top + plot.height, plot.top]);
	const sorted = [...input.points].sort((a, b) => (a.on < b.on ? -1 : a.on > b.on ? 1 : a.id - b.id));
	const first = sorted[0] ? dayDate(sorted[0].on) : new Date();
	const last = sorted.at(-1) ? dayDate(sorted.at(-1)!.on) : first;
	// A single day still gets a week of axis, so its point sits in the middle, not on an edge.
	const [from, to] =
		last.getTime() - first.getTime() < DAY_MS ? [new Date(first.getTime() - 3 * DAY_MS), new Date(first.getTime() + 4 * DAY_MS)] : [first, last];
	const x = scaleUtc()
		.domain([from, to])
		.range([plot.left, plot.left + plot.width]);

	// Two decimals of a pixel are plenty and keep the markup short.
	const px = (v: number) => Math.round(v * 100) / 100;
	const points = sorted.map((p) => ({ ...p, x: px(x(dayDate(p.on))), y: px(y(p.value)) }));
	const path =
		line<{ x: number; y: number }>()
			.x((p) => p.x)
			.y((p) => p.y)(points) ?? '';
	const clamp = (v: number) => Math.min(Math.max(v, domain[0]), domain[1]);
	const band = input.band
		? (() => {
				const top = y(clamp(input.band.high));
				const bottom = y(clamp(input.band.low));
				return bottom - top > 0 ? { y: px(top), height: px(bottom - top) } : null;
			})()
		: null;
	const dangerLines = [input.danger.low, input.danger.high]
		.filter((v): v is number => v !== undefined && v >= domain[0] && v <= domain[1])
		.map((value) => ({ value, y: px(y(value)) }));
	const withLevel = points.filter((p) => p.dangerAt != null);
	const dangerPath =
		withLevel.length === 0
			? ''
			: withLevel.length === 1
				? `M${plot.left},${px(y(withLevel[0]!.dangerAt!))}H${plot.left + plot.width}`
				: (line<{ x: number; y: number }>()
						.x((p) => p.x)
						.y((p) => p.y)
						.curve(curveStep)(withLevel.map((p) => ({ x: p.x, y: px(y(p.dangerAt!)) }))) ?? '');
	const newestLevel = withLevel.at(-1)?.dangerAt;
	const dangerLabel = newestLevel != null && newestLevel >= domain[0] && newestLevel <= domain[1] ? { value: newestLevel, y: px(y(newestLevel)) } : null;
	const yTicks = y.ticks(5).map((value) => ({ value, y: px(y(value)) }));
	const tickCount = Math.max(2, Math.min(6, Math.floor(plot.width / 90)));
	const xTicks = x.ticks(tickCount).map((d) => ({ x: px(x(d)), on: dayOf(d) }));
	return { points, path, band, dangerLines, dangerPath, dangerLabel, yTicks, xTicks, domain, plot };
}
