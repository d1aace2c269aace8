// The computed figures of a tank profile (volume, weight, light, turnover, age), from the
// stored metric values, through the shared calculators in ./calc. Used by the tank page and by
// features that judge a tank by its size or age (contest eligibility).
import {
	CalcInputError,
	CO2_SAFETY_CAUTION,
	ELECTRICAL_SAFETY_CAUTION,
	FILLED_TANK_LOAD_CAUTION,
	SUBSTRATE_KINDS,
	assessTurnover,
	chooseWaterVolume,
	estimateWaterVolume,
	filledTankWeight,
	innerFromOuter,
	summariseLighting,
	tankAge,
	turnoverPerHour,
	usGallonsPerHourToLitresPerHour,
	waterMassKg,
	type ChosenVolume,
	type FilledTankWeight,
	type InnerDimensions,
	type LightingSummary,
	type SubstrateKind,
	type TankAge,
	type TurnoverAssessment,
	type WaterVolumeEstimate
} from './calc';
import type { FlowUnit } from './tank-vocabulary';

/** What the figures need of a tank: its stored, metric values. */
export interface TankMeasures {
	lengthCm: number;
	widthCm: number;
	heightCm: number;
	glassMm: number | null;
	substrateKind: string;
	substrateDepthCm: number | null;
	hardscapeLitres: number | null;
	waterLitres: number | null;
	heaterWatts: number | null;
	co2Method: 'none' | 'liquid' | 'pressurised';
	setUpOn: string | null;
	retiredOn?: string | null;
	lights: { label: string; watts: number; hoursPerDay: number }[];
	filters: { label: string; ratedFlow: number | null; flowUnit: FlowUnit }[];
}

/** The water temperature weights are worked out at: a usual tropical tank (common practice, no source). */
export const FIGURES_WATER_TEMP_C = 25;

export interface TankFigures {
	/** Inner box: outer measurements less the glass, or the outer ones when no thickness is given. */
	inner: InnerDimensions;
	glassKnown: boolean;
	grossLitres: number;
	estimate: WaterVolumeEstimate | null;
	/** The volume the other figures use: measured when given, else estimated. */
	volume: ChosenVolume | null;
	weight: FilledTankWeight | null;
	/** The water alone, kg, also when the whole tank cannot be weighed. */
	waterKg: number | null;
	lighting: LightingSummary | null;
	totalFlowLph: number;
	turnover: { perHour: number; assessment: TurnoverAssessment } | null;
	/** Age on `now`, or for a retired tank how long it ran. */
	age: TankAge | null;
	/** Mains load of lights and heater, W. */
	mainsWatts: number;
	cautions: { electrical: string | null; weight: string | null; co2: string | null };
	/** Why a figure could not be worked out (e.g. substrate deeper than the tank), for the page. */
	problems: string[];
	notes: string[];
}

export const flowLitresPerHour = (flow: number, unit: FlowUnit) => (unit === 'usgph' ? usGallonsPerHourToLitresPerHour(flow) : flow);

const isSubstrateKind = (kind: string): kind is SubstrateKind => (SUBSTRATE_KINDS as readonly string[]).includes(kind);

function attempt<T>(problems: string[], work: () => T): T | null {
	try {
		return work();
	} catch (error) {
		if (error instanceof CalcInputError || error instanceof RangeError) {
			problems.push(error.message);
			return null;
		}
		throw error;
	}
}

export function tankFigures(tank: TankMeasures, now: Date = new Date()): TankFigures {
	const problems: string[] = [];
	const notes: string[] = [];
	const glassKnown = tank.glassMm !== null && tank.glassMm > 0;
	const outer = { lengthCm: tank.lengthCm, widthCm: tank.widthCm, heightCm: tank.heightCm };
	const outerWithGlass = glassKnown ? { ...outer, glassThicknessCm: tank.glassMm! / 10 } : null;
	const inner = (outerWithGlass && attempt(problems, () => innerFromOuter(outerWithGlass))) || outer;
	if (!glassKnown) notes.push('No glass thickness given: the sizes are taken as inside measurements and the glass is not weighed.');

	const grossLitres = (inner.lengthCm * inner.widthCm * inner.heightCm) / 1000;
	const estimate = attempt(problems, () =>
		estimateWaterVolume({
			inner,
			substrateDepth: tank.substrateDepthCm ?? undefined,
			hardscape: tank.hardscapeLitres ? { litres: tank.hardscapeLitres } : undefined
		})
	);
	const volume = attempt(problems, () => chooseWaterVolume(estimate?.waterLitres ?? null, tank.waterLitres));

	let weight: FilledTankWeight | null = null;
	if (volume && outerWithGlass) {
		const substrate =
			estimate && estimate.substrateLitres > 0 && isSubstrateKind(tank.substrateKind)
				? { litres: estimate.substrateLitres, kind: tank.substrateKind }
				: undefined;
		if (estimate && estimate.substrateLitres > 0 && !substrate) notes.push('The substrate is not weighed: choose sand, gravel or nutrient soil to include it.');
		weight = attempt(problems, () => filledTankWeight({ outer: outerWithGlass, waterLitres: volume.litres, waterTempC: FIGURES_WATER_TEMP_C, substrate }));
		if (weight && tank.hardscapeLitres) notes.push('Rock and wood are not weighed; add their weight if you know it.');
	}

	const lighting = volume && tank.lights.length ? attempt(problems, () => summariseLighting(tank.lights, volume.litres)) : null;
	const flows = tank.filters.filter((f) => f.ratedFlow !== null && f.ratedFlow > 0).map((f) => flowLitresPerHour(f.ratedFlow!, f.flowUnit));
	const totalFlowLph = flows.reduce((sum, f) => sum + f, 0);
	const turnover =
		volume && flows.length
			? attempt(problems, () => {
					const perHour = turnoverPerHour(flows, volume.litres);
					return { perHour, assessment: assessTurnover(perHour) };
				})
			: null;

	const ageUntil = tank.retiredOn ? new Date(`${tank.retiredOn}T12:00:00Z`) : now;
	const age = tank.setUpOn ? attempt(problems, () => tankAge(tank.setUpOn!, ageUntil)) : null;

	const mainsWatts = tank.lights.reduce((sum, l) => sum + l.watts, 0) + (tank.heaterWatts ?? 0);
	const hasMains = mainsWatts > 0 || tank.filters.length > 0;
	return {
		inner,
		glassKnown,
		grossLitres,
		estimate,
		volume,
		weight,
		waterKg: volume ? waterMassKg(volume.litres, FIGURES_WATER_TEMP_C).kg : null,
		lighting,
		totalFlowLph,
		turnover,
		age,
		mainsWatts,
		cautions: {
			electrical: hasMains ? ELECTRICAL_SAFETY_CAUTION : null,
			weight: volume ? FILLED_TANK_LOAD_CAUTION : null,
			co2: tank.co2Method === 'pressurised' ? CO2_SAFETY_CAUTION : null
		},
		problems,
		notes
	};
}
