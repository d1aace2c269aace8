// Contest judging: pure functions from rubric and cards to totals, places and judging reports.
export * from './rubric';
export * from './scoring';
export * from './aggregate';
export * from './standardise';
export * from './ranking';
export * from './concordance';
export * from './outliers';
export * from './readiness';
export { mean, median, populationStandardDeviation, sampleStandardDeviation } from './stats';
export * from './lifecycle';
export * from './eligibility';
export * from './results';
export * from './card';
