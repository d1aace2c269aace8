// Tank volume. Doses, turnover, light per litre and weight all hang on the water volume, so the
// estimate says what it subtracted and a measured volume, when the member has one, replaces it.

import { CalcInputError, requireInRange, requireNonNegative, requirePositive } from './validate';

/** Inside measurements of the glass box, in cm. */
export interface InnerDimensions {
	lengthCm: number;
	widthCm: number;
	heightCm: number;
}

/** Outside measurements, as a tape reads them across the glass, in cm. */
export interface OuterDimensions {
	lengthCm: number;
	widthCm: number;
	heightCm: number;
	/** Thickness of the side panes. */
	glassThicknessCm: number;
	/** Thickness of the bottom pane when it differs from the sides (defaults to the sides). */
	bottomThicknessCm?: number;
}

function checkInner(dims: InnerDimensions): InnerDimensions {
	requirePositive('inner length (cm)', dims.lengthCm);
	requirePositive('inner width (cm)', dims.widthCm);
	requirePositive('inner height (cm)', dims.heightCm);
	return dims;
}

/**
 * Inner dimensions from outer ones. Assumes an open-topped box of flat panes: length and width lose
 * a pane at each end (outer − 2 × thickness), height loses only the bottom pane (outer − bottom
 * thickness), since there is no glass at the top. Braces, rims and a lid are not subtracted.
 */
export function innerFromOuter(outer: OuterDimensions): InnerDimensions {
	const t = requirePositive('glass thickness (cm)', outer.glassThicknessCm);
	const bottom = outer.bottomThicknessCm === undefined ? t : requirePositive('bottom glass thickness (cm)', outer.bottomThicknessCm);
	const inner = { lengthCm: outer.lengthCm - 2 * t, widthCm: outer.widthCm - 2 * t, heightCm: outer.heightCm - bottom };
	if (!(inner.lengthCm > 0 && inner.widthCm > 0 && inner.heightCm > 0)) {
		throw new CalcInputError('glass thickness (cm)', 'the glass is thicker than the tank is wide: check the outer measurements and thickness');
	}
	return checkInner(inner);
}

/** Brim-full volume of the inner box in litres (1 L = 1000 cm³). */
export function grossVolumeLitres(dims: InnerDimensions): number {
	checkInner(dims);
	return (dims.lengthCm * dims.widthCm * dims.heightCm) / 1000;
}

/** How far below the rim the water usually stands (common practice, no source). */
export const DEFAULT_WATER_LINE_BELOW_RIM_CM = 2;

/** Rock and wood either as the litres they displace (measured in a bucket) or as a share of the water space. */
export type Hardscape = { litres: number } | { share: number };

/** Substrate depth: one average depth, or front and back depths of a sloped bed (averaged). */
export type SubstrateDepth = number | { frontCm: number; backCm: number };

export interface WaterVolumeInput {
	inner: InnerDimensions;
	substrateDepth?: SubstrateDepth;
	hardscape?: Hardscape;
	/** Defaults to DEFAULT_WATER_LINE_BELOW_RIM_CM. */
	waterLineBelowRimCm?: number;
}

export interface WaterVolumeEstimate {
	grossLitres: number;
	/** Height of free water above the substrate, cm. */
	waterDepthCm: number;
	substrateDepthCm: number;
	substrateLitres: number;
	/** Water that would stand above the substrate without rock or wood. */
	waterSpaceLitres: number;
	hardscapeLitres: number;
	waterLitres: number;
}

/** Average depth of the substrate in cm; a linear slope averages front and back. */
export function averageSubstrateDepthCm(depth: SubstrateDepth): number {
	if (typeof depth === 'number') return requireNonNegative('substrate depth (cm)', depth);
	requireNonNegative('substrate depth at the front (cm)', depth.frontCm);
	requireNonNegative('substrate depth at the back (cm)', depth.backCm);
	return (depth.frontCm + depth.backCm) / 2;
}

/**
 * Estimated water volume: footprint × (height − water line gap − substrate depth), less hardscape.
 * Water held in the pores of the substrate is not counted: it barely mixes with the water column,
 * so leaving it out keeps doses and turnover on the water that the fish and plants actually share.
 */
export function estimateWaterVolume(input: WaterVolumeInput): WaterVolumeEstimate {
	const { inner } = input;
	const grossLitres = grossVolumeLitres(inner);
	const gap = requireNonNegative('water line below rim (cm)', input.waterLineBelowRimCm ?? DEFAULT_WATER_LINE_BELOW_RIM_CM);
	const substrateDepthCm = input.substrateDepth === undefined ? 0 : averageSubstrateDepthCm(input.substrateDepth);
	const waterDepthCm = inner.heightCm - gap - substrateDepthCm;
	if (!(waterDepthCm > 0)) {
		throw new CalcInputError('substrate depth (cm)', 'substrate and the gap below the rim leave no room for water: check the depths against the tank height');
	}
	const footprintCm2 = inner.lengthCm * inner.widthCm;
	const substrateLitres = (footprintCm2 * substrateDepthCm) / 1000;
	const waterSpaceLitres = (footprintCm2 * waterDepthCm) / 1000;
	let hardscapeLitres = 0;
	if (input.hardscape && 'litres' in input.hardscape) {
		hardscapeLitres = requireNonNegative('hardscape volume (L)', input.hardscape.litres);
		if (hardscapeLitres >= waterSpaceLitres) throw new CalcInputError('hardscape volume (L)', 'the rock and wood would take up all the water space');
	} else if (input.hardscape) {
		const share = requireInRange('hardscape share', input.hardscape.share, 0, 0.95);
		hardscapeLitres = waterSpaceLitres * share;
	}
	return {
		grossLitres,
		waterDepthCm,
		substrateDepthCm,
		substrateLitres,
		waterSpaceLitres,
		hardscapeLitres,
		waterLitres: waterSpaceLitres - hardscapeLitres
	};
}

export type VolumeSource = 'measured' | 'estimated';

export interface ChosenVolume {
	litres: number;
	source: VolumeSource;
}

/**
 * The volume the other calculators should use. A measured value (a metered fill, or counting
 * buckets) beats any estimate because it already includes what the estimate has to guess.
 */
export function chooseWaterVolume(estimatedLitres: number | null | undefined, measuredLitres?: number | null): ChosenVolume {
	if (measuredLitres !== null && measuredLitres !== undefined) {
		return { litres: requirePositive('measured volume (L)', measuredLitres), source: 'measured' };
	}
	if (estimatedLitres === null || estimatedLitres === undefined) {
		throw new CalcInputError('volume (L)', 'no measured or estimated volume: enter the tank dimensions or a measured volume');
	}
	return { litres: requirePositive('estimated volume (L)', estimatedLitres), source: 'estimated' };
}
