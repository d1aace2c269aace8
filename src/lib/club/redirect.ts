/**
 * Where to send someone after sign-in: only a path on this site. Anything that could leave the
 * site (absolute URLs, protocol-relative `//host`, backslash tricks, control characters) becomes "/".
 */
export function safeRedirectPath(candidate: string | null | undefined): string {
	if (!candidate) return '/';
	let value = candidate.trim();
	try {
		// A value that arrives percent-encoded once more is decoded for the check only.
		if (/%2f|%5c/i.test(value)) value = decodeURIComponent(value);
	} catch {
		return '/';
	}
	if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/';
	// eslint-disable-next-line no-control-regex
	if (/[\u0000-\u001f\\]/.test(value)) return '/';
	const parsed = new URL(value, 'http://riparia.invalid');
	if (parsed.host !== 'riparia.invalid') return '/';
	// Auth endpoints would loop or sign the person out again.
	if (parsed.pathname.startsWith('/auth/') || parsed.pathname.startsWith('/signin')) return '/';
	return parsed.pathname + parsed.search + parsed.hash;
}
