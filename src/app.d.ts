// See https://svelte.dev/docs/kit/types#app.d.ts
import type { User, Session } from 'lucia';

declare global {
	namespace App {
		interface Error {
			message: string;
			/** Ties an unexpected error's answer to its line in the server log. */
			id?: string;
		}
		interface Locals {
			user: User | null;
			session: Session | null;
		}
	}
}

export {};
