import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { SvelteKitAuth } from '@auth/sveltekit';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { promoteConfiguredAdmin } from './club/users';
import { accounts, sessions, users, verificationTokens } from './club/schema';
import { config } from './config';
import { db } from './db';
import { signInMail } from './mail/messages';
import { defaultTransport } from './mail/transport';
import { safeRedirectPath } from '../club/redirect';

export const SIGN_IN_LINK_MINUTES = 10;
export const SESSION_IDLE_DAYS = 30;

export const {
	handle: authHandle,
	signIn,
	signOut
} = SvelteKitAuth(async () => {
	const settings = config();
	return {
		secret: settings.AUTH_SECRET,
		trustHost: true,
		adapter: DrizzleAdapter(db, {
			usersTable: users,
			accountsTable: accounts,
			sessionsTable: sessions,
			verificationTokensTable: verificationTokens
		}),
		session: {
			strategy: 'database',
			// Sliding expiry: each day of use pushes the end out again, so 30 idle days end a session.
			maxAge: SESSION_IDLE_DAYS * 24 * 60 * 60,
			updateAge: 24 * 60 * 60
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
					const mail = signInMail(url, SIGN_IN_LINK_MINUTES);
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
			// Only our own paths: an absolute URL elsewhere becomes the home page.
			redirect({ url, baseUrl }) {
				if (url.startsWith(baseUrl)) return baseUrl + safeRedirectPath(url.slice(baseUrl.length));
				return baseUrl + safeRedirectPath(url);
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
