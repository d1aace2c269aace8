import { appUrl } from './env';

export interface RequestOptions {
	cookie?: string;
	method?: string;
	/** Form fields; an array sends the field once per value. */
	form?: Record<string, string | string[]>;
	json?: unknown;
	accept?: string;
	headers?: Record<string, string>;
	/** Another instance of the app (same ORIGIN) to send the request to; the stack's app by default. */
	base?: string;
}

/**
 * A request to the running app as a browser would send it: no redirects followed, the Origin
 * header set for POSTs (SvelteKit's CSRF check), a session cookie when given.
 */
export async function request(path: string, options: RequestOptions = {}): Promise<Response> {
	const headers: Record<string, string> = { accept: options.accept ?? 'text/html', ...options.headers };
	if (options.cookie) headers.cookie = options.cookie;
	let body: BodyInit | undefined;
	if (options.form) {
		headers['content-type'] = 'application/x-www-form-urlencoded';
		body = new URLSearchParams(Object.entries(options.form).flatMap(([name, value]) => (Array.isArray(value) ? value : [value]).map((v) => [name, v])));
	} else if (options.json !== undefined) {
		headers['content-type'] = 'application/json';
		body = JSON.stringify(options.json);
	}
	const method = options.method ?? (body ? 'POST' : 'GET');
	if (method !== 'GET') headers.origin = appUrl();
	return fetch((options.base ?? appUrl()) + path, { method, headers, body, redirect: 'manual' });
}
