import type { Account } from '$lib/club/membership';
import type { Viewer } from '$lib/club/viewer';

declare global {
	namespace App {
		interface Locals {
			/** The signed-in member (active); null for visitors, applicants and the suspended. */
			user: Viewer | null;
			/** Whoever is signed in and not suspended, applicants included: for their own membership pages. */
			account: Account | null;
			sessionToken: string | null;
			/** This request's id: echoed as X-Request-Id, on its log line, and shown on an error page. */
			requestId: string;
		}
		interface Error {
			message: string;
			errorId?: string;
			/** Where to sign in, offered to a signed-out visitor instead of a bare "not found". */
			signIn?: string;
		}
		// interface PageData {}
		// interface PageState {}
		// interface Platform {}
	}
}

export {};
