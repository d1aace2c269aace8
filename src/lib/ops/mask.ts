// Mail addresses never appear in full in the logs: the first letter of the mailbox and the domain
// are enough to tell a member's report ("my mail to m… at kettlewater didn't arrive") from others.

const ADDRESS = /([^\s<>"'(),;:@]+)@([A-Za-z0-9.-]+\.[A-Za-z]{2,}|[A-Za-z0-9-]+)/g;

/** `mara.quillfeather@kettlewater.test` → `m***@kettlewater.test`. */
export function maskAddress(address: string): string {
	const at = address.lastIndexOf('@');
	if (at <= 0) return '***';
	return `${address[0]}***${address.slice(at)}`;
}

/** Masks every address inside a longer text, e.g. an SMTP server's refusal. */
export function maskAddresses(text: string): string {
	return text.replace(ADDRESS, (_match, local: string, domain: string) => `${local[0]}***@${domain}`);
}
