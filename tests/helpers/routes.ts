// Every page load, form action and endpoint method of the app, read from the route files
// themselves (each module is imported and its exports listed), so a test can tell when one is
// missing from a table kept by hand.

const MODULES = import.meta.glob<Record<string, unknown>>(['/src/routes/**/+page.server.ts', '/src/routes/**/+page.ts', '/src/routes/**/+server.ts']);

const METHODS = ['GET', 'HEAD', 'POST', 'PUT', 'PATCH', 'DELETE', 'OPTIONS', 'fallback'] as const;

export interface Operation {
	/** The route's id as SvelteKit names it, e.g. `/journals/[id=id]/edit`. */
	route: string;
	method: string;
	/** A form action's name ('default' for the unnamed one); absent for loads and endpoints. */
	action?: string;
	kind: 'load' | 'action' | 'endpoint';
}

export const describeOperation = (op: Operation) =>
	op.kind === 'action'
		? `POST ${op.route}${op.action === 'default' ? '' : `?/${op.action}`}`
		: `${op.method} ${op.route}${op.kind === 'load' ? ' (load)' : ''}`;

export const operationKey = (op: Operation) => `${op.kind} ${op.method} ${op.route} ${op.action ?? ''}`;

const routeOf = (file: string) => file.replace(/^\/src\/routes/, '').replace(/\/\+(page\.server|page|server)\.ts$/, '') || '/';

/** All operations, in route order. */
export async function discoverOperations(): Promise<Operation[]> {
	const found: Operation[] = [];
	for (const [file, load] of Object.entries(MODULES).sort(([a], [b]) => a.localeCompare(b))) {
		const mod = await load();
		const route = routeOf(file);
		if (file.endsWith('/+server.ts')) {
			for (const method of METHODS) if (method in mod) found.push({ route, method, kind: 'endpoint' });
			continue;
		}
		if ('load' in mod) found.push({ route, method: 'GET', kind: 'load' });
		const actions = (mod.actions ?? {}) as Record<string, unknown>;
		for (const action of Object.keys(actions)) found.push({ route, method: 'POST', action, kind: 'action' });
	}
	return found;
}

interface Pattern {
	route: string;
	regex: RegExp;
	/** Segments without parameters: SvelteKit prefers the route with more of them. */
	fixed: number;
}

const escape = (s: string) => s.replace(/[.*+?^${}()|\\]/g, '\\$&');

/** A route id as a regex over paths, where `:name` placeholders stand for parameter values. */
function patternOf(route: string): Pattern {
	let source = '';
	let fixed = 0;
	for (const segment of route.split('/').filter(Boolean)) {
		if (/^\(.+\)$/.test(segment)) continue; // a group: not part of the path
		if (/^\[\[.+\]\]$/.test(segment)) source += '(?:/[^/]+)?';
		else if (/^\[\.\.\..+\]$/.test(segment)) source += '(?:/.*)?';
		else if (segment.includes('['))
			source +=
				'/' +
				segment
					.split(/\[[^\]]+\]/)
					.map(escape)
					.join('[^/]+');
		else {
			source += '/' + escape(segment);
			fixed++;
		}
	}
	return { route, regex: new RegExp(`^${source || '/'}$`), fixed };
}

/**
 * The operation a request stands for: its path (placeholders such as `:tank` allowed) matched as
 * SvelteKit's router would among the routes that take its method, and `?/name` naming an action.
 */
export function operationFor(operations: Operation[], method: string, url: string): Operation | undefined {
	const [pathname = '/', search = ''] = url.split('?');
	const action = method === 'POST' && search.startsWith('/') ? search.slice(1) : undefined;
	const candidates = operations.filter((op) =>
		op.kind === 'endpoint' ? op.method === method : op.kind === 'load' ? method === 'GET' : method === 'POST' && op.action === (action ?? 'default')
	);
	const byRoute = new Map(candidates.map((op) => [op.route, op]));
	const best = [...byRoute.keys()]
		.map(patternOf)
		.filter((p) => p.regex.test(pathname))
		.sort((a, b) => b.fixed - a.fixed)[0];
	return best && byRoute.get(best.route);
}
