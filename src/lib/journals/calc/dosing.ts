// Fertiliser doses from dry salts. Keepers mix their own nutrients and need both directions:
// what a spoonful adds to the tank, and how much salt reaches a target.

import { type Composition, molarMass } from './elements';
import { CalcInputError, requireNonNegative, requirePositive } from './validate';

/** What a dose is reported as. N and P are the elements, for comparison with labels that state N or P. */
export const NUTRIENTS = ['NO3', 'PO4', 'K', 'SO4', 'Mg', 'Ca', 'Cl', 'HCO3', 'N', 'P'] as const;
export type Nutrient = (typeof NUTRIENTS)[number];

export const NUTRIENT_LABELS: Record<Nutrient, string> = {
	NO3: 'Nitrate (NO₃⁻)',
	PO4: 'Phosphate (PO₄³⁻)',
	K: 'Potassium (K⁺)',
	SO4: 'Sulfate (SO₄²⁻)',
	Mg: 'Magnesium (Mg²⁺)',
	Ca: 'Calcium (Ca²⁺)',
	Cl: 'Chloride (Cl⁻)',
	HCO3: 'Bicarbonate (HCO₃⁻)',
	N: 'Nitrogen as N',
	P: 'Phosphorus as P'
};

/**
 * Molar masses of what is reported. Phosphate is given as PO4 because kits read PO4, although
 * monopotassium phosphate dissolves mostly as H2PO4⁻ at tank pH.
 */
const NUTRIENT_COMPOSITION: Record<Nutrient, Composition> = {
	NO3: { N: 1, O: 3 },
	PO4: { P: 1, O: 4 },
	K: { K: 1 },
	SO4: { S: 1, O: 4 },
	Mg: { Mg: 1 },
	Ca: { Ca: 1 },
	Cl: { Cl: 1 },
	HCO3: { H: 1, C: 1, O: 3 },
	N: { N: 1 },
	P: { P: 1 }
};

export const NUTRIENT_MOLAR_MASS: Record<Nutrient, number> = Object.fromEntries(NUTRIENTS.map((n) => [n, molarMass(NUTRIENT_COMPOSITION[n])])) as Record<
	Nutrient,
	number
>;

export interface Salt {
	id: SaltId;
	name: string;
	/** Formula as printed, with the water of crystallisation. */
	formula: string;
	composition: Composition;
	/** Formula units of each nutrient in one formula unit of the salt. */
	yields: Partial<Record<Nutrient, number>>;
}

export const SALT_IDS = ['KNO3', 'KH2PO4', 'K2SO4', 'MgSO4·7H2O', 'CaSO4·2H2O', 'KCl', 'Ca(NO3)2·4H2O', 'KHCO3'] as const;
export type SaltId = (typeof SALT_IDS)[number];

/** Plain laboratory or technical salts (no products); the hydrate is the form sold dry. */
export const SALTS: Record<SaltId, Salt> = {
	KNO3: { id: 'KNO3', name: 'Potassium nitrate', formula: 'KNO₃', composition: { K: 1, N: 1, O: 3 }, yields: { K: 1, NO3: 1, N: 1 } },
	KH2PO4: {
		id: 'KH2PO4',
		name: 'Monopotassium phosphate',
		formula: 'KH₂PO₄',
		composition: { K: 1, H: 2, P: 1, O: 4 },
		yields: { K: 1, PO4: 1, P: 1 }
	},
	K2SO4: { id: 'K2SO4', name: 'Potassium sulfate', formula: 'K₂SO₄', composition: { K: 2, S: 1, O: 4 }, yields: { K: 2, SO4: 1 } },
	'MgSO4·7H2O': {
		id: 'MgSO4·7H2O',
		name: 'Magnesium sulfate heptahydrate',
		formula: 'MgSO₄·7H₂O',
		composition: { Mg: 1, S: 1, O: 11, H: 14 },
		yields: { Mg: 1, SO4: 1 }
	},
	'CaSO4·2H2O': {
		id: 'CaSO4·2H2O',
		name: 'Calcium sulfate dihydrate',
		formula: 'CaSO₄·2H₂O',
		composition: { Ca: 1, S: 1, O: 6, H: 4 },
		yields: { Ca: 1, SO4: 1 }
	},
	KCl: { id: 'KCl', name: 'Potassium chloride', formula: 'KCl', composition: { K: 1, Cl: 1 }, yields: { K: 1, Cl: 1 } },
	'Ca(NO3)2·4H2O': {
		id: 'Ca(NO3)2·4H2O',
		name: 'Calcium nitrate tetrahydrate',
		formula: 'Ca(NO₃)₂·4H₂O',
		composition: { Ca: 1, N: 2, O: 10, H: 8 },
		yields: { Ca: 1, NO3: 2, N: 2 }
	},
	KHCO3: { id: 'KHCO3', name: 'Potassium bicarbonate', formula: 'KHCO₃', composition: { K: 1, H: 1, C: 1, O: 3 }, yields: { K: 1, HCO3: 1 } }
};

export function saltMolarMass(id: SaltId): number {
	return molarMass(SALTS[id].composition);
}

/** Mass fraction of a nutrient in a salt (0 when the salt does not supply it). */
export function massFraction(id: SaltId, nutrient: Nutrient): number {
	const count = SALTS[id].yields[nutrient] ?? 0;
	return (count * NUTRIENT_MOLAR_MASS[nutrient]) / saltMolarMass(id);
}

/** mg/L of every nutrient that `grams` of a salt adds to `litres` of water. */
export function doseContribution(id: SaltId, grams: number, litres: number): Partial<Record<Nutrient, number>> {
	requireNonNegative('salt (g)', grams);
	requirePositive('water volume (L)', litres);
	const result: Partial<Record<Nutrient, number>> = {};
	for (const nutrient of Object.keys(SALTS[id].yields) as Nutrient[]) {
		result[nutrient] = (grams * 1000 * massFraction(id, nutrient)) / litres;
	}
	return result;
}

/** Grams of a salt that raise one nutrient by `targetMgPerL` in `litres` of water. */
export function gramsForTarget(id: SaltId, nutrient: Nutrient, targetMgPerL: number, litres: number): number {
	requireNonNegative('target (mg/L)', targetMgPerL);
	requirePositive('water volume (L)', litres);
	const fraction = massFraction(id, nutrient);
	if (fraction === 0) throw new CalcInputError('nutrient', `${SALTS[id].name} does not supply ${NUTRIENT_LABELS[nutrient].toLowerCase()}`);
	return (targetMgPerL * litres) / (1000 * fraction);
}

export const FERTILISER_SAFETY_CAUTION =
	'Fertiliser salts are chemicals: keep them out of reach of children and pets, store them dry in closed, clearly labelled containers, ' +
	'and never in food or drink containers. Weigh doses rather than guessing, and do not overdose: too much can harm fish and shrimp. ' +
	'Read the safety data sheet of the salt you buy and follow it (some, such as potassium nitrate, are oxidisers to keep away from heat and fuel).';
