// How domain functions receive the database and the clock: inputs first, then an optional
// context last, the same in every domain. Tests pass a transaction or a fixed clock; routes
// usually pass nothing.
//
//   export async function withdraw(viewer: Viewer, id: number, context: Context = {}) {
//     const { db, now } = resolve(context);
import { db as appDb, type DbOrTx } from './db';

export interface Context {
	/** The pool, or a transaction the caller is in and wants this work to join. */
	db?: DbOrTx;
	/** "Now" for this call; defaults to the clock. */
	now?: Date;
}

export interface Resolved {
	db: DbOrTx;
	now: Date;
}

export const resolve = (context: Context = {}): Resolved => ({ db: context.db ?? appDb, now: context.now ?? new Date() });

/** The same context inside a transaction: work that must commit together passes this on. */
export const within = (context: Context, tx: DbOrTx): Context => ({ ...context, db: tx });
