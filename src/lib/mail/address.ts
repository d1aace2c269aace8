/**
 * An e-mail address in pieces that may end a line: after the "@" and before each dot of the domain
 * (as style guides break addresses), so a narrow column never splits a word of it.
 */
export function addressParts(address: string): string[] {
	const at = address.lastIndexOf('@');
	if (at <= 0) return [address];
	const domain = address.slice(at + 1).split('.');
	return [address.slice(0, at + 1), ...domain.map((part, i) => (i === 0 ? part : `.${part}`))];
}
