/**
 * Glue between the service layer and SvelteKit: pages, form actions and JSON handlers.
 */
import { error, fail, json, redirect, type RequestEvent } from '@sveltejs/kit';
import { ZodError } from 'zod';
import type { Actor } from './access';
import { ServiceError } from './errors';
import { actorForToken } from './services/tokens';
import { InputError } from '../physics/input-error';
import type { ApiResponses, RouteKey, Sendable } from '../api/types';

/** The signed-in user, or a redirect to the sign-in page that comes back here. */
export function requireUser(event: RequestEvent): Actor {
	const user = event.locals.user;
	if (!user) {
		const next = event.url.pathname + event.url.search;
		redirect(303, `/signin?next=${encodeURIComponent(next)}`);
	}
	return user;
}

/** Runs a service call in a load function; service errors become SvelteKit errors. */
export function forPage<T>(call: () => T): T {
	try {
		return call();
	} catch (e) {
		if (e instanceof ServiceError) error(e.status, e.message);
		throw e;
	}
}

/** What a failed form action returns to its page: the message, the field at fault, what was typed. */
export type ActionFailureData = { message: string; field?: string; token?: string; [key: string]: unknown };

/**
 * Runs a service call in a form action; a service error becomes `fail(status, { message, field, ...echo })`,
 * where `echo` is what the user typed, so the form can show it again.
 */
export async function forAction<T, E extends Record<string, unknown> = Record<never, never>>(
	call: () => T | Promise<T>,
	echo: E = {} as E
) {
	try {
		return { ok: true as const, value: await call() };
	} catch (e) {
		if (e instanceof ServiceError) {
			const data: ActionFailureData & E = { message: e.message, ...e.details, ...echo };
			return { ok: false as const, failure: fail(e.status, data) };
		}
		throw e;
	}
}

/** One JSON error shape for the whole API: `{ "error": { "message", ...details } }`. */
export function jsonError(status: number, message: string, details: Record<string, unknown> = {}) {
	return json({ error: { message, ...details } }, { status });
}

/**
 * A JSON answer whose body is checked, at compile time, against the route's type in
 * src/lib/api/types.ts: `reply('GET /api/v1/terms', sheet)`.
 */
export function reply<K extends RouteKey>(_route: K, body: Sendable<ApiResponses[K]>, init?: ResponseInit): Response {
	return json(body, init);
}

/** Wraps a JSON handler so every failure answers in the API's error shape. */
export function api<E extends RequestEvent>(handler: (event: E) => Response | Promise<Response>) {
	return async (event: E): Promise<Response> => {
		try {
			return await handler(event);
		} catch (e) {
			if (e instanceof ServiceError) return jsonError(e.status, e.message, e.details);
			if (e instanceof ZodError) return jsonError(400, e.issues[0]?.message ?? 'Bad input');
			// The engine reports bad input with these; each message says what is allowed.
			if (e instanceof InputError) return jsonError(400, e.message, { token: e.token });
			if (e instanceof RangeError) return jsonError(400, e.message);
			// SvelteKit's own request errors (a body over BODY_SIZE_LIMIT is a 413) carry a safe status and message.
			if (isKitRequestError(e)) return jsonError(e.status, e.message);
			// Anything else is unexpected: handleError logs it with an id and the handle hook answers in the shape.
			throw e;
		}
	};
}

/** SvelteKit's internal `SvelteKitError` (not exported): an Error with a 4xx status, e.g. 413 Payload Too Large. */
function isKitRequestError(e: unknown): e is Error & { status: number } {
	if (!(e instanceof Error) || e.name === 'ServiceError') return false;
	const status: unknown = (e as unknown as { status?: unknown }).status;
	return typeof status === 'number' && status >= 400 && status < 500;
}

/** The API's actor: a personal API token (`Authorization: Bearer tw_…`) or the cookie session. */
export function apiActor(event: RequestEvent): Actor {
	const auth = event.request.headers.get('authorization');
	if (auth) {
		const m = /^Bearer\s+(\S+)$/i.exec(auth);
		const actor = m ? actorForToken(m[1]) : null;
		if (!actor) throw new ServiceError(401, 'The API token is not valid; create one on your account page');
		return actor;
	}
	if (!event.locals.user) throw new ServiceError(401, 'Sign in first (cookie session) or send a personal API token');
	return event.locals.user;
}

/** Reads a JSON body, refusing non-JSON and bodies over `maxBytes`. */
export async function readJson(event: RequestEvent, maxBytes = 256 * 1024): Promise<unknown> {
	const text = await event.request.text();
	if (text.length > maxBytes) throw new ServiceError(413, `Request body is over ${maxBytes} bytes`);
	let body: unknown;
	try {
		body = JSON.parse(text);
	} catch {
		throw new ServiceError(400, 'Request body must be JSON');
	}
	if (body === null || typeof body !== 'object' || Array.isArray(body)) throw new ServiceError(400, 'Request body must be a JSON object');
	return body;
}

/** A required query parameter, with a message naming it when missing or too long. */
export function queryParam(event: RequestEvent, name: string, maxLength = 200): string {
	const value = event.url.searchParams.get(name);
	if (value === null || value.trim() === '') throw new ServiceError(400, `Query parameter "${name}" is required`);
	if (value.length > maxLength) throw new ServiceError(400, `Query parameter "${name}" is over ${maxLength} characters`);
	return value;
}

/** A file answer (exports): `?download` adds the attachment header with the file's name. */
export function fileResponse(event: RequestEvent, file: { body: string; type: string; filename: string }): Response {
	const download = event.url.searchParams.get('download') !== null;
	return new Response(file.body, {
		headers: {
			'content-type': file.type,
			...(download ? { 'content-disposition': `attachment; filename="${file.filename}"` } : {})
		}
	});
}
