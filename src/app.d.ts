import type { Viewer } from '$lib/club/viewer';

declare global {
	namespace App {
		interface Locals {
			user: Viewer | null;
			sessionToken: string | null;
		}
		interface Error {
			message: string;
			errorId?: string;
		}
		// interface PageData {}
		// interface PageState {}
		// interface Platform {}
	}
}

export {};
