import { mailApiUrl } from './env';

export interface FakeMail {
	id: number;
	envelopeTo: string[];
	subject: string;
	text: string;
	html: string;
	headers: Record<string, string>;
}

/** Every message the mail fake holds for an address, newest first. */
export async function mailsTo(address: string, baseUrl = mailApiUrl()): Promise<FakeMail[]> {
	const response = await fetch(`${baseUrl}/api/messages?to=${encodeURIComponent(address)}`);
	return (await response.json()) as FakeMail[];
}

/** Waits for a message to an address (optionally matching a subject), as the outbox delivers within seconds. */
export async function waitForMail(address: string, options: { subject?: RegExp; timeoutMs?: number; baseUrl?: string } = {}): Promise<FakeMail> {
	const deadline = Date.now() + (options.timeoutMs ?? 15_000);
	while (Date.now() < deadline) {
		const found = (await mailsTo(address, options.baseUrl)).find((m) => !options.subject || options.subject.test(m.subject));
		if (found) return found;
		await new Promise((r) => setTimeout(r, 250));
	}
	throw new Error(`No mail to ${address}${options.subject ? ` matching ${options.subject}` : ''} arrived in time.`);
}

export const linksIn = (mail: FakeMail) => [...mail.text.matchAll(/https?:\/\/\S+/g)].map((m) => m[0]);
