// HTTP load on loopback with autocannon: a warm-up that is thrown away, then the measured run.
import autocannon from 'autocannon';

export interface LoadResult {
	requestsPerSecond: number;
	p50: number;
	p99: number;
	non2xx: number;
	errors: number;
	requests: number;
}

export interface LoadOptions {
	connections: number;
	warmupSeconds: number;
	seconds: number;
}

function run(url: string, cookie: string | null, connections: number, seconds: number) {
	return autocannon({
		url,
		connections,
		duration: seconds,
		headers: { accept: 'text/html,application/json', ...(cookie ? { cookie } : {}) }
	});
}

export async function load(url: string, cookie: string | null, options: LoadOptions): Promise<LoadResult> {
	await run(url, cookie, options.connections, options.warmupSeconds);
	const result = await run(url, cookie, options.connections, options.seconds);
	return {
		requestsPerSecond: result.requests.average,
		p50: result.latency.p50,
		p99: result.latency.p99,
		non2xx: result.non2xx,
		errors: result.errors + result.timeouts,
		requests: result.requests.total
	};
}

/** The statements one request took (the X-Query-Count header of a BENCH=1 server), asked a few times. */
export async function queriesFor(url: string, cookie: string | null): Promise<{ status: number; queries: number[] }> {
	const queries: number[] = [];
	let status = 0;
	for (let i = 0; i < 3; i++) {
		const response = await fetch(url, { headers: { accept: 'text/html,application/json', ...(cookie ? { cookie } : {}) }, redirect: 'manual' });
		await response.arrayBuffer();
		status = response.status;
		const header = response.headers.get('x-query-count');
		if (header === null) throw new Error(`${url} answered without X-Query-Count: is the server running with BENCH=1?`);
		queries.push(Number(header));
	}
	return { status, queries };
}
