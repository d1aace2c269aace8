// The few descriptive statistics judging needs, written out so each choice (population or
// sample deviation, the even-count median) is visible where it is used.

export function mean(values: readonly number[]): number {
	if (values.length === 0) throw new RangeError('mean of no values');
	let sum = 0;
	for (const v of values) sum += v;
	return sum / values.length;
}

/** Middle value; for an even count the mean of the two middle values. */
export function median(values: readonly number[]): number {
	if (values.length === 0) throw new RangeError('median of no values');
	const sorted = [...values].sort((a, b) => a - b);
	const mid = Math.floor(sorted.length / 2);
	return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** √(Σ(x − x̄)² / n): the spread of exactly these values, not an estimate for a wider population. */
export function populationStandardDeviation(values: readonly number[]): number {
	const m = mean(values);
	let ss = 0;
	for (const v of values) ss += (v - m) ** 2;
	return Math.sqrt(ss / values.length);
}

/** √(Σ(x − x̄)² / (n − 1)): Bessel-corrected estimate from a sample; needs two values. */
export function sampleStandardDeviation(values: readonly number[]): number {
	if (values.length < 2) throw new RangeError('sample standard deviation needs two values');
	const m = mean(values);
	let ss = 0;
	for (const v of values) ss += (v - m) ** 2;
	return Math.sqrt(ss / (values.length - 1));
}
