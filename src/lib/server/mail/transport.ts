import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config';

export interface OutgoingMail {
	to: string;
	subject: string;
	text: string;
	html: string;
	headers?: Record<string, string>;
	messageId?: string;
}

export interface MailTransport {
	send(mail: OutgoingMail): Promise<void>;
	close(): void;
}

/** The one place application mail leaves the server: SMTP through nodemailer. */
export function smtpTransport(url = config().SMTP_URL, from = config().MAIL_FROM): MailTransport {
	const transporter: Transporter = nodemailer.createTransport({
		url,
		// A few kept-open connections: an announcement to the whole club is hundreds of messages.
		pool: true,
		maxConnections: 4,
		// Fail an attempt quickly; the outbox retries with backoff.
		connectionTimeout: 10_000,
		greetingTimeout: 10_000,
		socketTimeout: 20_000
	});
	return {
		async send(mail) {
			await transporter.sendMail({
				from,
				to: mail.to,
				subject: mail.subject,
				text: mail.text,
				html: mail.html,
				headers: mail.headers,
				messageId: mail.messageId
			});
		},
		close: () => transporter.close()
	};
}

let shared: MailTransport | undefined;
export function defaultTransport(): MailTransport {
	shared ??= smtpTransport();
	return shared;
}
