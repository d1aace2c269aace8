// Atomic weights for hardness, CO2, ammonia and dose computations, so every factor in those
// modules is derived from one table instead of being typed in as a rounded constant.

/**
 * CIAAW standard atomic weights 2021, abridged to five significant figures (Prohaska et al. 2022,
 * Pure Appl. Chem. 94:573–600). For elements whose standard weight is an interval (H, C, N, O, Mg,
 * S, Cl) the abridged value is the one the commission gives for ordinary use; S and Cl carry fewer
 * figures because natural variation makes more meaningless. Far finer than any hobby scale or kit.
 */
export const ATOMIC_WEIGHTS = {
	H: 1.008,
	C: 12.011,
	N: 14.007,
	O: 15.999,
	Na: 22.99,
	Mg: 24.305,
	P: 30.974,
	S: 32.06,
	Cl: 35.45,
	K: 39.098,
	Ca: 40.078,
	Fe: 55.845
} as const;

export type Element = keyof typeof ATOMIC_WEIGHTS;

/** Atoms per formula unit, e.g. MgSO4·7H2O = { Mg: 1, S: 1, O: 11, H: 14 }. */
export type Composition = Partial<Record<Element, number>>;

/** Molar mass in g/mol from a composition. */
export function molarMass(composition: Composition): number {
	let total = 0;
	for (const [element, count] of Object.entries(composition) as [Element, number][]) {
		if (!Number.isInteger(count) || count < 1) throw new RangeError(`atom count for ${element} must be a positive integer (got ${count})`);
		total += ATOMIC_WEIGHTS[element] * count;
	}
	if (total === 0) throw new RangeError('composition must contain at least one atom');
	return total;
}

/** Molar masses (g/mol) of the species the calculators use, from the table above. */
export const MOLAR_MASS = {
	CaO: molarMass({ Ca: 1, O: 1 }),
	HCO3: molarMass({ H: 1, C: 1, O: 3 }),
	CO2: molarMass({ C: 1, O: 2 }),
	NH3: molarMass({ N: 1, H: 3 }),
	NH4: molarMass({ N: 1, H: 4 }),
	N: ATOMIC_WEIGHTS.N,
	P: ATOMIC_WEIGHTS.P
} as const;
