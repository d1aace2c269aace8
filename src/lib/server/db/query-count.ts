// Counts the SQL statements each request sends, for the benchmark (`npm run bench`): with BENCH=1
// every response carries `X-Query-Count`. Off by default; then nothing is wrapped or stored.
import { AsyncLocalStorage } from 'node:async_hooks';
import type { Handle } from '@sveltejs/kit';
import type { Pool, PoolConnection } from 'mysql2/promise';
import { config } from '../config';

const current = new AsyncLocalStorage<{ queries: number }>();

export const QUERY_COUNT_HEADER = 'X-Query-Count';

function counted<F extends (...args: never[]) => unknown>(fn: F): F {
	return function (this: unknown, ...args: Parameters<F>) {
		const store = current.getStore();
		if (store) store.queries++;
		return fn.apply(this, args);
	} as F;
}

/**
 * Counts every statement sent through the pool, and through connections taken from it (Drizzle's
 * transactions, BEGIN and COMMIT included), against the request that sent it. The count is taken
 * when the statement is sent, in the caller's async context, so requests in parallel never mix.
 */
export function countStatements(pool: Pool): void {
	pool.query = counted(pool.query);
	pool.execute = counted(pool.execute);
	const getConnection = pool.getConnection;
	pool.getConnection = async function (this: Pool) {
		const connection: PoolConnection = await getConnection.call(this);
		connection.query = counted(connection.query);
		connection.execute = counted(connection.execute);
		return connection;
	};
}

/** Runs `work` and counts the statements it sends through counted pools, apart from any other work in flight. */
export async function measure<T>(work: () => Promise<T>): Promise<{ value: T; queries: number }> {
	const store = { queries: 0 };
	const value = await current.run(store, work);
	return { value, queries: store.queries };
}

const counting: Handle = async ({ event, resolve }) => {
	const { value: response, queries } = await measure(async () => resolve(event));
	response.headers.set(QUERY_COUNT_HEADER, String(queries));
	return response;
};

/** The first handle in hooks.server.ts: with BENCH=1, one count per request in a response header; otherwise nothing. */
export const countQueries: Handle = config().BENCH ? counting : ({ event, resolve }) => resolve(event);
