/** Any origin will do: the check is that the result stays on whichever origin it is resolved against. */
const BASE = 'http://riparia.invalid';

/**
 * Where to send someone after sign-in or another step: only a path on this site, or "/".
 *
 * The decision is made on the value a browser would act on — the URL parser's normalised path —
 * not on the raw string: dot segments, backslashes, encoded or doubled slashes and control
 * characters can all turn an innocent-looking string into `//elsewhere` once normalised. The
 * result is "/" or a path that starts with exactly one "/" followed by something else, and it
 * resolves against any origin to that same origin.
 */
export function safeRedirectPath(candidate: string | null | undefined): string {
	if (!candidate) return '/';
	const raw = candidate.trim();
	// Control characters and backslashes have no place in our own paths, and parsers disagree about them.
	// eslint-disable-next-line no-control-regex
	if (!raw.startsWith('/') || /[\u0000-\u001f\u007f\\]/.test(raw)) return '/';
	let parsed: URL;
	try {
		parsed = new URL(raw, BASE);
	} catch {
		return '/';
	}
	if (parsed.origin !== BASE) return '/';
	const path = parsed.pathname;
	let decoded: string;
	try {
		decoded = decodeURIComponent(path);
	} catch {
		return '/';
	}
	// The normalised path, and the same path once decoded (some servers and proxies decode it again).
	for (const p of [path, decoded]) {
		// eslint-disable-next-line no-control-regex
		if (!p.startsWith('/') || p.startsWith('//') || /[\u0000-\u001f\u007f\\]/.test(p)) return '/';
	}
	// Auth endpoints would loop or sign the person out again.
	if (decoded.startsWith('/auth/') || decoded.startsWith('/signin')) return '/';
	const result = path + parsed.search + parsed.hash;
	// Belt and braces: the result must come back to the same origin and start with a single slash.
	if (new URL(result, BASE).origin !== BASE || result.startsWith('//')) return '/';
	return result;
}
