// Which tanks a category accepts: an optional water-volume range and an optional minimum age,
// both checked against the figures of the tank profile (see $lib/journals/figures). Rules are set
// and checked in litres; members who use gallons read their own gallon beside each figure.
import { formatVolume, type UnitSystem } from '../journals/calc/units';

export interface EligibilityRule {
	/** Inclusive bounds in litres of water; null for no bound. */
	minLitres: number | null;
	maxLitres: number | null;
	/** Whole weeks the tank must have been running on the day it is entered; null for no minimum. */
	minAgeWeeks: number | null;
}

export interface TankFacts {
	/** The tank's water volume (measured, else estimated); null when it cannot be worked out. */
	litres: number | null;
	volumeSource: 'measured' | 'estimated' | null;
	/** Whole weeks since set-up; null without a set-up date. */
	ageWeeks: number | null;
	retired: boolean;
}

export interface EligibilityCheck {
	eligible: boolean;
	/** One sentence per unmet condition, for the member. */
	reasons: string[];
	/** The volume as compared and shown: rounded to one decimal, so what the member reads is what is judged. */
	comparedLitres: number | null;
}

export const LITRES_DECIMALS = 1;

export const roundLitres = (litres: number) => Math.round(litres * 10 ** LITRES_DECIMALS) / 10 ** LITRES_DECIMALS;

const fmt = (n: number) => n.toLocaleString('en-GB', { maximumFractionDigits: LITRES_DECIMALS });
/** "60 L", or "60 L (15.9 US gal)" for a member who uses gallons. */
const litresText = (litres: number, units: UnitSystem) => `${fmt(litres)} L${units === 'metric' ? '' : ` (${formatVolume(litres, units)})`}`;
/** "10–60 L", or "10–60 L (2.64–15.9 US gal)". */
function rangeText(min: number, max: number, units: UnitSystem): string {
	if (units === 'metric') return `${fmt(min)}–${fmt(max)} L`;
	return `${fmt(min)}–${fmt(max)} L (${formatVolume(min, units).replace(/ .*$/, '')}–${formatVolume(max, units)})`;
}
const weeks = (n: number) => `${n} week${n === 1 ? '' : 's'}`;

/** "10–60 L of water, running at least 8 weeks", or "Any tank". */
export function describeRule(rule: EligibilityRule, units: UnitSystem = 'metric'): string {
	const parts: string[] = [];
	if (rule.minLitres !== null && rule.maxLitres !== null) parts.push(`${rangeText(rule.minLitres, rule.maxLitres, units)} of water`);
	else if (rule.minLitres !== null) parts.push(`at least ${litresText(rule.minLitres, units)} of water`);
	else if (rule.maxLitres !== null) parts.push(`up to ${litresText(rule.maxLitres, units)} of water`);
	if (rule.minAgeWeeks !== null && rule.minAgeWeeks > 0) parts.push(`running at least ${weeks(rule.minAgeWeeks)}`);
	if (parts.length === 0) return 'Any running tank';
	const text = parts.join(', ');
	return text[0]!.toUpperCase() + text.slice(1);
}

export function checkEligibility(rule: EligibilityRule, tank: TankFacts, units: UnitSystem = 'metric'): EligibilityCheck {
	const reasons: string[] = [];
	const comparedLitres = tank.litres === null ? null : roundLitres(tank.litres);
	if (tank.retired) reasons.push('The tank is retired; only running tanks can be entered.');
	if (rule.minLitres !== null || rule.maxLitres !== null) {
		if (comparedLitres === null) {
			reasons.push('Its water volume cannot be worked out: check the size on the tank profile, or enter a measured volume.');
		} else {
			if (rule.minLitres !== null && comparedLitres < rule.minLitres) {
				reasons.push(`It holds ${litresText(comparedLitres, units)} of water; this category needs at least ${litresText(rule.minLitres, units)}.`);
			}
			if (rule.maxLitres !== null && comparedLitres > rule.maxLitres) {
				reasons.push(`It holds ${litresText(comparedLitres, units)} of water; this category takes at most ${litresText(rule.maxLitres, units)}.`);
			}
		}
	}
	if (rule.minAgeWeeks !== null && rule.minAgeWeeks > 0) {
		if (tank.ageWeeks === null) reasons.push('Its set-up date is missing: add it to the tank profile so its age can be checked.');
		else if (tank.ageWeeks < rule.minAgeWeeks) {
			reasons.push(`It has been running ${weeks(tank.ageWeeks)}; this category needs at least ${weeks(rule.minAgeWeeks)}.`);
		}
	}
	return { eligible: reasons.length === 0, reasons, comparedLitres };
}

/** Problems with a rule as an admin typed it, keyed by field. */
export function validateRule(rule: EligibilityRule): Partial<Record<keyof EligibilityRule, string>> {
	const errors: Partial<Record<keyof EligibilityRule, string>> = {};
	if (rule.minLitres !== null && !(rule.minLitres >= 0)) errors.minLitres = 'Give a volume of 0 litres or more.';
	if (rule.maxLitres !== null && !(rule.maxLitres > 0)) errors.maxLitres = 'Give a volume above 0 litres.';
	if (rule.minLitres !== null && rule.maxLitres !== null && rule.maxLitres < rule.minLitres) {
		errors.maxLitres = 'The largest volume must not be below the smallest.';
	}
	if (rule.minAgeWeeks !== null && !(Number.isInteger(rule.minAgeWeeks) && rule.minAgeWeeks >= 0)) {
		errors.minAgeWeeks = 'Give a whole number of weeks.';
	}
	return errors;
}
