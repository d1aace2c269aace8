// Weight of a filled tank. Members place tanks on furniture and upper floors; the total is the
// number they need before they fill, so every part is shown and the caution travels with it.

import { type OuterDimensions, innerFromOuter } from './volume';
import type { UnitSystem } from './units';
import { CalcInputError, requireFinite, requireNonNegative, requirePositive } from './validate';

/**
 * Constants of the CIPM formula for the density of air-free water at 101.325 kPa, Tanaka, Girard,
 * Davis, Peuto & Bignell (2001), Metrologia 38:301–309:
 * ρ(t) = a5 · [1 − (t + a1)² (t + a2) / (a3 (t + a4))], t in °C (ITS-90), ρ in kg/m³.
 */
export const TANAKA_2001 = {
	a1: -3.983035,
	a2: 301.797,
	a3: 522528.9,
	a4: 69.34881,
	a5: 999.97495
} as const;

/** The range of temperatures the formula was fitted over. */
export const WATER_DENSITY_VALID_RANGE_C = { min: 0, max: 40 } as const;

export interface WaterDensity {
	kgPerM3: number;
	/** False outside 0–40 °C, where the formula is extrapolated. */
	inValidRange: boolean;
}

/**
 * Density of water at a temperature. Dissolved solids of tank water (a few hundred mg/L) raise it
 * by a few hundredths of a percent, far below the uncertainty of any volume estimate, so pure water
 * stands in for tank water.
 */
export function waterDensity(tempC: number): WaterDensity {
	requireFinite('water temperature (°C)', tempC);
	if (tempC < 0 || tempC > 100) throw new CalcInputError('water temperature (°C)', `water is not liquid at ${tempC} °C at normal pressure`);
	const { a1, a2, a3, a4, a5 } = TANAKA_2001;
	const kgPerM3 = a5 * (1 - ((tempC + a1) ** 2 * (tempC + a2)) / (a3 * (tempC + a4)));
	return { kgPerM3, inValidRange: tempC >= WATER_DENSITY_VALID_RANGE_C.min && tempC <= WATER_DENSITY_VALID_RANGE_C.max };
}

export interface WaterMass extends WaterDensity {
	kg: number;
}

/** Mass of a volume of water at a temperature (1 L = 0.001 m³). */
export function waterMassKg(litres: number, tempC: number): WaterMass {
	requireNonNegative('water volume (L)', litres);
	const density = waterDensity(tempC);
	return { ...density, kg: (litres * density.kgPerM3) / 1000 };
}

/** Soda-lime float glass, about 2.5 g/cm³ (handbook value, from memory). */
export const SODA_LIME_GLASS_DENSITY_G_PER_CM3 = 2.5;

export interface GlassPanes {
	/** Areas of the panes in cm²; the lid is left out. */
	bottomCm2: number;
	frontAndBackCm2: number;
	endsCm2: number;
	/** Volume of glass in cm³. */
	volumeCm3: number;
	kg: number;
}

/**
 * Glass of the bottom and four walls. The panes are sized as such tanks are usually built (bottom
 * pane under the walls, front and back full length, ends between them), so no corner is counted
 * twice and the sum equals outer box minus inner box. A lid and braces are ignored.
 */
export function glassMass(outer: OuterDimensions, densityGPerCm3 = SODA_LIME_GLASS_DENSITY_G_PER_CM3): GlassPanes {
	requirePositive('glass density (g/cm³)', densityGPerCm3);
	const inner = innerFromOuter(outer);
	const t = outer.glassThicknessCm;
	const bottomT = outer.bottomThicknessCm ?? t;
	const bottomCm2 = outer.lengthCm * outer.widthCm;
	const frontAndBackCm2 = 2 * outer.lengthCm * inner.heightCm;
	const endsCm2 = 2 * inner.widthCm * inner.heightCm;
	const volumeCm3 = bottomCm2 * bottomT + (frontAndBackCm2 + endsCm2) * t;
	return { bottomCm2, frontAndBackCm2, endsCm2, volumeCm3, kg: (volumeCm3 * densityGPerCm3) / 1000 };
}

