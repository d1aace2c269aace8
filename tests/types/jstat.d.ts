// The parts of jstat (a general-purpose statistics library, no bundled types) that unit tests use
// as an independent reference.
declare module 'jstat' {
	interface JStat {
		/** Ranks, 1 = smallest, ties given their average rank. */
		rank(values: number[]): number[];
		chisquare: { cdf(x: number, degreesOfFreedom: number): number };
	}
	const jStat: JStat;
	export default jStat;
}
