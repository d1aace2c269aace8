// The keeper's computations for tank journals: pure functions, metric inside, units at the edges.
export * from './validate';
export * from './round';
export * from './elements';
export * from './units';
export * from './volume';
export * from './weight';
export * from './lighting';
export * from './filtration';
export * from './hardness';
export * from './co2';
export * from './ammonia';
export * from './dosing';
export * from './bands';
export * from './age';
export * from './maintenance';