export const SUBSTRATE_KINDS = ['nutrient-soil', 'sand', 'gravel'] as const;
export type SubstrateKind = (typeof SUBSTRATE_KINDS)[number];

/**
 * Bulk density of substrate as laid and soaked, kg per litre of bed (from memory; products vary).
 * Wet values on purpose: the water volume estimate leaves out the water in the pores, so its
 * weight is carried here, and for a load check an estimate on the high side is the safe one.
 */
export const SUBSTRATE_BULK_DENSITY_KG_PER_L: Record<SubstrateKind, number> = {
	'nutrient-soil': 1.4,
	sand: 2.0,
	gravel: 1.9
};

export const SUBSTRATE_LABELS: Record<SubstrateKind, string> = {
	'nutrient-soil': 'Nutrient soil (fired granules)',
	sand: 'Sand',
	gravel: 'Gravel'
};

/** Substrate mass from its bed volume and a kind (or a density the member weighed themselves). */
export function substrateMassKg(litres: number, kind: SubstrateKind | { kgPerLitre: number }): number {
	requireNonNegative('substrate volume (L)', litres);
	const density = typeof kind === 'string' ? SUBSTRATE_BULK_DENSITY_KG_PER_L[kind] : requirePositive('substrate density (kg/L)', kind.kgPerLitre);
	return litres * density;
}

export interface FilledTankInput {
	outer: OuterDimensions;
	waterLitres: number;
	waterTempC: number;
	substrate?: { litres: number; kind: SubstrateKind | { kgPerLitre: number } };
	/** Rock and wood, if weighed. */
	hardscapeKg?: number;
}

export interface FilledTankWeight {
	waterKg: number;
	glassKg: number;
	substrateKg: number;
	hardscapeKg: number;
	totalKg: number;
	/** Total over the tank's own footprint, kg/m²; the stand spreads it over its feet or frame. */
	kgPerM2OfFootprint: number;
	/** False when the water temperature lies outside the density formula's range. */
	densityInValidRange: boolean;
	caution: string;
}

/** Sum of water, glass, substrate and hardscape, for the floor and stand check. */
export function filledTankWeight(input: FilledTankInput): FilledTankWeight {
	const water = waterMassKg(input.waterLitres, input.waterTempC);
	const glass = glassMass(input.outer);
	const substrateKg = input.substrate ? substrateMassKg(input.substrate.litres, input.substrate.kind) : 0;
	const hardscapeKg = input.hardscapeKg === undefined ? 0 : requireNonNegative('hardscape mass (kg)', input.hardscapeKg);
	const totalKg = water.kg + glass.kg + substrateKg + hardscapeKg;
	return {
		waterKg: water.kg,
		glassKg: glass.kg,
		substrateKg,
		hardscapeKg,
		totalKg,
		kgPerM2OfFootprint: totalKg / ((input.outer.lengthCm * input.outer.widthCm) / 10_000),
		densityInValidRange: water.inValidRange,
		caution: FILLED_TANK_LOAD_CAUTION
	};
}

/**
 * Water's weight per volume unit in words, rounded as a rule of thumb: 1 kg per litre; 3.785 kg
 * (8.3 lb) per US gallon; 4.546 kg (10.0 lb) per imperial gallon (see the tests).
 */
const WATER_WEIGHT_WORDS: Record<UnitSystem, string> = {
	metric: '1 kg for every litre',
	us: '8.3 lb for every US gallon',
	imperial: '10 lb for every imperial gallon'
};

/** The caution about a filled tank's load, its rule of thumb in the member's units. */
export const loadCaution = (units: UnitSystem) => FILLED_TANK_LOAD_CAUTION.replace(WATER_WEIGHT_WORDS.metric, WATER_WEIGHT_WORDS[units]);

export const FILLED_TANK_LOAD_CAUTION =
	'A filled tank weighs about 1 kg for every litre of water, plus the glass, substrate and rock. ' +
	'Place it on a stand made for that load, level and on a flat, even surface, and check that the floor can carry it, ' +
	'especially upstairs, on a suspended timber floor or near the middle of a span. ' +
	'For a large tank, ask a builder or structural engineer before you fill it, and follow local building rules.';
