// Input checks shared by the journal computations. They throw rather than return NaN so a bad
// form value surfaces as a clear message next to its field instead of as "NaN L" on a page.

/** Thrown for input no formula can use; `field` names the value so a form can place the message. */
export class CalcInputError extends RangeError {
	readonly field: string;
	constructor(field: string, message: string) {
		super(message);
		this.name = 'CalcInputError';
		this.field = field;
	}
}

export function requireFinite(field: string, value: number): number {
	if (typeof value !== 'number' || !Number.isFinite(value)) {
		throw new CalcInputError(field, `${field} must be a finite number (got ${String(value)})`);
	}
	return value;
}

export function requirePositive(field: string, value: number): number {
	requireFinite(field, value);
	if (value <= 0) throw new CalcInputError(field, `${field} must be greater than zero (got ${value})`);
	return value;
}

export function requireNonNegative(field: string, value: number): number {
	requireFinite(field, value);
	if (value < 0) throw new CalcInputError(field, `${field} must not be negative (got ${value})`);
	return value;
}

export function requireInRange(field: string, value: number, min: number, max: number): number {
	requireFinite(field, value);
	if (value < min || value > max) {
		throw new CalcInputError(field, `${field} must be between ${min} and ${max} (got ${value})`);
	}
	return value;
}
