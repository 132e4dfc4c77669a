/**
 * Reads the session cookie on each request, refreshes it when Lucia extends it,
 * and clears it when it is no longer valid.
 */
import type { Cookies, RequestEvent } from '@sveltejs/kit';
import type { Cookie } from 'lucia';
import { lucia } from './auth';

export async function resolveSession(event: RequestEvent): Promise<void> {
	const sessionId = event.cookies.get(lucia.sessionCookieName);
	if (!sessionId) {
		event.locals.user = null;
		event.locals.session = null;
		return;
	}
	const { session, user } = await lucia.validateSession(sessionId);
	if (session && session.fresh) setCookie(event.cookies, lucia.createSessionCookie(session.id));
	if (!session) setCookie(event.cookies, lucia.createBlankSessionCookie());
	event.locals.user = user;
	event.locals.session = session;
}

export async function startSession(cookies: Cookies, userId: string): Promise<void> {
	const session = await lucia.createSession(userId, {});
	setCookie(cookies, lucia.createSessionCookie(session.id));
}

export async function endSession(event: RequestEvent): Promise<void> {
	if (event.locals.session) await lucia.invalidateSession(event.locals.session.id);
	setCookie(event.cookies, lucia.createBlankSessionCookie());
}

function setCookie(cookies: Cookies, cookie: Cookie) {
	cookies.set(cookie.name, cookie.value, { path: '.', ...cookie.attributes });
}
