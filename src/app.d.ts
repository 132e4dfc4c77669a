// See https://svelte.dev/docs/kit/types#app.d.ts
import type { User, Session } from 'lucia';

declare global {
	namespace App {
		interface Error {
			message: string;
		}
		interface Locals {
			user: User | null;
			session: Session | null;
		}
	}
}

export {};
