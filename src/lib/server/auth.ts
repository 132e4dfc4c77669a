/**
 * Sessions (Lucia v3 on our Drizzle tables) and password hashing (argon2id).
 */
import { Lucia } from 'lucia';
import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle';
import { dev } from '$app/environment';
import { db } from './db';
import { sessions, users, type SiteRole } from './db/schema';

const adapter = new DrizzleSQLiteAdapter(db, sessions, users);

export const lucia = new Lucia(adapter, {
	sessionCookie: {
		name: 'tw_session',
		attributes: { secure: !dev && process.env.COOKIE_SECURE !== 'false', sameSite: 'lax' }
	},
	getUserAttributes: (row) => ({ email: row.email, name: row.name, siteRole: row.siteRole })
});

declare module 'lucia' {
	interface Register {
		Lucia: typeof lucia;
		DatabaseUserAttributes: { email: string; name: string; siteRole: SiteRole };
	}
}
