// Swap board: pure functions for distances, listing states, quantities, forms, filters,
// conversations, mail batching and restricted species.
export * from './distance';
export * from './display';
export * from './listing';
export * from './listing-state';
export * from './quantity';
export * from './board';
export * from './conversation';
export * from './listing-form';
export * from './notify';
export * from './pickup';
export * from './restrictions';
export * from './terms';
export * from './places';
export * from './labels';
