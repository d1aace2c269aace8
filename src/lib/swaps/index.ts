// Swap board: pure functions for distances, listing states and quantities.
export * from './distance';
export * from './display';
export * from './listing';
export * from './listing-state';
export * from './quantity';
