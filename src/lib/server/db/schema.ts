// Every domain's tables, for Drizzle's relational queries and for the migration generator
// (drizzle.config.ts points here). A new domain adds one line.
export * from './meta';
export * from '../club/schema';
export * from '../audit/schema';
export * from '../mail/schema';
export * from '../media/schema';
export * from '../species/schema';
export * from '../journals/schema';
export * from '../swaps/schema';
export * from '../contests/schema';
export * from '../away/schema';
export * from '../news/schema';
