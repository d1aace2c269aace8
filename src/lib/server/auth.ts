import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { SvelteKitAuth } from '@auth/sveltekit';
import type { RequestEvent } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import * as membership from './club/membership';
import { promoteConfiguredAdmin } from './club/users';
import { SESSION_MAX_AGE_MS, SESSION_UPDATE_AGE_MS } from './club/sessions';
import { accounts, sessions, users, verificationTokens } from './club/schema';
import { config } from './config';
import { db } from './db';
import { signInMail } from './mail/messages';
import { defaultTransport } from './mail/transport';
import { safeRedirectPath } from '../club/redirect';

export const SIGN_IN_LINK_MINUTES = 10;

/**
 * Auth.js builds the links it mails from the request it is handed (its `Host` and
 * `X-Forwarded-*` headers unless AUTH_URL is set). We never hand it the visitor's request: this
 * builds a fresh one on the configured ORIGIN that carries only the cookie, the browser's name
 * and the form, so no header a visitor sends can choose where a link points.
 */
export function authEvent<E extends RequestEvent>(event: E, form: Record<string, string>): E {
	const origin = new URL(config().ORIGIN);
	const url = new URL(origin);
	url.pathname = event.url.pathname;
	const headers = new Headers({ host: origin.host, 'content-type': 'application/x-www-form-urlencoded' });
	for (const name of ['cookie', 'user-agent', 'accept-language']) {
		const value = event.request.headers.get(name);
		if (value) headers.set(name, value);
	}
	const request = new Request(url, { method: 'POST', headers, body: new URLSearchParams(form) });
	return { ...event, request, url };
}

/**
 * A link Auth.js made, put on ORIGIN whatever Auth.js was given: only its path and query are
 * kept. (Assigning the path keeps the host; resolving a path such as `//elsewhere` against
 * ORIGIN would not.)
 */
export function onOrigin(link: string): string {
	const given = new URL(link, config().ORIGIN);
	const url = new URL(config().ORIGIN);
	url.pathname = given.pathname;
	url.search = given.search;
	url.hash = given.hash;
	return url.toString();
}

export const {
	handle: authHandle,
	signIn,
	signOut
} = SvelteKitAuth(async () => {
	const settings = config();
	const origin = new URL(settings.ORIGIN).origin;
	const adapter = DrizzleAdapter(db, {
		usersTable: users,
		accountsTable: accounts,
		sessionsTable: sessions,
		verificationTokensTable: verificationTokens
	});
	return {
		secret: settings.AUTH_SECRET,
		// Auth.js may read the host, but nothing it sends out depends on it: authEvent() hands it
		// requests on ORIGIN, and mailed links and redirects are put on ORIGIN below.
		trustHost: true,
		adapter: {
			...adapter,
			// A newcomer starts as the club's join policy says: a member, or waiting to be admitted.
			async createUser(user) {
				return adapter.createUser!({ ...user, state: await membership.stateForNewcomer() } as typeof user);
			},
			// A new link retires the address's earlier unused ones, so only the newest works.
			async createVerificationToken(token) {
				await db.delete(verificationTokens).where(eq(verificationTokens.identifier, token.identifier));
				return adapter.createVerificationToken!(token);
			}
		},
		session: {
			strategy: 'database',
			// Sliding expiry: each day of use pushes the end out again, so 30 idle days end a session.
			// hooks.server.ts resolves sessions itself with these same figures (club/sessions.ts).
			maxAge: SESSION_MAX_AGE_MS / 1000,
			updateAge: SESSION_UPDATE_AGE_MS / 1000
		},
		providers: [
			Nodemailer({
				server: settings.SMTP_URL,
				from: settings.MAIL_FROM,
				maxAge: SIGN_IN_LINK_MINUTES * 60,
				normalizeIdentifier: (identifier) => identifier.trim().toLowerCase(),
				// Sent straight away rather than through the outbox: the person is waiting for it.
				// The link is a credential, so it is never logged.
				async sendVerificationRequest({ identifier, url }) {
					const mail = signInMail(onOrigin(url), SIGN_IN_LINK_MINUTES);
					await defaultTransport().send({ to: identifier, ...mail });
				}
			})
		],
		pages: {
			signIn: '/signin',
			verifyRequest: '/signin/check-email',
			error: '/signin/problem'
		},
		callbacks: {
			// A suspended member's link is refused when it is used (AccessDenied), not when it is asked
			// for, so the sign-in form tells nobody which addresses are suspended.
			async signIn({ user, email }) {
				if (email?.verificationRequest) return true;
				return !user.email || membership.maySignIn(user.email);
			},
			// Only our own paths, on ORIGIN: anything else becomes the home page.
			redirect({ url }) {
				let target: URL;
				try {
					target = new URL(url, origin);
				} catch {
					return origin + '/';
				}
				if (target.origin !== origin) return origin + '/';
				return origin + safeRedirectPath(target.pathname + target.search + target.hash);
			},
			session({ session, user }) {
				session.user.id = user.id;
				return session;
			}
		},
		events: {
			async createUser({ user }) {
				if (user.email && user.email.toLowerCase() === settings.ADMIN_EMAIL?.toLowerCase()) {
					await promoteConfiguredAdmin(user.email);
				}
			}
		}
	};
});
