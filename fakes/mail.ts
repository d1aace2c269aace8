// Local stand-in for an SMTP provider: accepts every message on loopback, keeps it, and shows an
// inbox in the browser. Tests read messages through its small JSON API.
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import { appendFileSync, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface StoredMessage {
	id: number;
	receivedAt: string;
	envelopeFrom: string;
	envelopeTo: string[];
	from: string;
	to: string;
	subject: string;
	text: string;
	html: string;
	messageId: string;
	headers: Record<string, string>;
}

export interface MailFakeOptions {
	smtpPort: number;
	httpPort: number;
	host?: string;
	/** Messages are appended here as JSON lines and read back at start, so a restart keeps the inbox. */
	storeFile?: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export async function startMailFake(options: MailFakeOptions) {
	const host = options.host ?? '127.0.0.1';
	const messages: StoredMessage[] = [];
	if (options.storeFile && existsSync(options.storeFile)) {
		for (const line of readFileSync(options.storeFile, 'utf8').split('\n')) {
			if (line.trim()) messages.push(JSON.parse(line) as StoredMessage);
		}
	}
	let nextId = (messages.at(-1)?.id ?? 0) + 1;

	const smtp = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS', 'AUTH'],
		banner: 'Riparia mail fake',
		logger: false,
		size: 25 * 1024 * 1024,
		onData(stream, session, callback) {
			simpleParser(stream)
				.then((parsed) => {
					const headers: Record<string, string> = {};
					for (const [key, value] of parsed.headers) {
						headers[key] = typeof value === 'string' ? value : JSON.stringify(value);
					}
					for (const line of parsed.headerLines) headers[line.key] ??= line.line;
					const addressText = (a: typeof parsed.to) => (!a ? '' : Array.isArray(a) ? a.map((x) => x.text).join(', ') : a.text);
					const message: StoredMessage = {
						id: nextId++,
						receivedAt: new Date().toISOString(),
						envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
						envelopeTo: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
						from: addressText(parsed.from),
						to: addressText(parsed.to),
						subject: parsed.subject ?? '',
						text: parsed.text ?? '',
						html: typeof parsed.html === 'string' ? parsed.html : '',
						messageId: parsed.messageId ?? '',
						headers
					};
					messages.push(message);
					if (options.storeFile) {
						mkdirSync(dirname(options.storeFile), { recursive: true });
						appendFileSync(options.storeFile, JSON.stringify(message) + '\n');
					}
					callback();
				})
				.catch((error: Error) => callback(error));
		}
	});

	const forAddress = (url: URL) => {
		const to = url.searchParams.get('to')?.toLowerCase();
		const list = to ? messages.filter((m) => m.envelopeTo.includes(to)) : messages;
		return [...list].reverse();
	};

	const send = (res: ServerResponse, status: number, type: string, body: string) => {
		res.writeHead(status, { 'content-type': type, 'cache-control': 'no-store' });
		res.end(body);
	};

	const page = (title: string, body: string) =>
		`<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(title)}</title>
<style>body{font:15px/1.5 system-ui,sans-serif;margin:0;background:#f4f6f3;color:#1d2a24}header{background:#1f4d3d;color:#fff;padding:.8rem 1.2rem}main{max-width:60rem;margin:0 auto;padding:1rem}
table{width:100%;border-collapse:collapse;background:#fff}td,th{padding:.45rem .6rem;border-bottom:1px solid #dde3dc;text-align:left;vertical-align:top}a{color:#1f4d3d}iframe{width:100%;height:32rem;border:1px solid #ccd;background:#fff}pre{white-space:pre-wrap;background:#fff;padding:1rem;border:1px solid #dde3dc}</style></head>
<body><header><strong>Riparia mail fake</strong> — every message the app sent locally</header><main>${body}</main></body></html>`;

	const http = createServer((req: IncomingMessage, res: ServerResponse) => {
		const url = new URL(req.url ?? '/', `http://${host}`);
		if (req.method === 'DELETE' && url.pathname === '/api/messages') {
			messages.length = 0;
			return send(res, 204, 'text/plain', '');
		}
		if (url.pathname === '/api/messages') {
			return send(res, 200, 'application/json', JSON.stringify(forAddress(url)));
		}
		if (url.pathname === '/api/messages/latest') {
			const latest = forAddress(url)[0];
			return latest
				? send(res, 200, 'application/json', JSON.stringify(latest))
				: send(res, 404, 'application/json', JSON.stringify({ message: 'no message for that address' }));
		}
		const match = /^\/messages\/(\d+)$/.exec(url.pathname);
		if (match) {
			const message = messages.find((m) => m.id === Number(match[1]));
			if (!message) return send(res, 404, 'text/html', page('Not found', '<p>No such message.</p>'));
			const headerRows = Object.entries(message.headers)
				.filter(([k]) => ['from', 'to', 'subject', 'date', 'list-unsubscribe', 'message-id'].includes(k))
				.map(([k, v]) => `<tr><th>${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`)
				.join('');
			return send(
				res,
				200,
				'text/html',
				page(
					message.subject,
					`<p><a href="/">← Inbox</a></p><h1>${escapeHtml(message.subject)}</h1><table>${headerRows}</table>
<h2>HTML part</h2><iframe sandbox="" srcdoc="${escapeHtml(message.html)}"></iframe><h2>Text part</h2><pre>${escapeHtml(message.text)}</pre>`
				)
			);
		}
		if (url.pathname === '/') {
			const list = forAddress(url);
			const rows = list
				.map(
					(m) =>
						`<tr><td>${escapeHtml(m.receivedAt.replace('T', ' ').slice(0, 19))}</td><td>${escapeHtml(m.envelopeTo.join(', '))}</td><td><a href="/messages/${m.id}">${escapeHtml(m.subject || '(no subject)')}</a></td></tr>`
				)
				.join('');
			return send(
				res,
				200,
				'text/html',
				page(
					'Inbox',
					`<form><label>Filter by recipient <input name="to" value="${escapeHtml(url.searchParams.get('to') ?? '')}"></label> <button>Filter</button></form>
<p>${list.length} message(s)</p><table><thead><tr><th>Received (UTC)</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows || '<tr><td colspan="3">Nothing yet. Request a sign-in link in the app and it appears here.</td></tr>'}</tbody></table>`
				)
			);
		}
		send(res, 404, 'text/plain', 'not found');
	});

	await new Promise<void>((resolve, reject) => {
		smtp.once('error', reject);
		smtp.listen(options.smtpPort, host, () => resolve());
	});
	await new Promise<void>((resolve, reject) => {
		http.once('error', reject);
		http.listen(options.httpPort, host, () => resolve());
	});

	return {
		messages,
		smtpPort: options.smtpPort,
		httpPort: options.httpPort,
		async close() {
			await new Promise<void>((resolve) => smtp.close(() => resolve()));
			await new Promise<void>((resolve) => http.close(() => resolve()));
		}
	};
}

// Run directly: `tsx fakes/mail.ts` with MAIL_FAKE_SMTP_PORT, MAIL_FAKE_HTTP_PORT, MAIL_FAKE_STORE.
if (import.meta.url === `file://${process.argv[1]}`) {
	const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525);
	const httpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 8025);
	const fake = await startMailFake({ smtpPort, httpPort, storeFile: process.env.MAIL_FAKE_STORE });
	console.log(`mail fake: SMTP on 127.0.0.1:${smtpPort}, inbox on http://127.0.0.1:${httpPort}/`);
	const stop = () => void fake.close().then(() => process.exit(0));
	process.on('SIGTERM', stop);
	process.on('SIGINT', stop);
}
