// Every request carries an id: it is echoed as X-Request-Id, written on the request's log line and
// shown on an error page, so a member's report leads straight to the log.

/** Letters, digits, dot, dash and underscore, 8–64 long: what proxies generate (hex, UUIDs, base64url). */
const SAFE_REQUEST_ID = /^[A-Za-z0-9][A-Za-z0-9._-]{7,63}$/;

/** The incoming id when it is a short, safe token (a proxy's own id); otherwise null. */
export function acceptRequestId(header: string | null | undefined): string | null {
	if (!header) return null;
	const value = header.trim();
	return SAFE_REQUEST_ID.test(value) ? value : null;
}

/** A new id: 16 lowercase hex digits (64 random bits), short enough to read out. */
export function newRequestId(): string {
	const bytes = crypto.getRandomValues(new Uint8Array(8));
	return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/** "2xx", "4xx" … for metric labels. */
export function statusClass(status: number): string {
	return `${Math.floor(status / 100)}xx`;
}
