import type { Placement } from '../species/kinds';
import type { Co2Method, FlowUnit, TankVisibility } from './tank-vocabulary';

// A tank profile as the domain takes it: validated, every measure metric. Rows of the repeatable
// lists carry the id of the stored row they update, or none for a new row.

export interface LightInput {
	id?: number;
	label: string;
	watts: number;
	hoursPerDay: number;
}

export interface FilterInput {
	id?: number;
	label: string;
	ratedFlow: number | null;
	flowUnit: FlowUnit;
	mediaNotes: string;
}

export interface FertiliserInput {
	id?: number;
	item: string;
	amount: string;
	frequency: string;
}

export interface PlantInput {
	id?: number;
	speciesId: number | null;
	name: string;
	placement: Placement | null;
	addedOn: string | null;
	removedOn: string | null;
}

export interface LivestockInput {
	id?: number;
	speciesId: number | null;
	name: string;
	count: number;
	addedOn: string | null;
	removedOn: string | null;
}

export interface TankInput {
	name: string;
	style: string;
	setUpOn: string | null;
	lengthCm: number;
	widthCm: number;
	heightCm: number;
	glassMm: number | null;
	substrateKind: string;
	substrateNote: string;
	substrateDepthCm: number | null;
	hardscape: string;
	hardscapeLitres: number | null;
	heaterWatts: number | null;
	/** The heater's set temperature, °C. */
	heaterSetC: number | null;
	heaterNote: string;
	co2Method: Co2Method;
	co2BubblesPerSecond: number | null;
	waterLitres: number | null;
	/** PAR measured at the substrate, µmol·m⁻²·s⁻¹ (whole numbers), and how deep under the water surface, cm; both or neither. */
	parAtSubstrate: number | null;
	parDepthCm: number | null;
	description: string;
	visibility: TankVisibility;
	lights: LightInput[];
	filters: FilterInput[];
	fertilisers: FertiliserInput[];
	plants: PlantInput[];
	livestock: LivestockInput[];
}

/** A saved profile as the edit form reads it back: the input's fields, each list row with its id. */
export interface StoredTankProfile extends Omit<TankInput, 'description' | 'lights' | 'filters' | 'fertilisers' | 'plants' | 'livestock'> {
	description: string | null;
	lights: (LightInput & { id: number })[];
	filters: (FilterInput & { id: number })[];
	fertilisers: (FertiliserInput & { id: number })[];
	plants: (PlantInput & { id: number })[];
	livestock: (LivestockInput & { id: number })[];
}
