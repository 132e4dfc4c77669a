/**
 * One error shape for every /api/v1 answer: `{ "error": { "message", ...details } }`, and no
 * stack or internals in any answer. Three layers:
 * - `api()` (http.ts) turns known errors into the shape inside each handler;
 * - `handleServerError` (the `handleError` hook) logs an unexpected error with an id and gives
 *   SvelteKit a safe `{ message, id }`;
 * - `withApiErrorShape` (the `handle` hook) rewrites any /api/v1 answer of status ≥ 400 that is
 *   not already in the shape: SvelteKit's own 404/405, bodies over BODY_SIZE_LIMIT (413), and
 *   the `{ message, id }` of an unexpected error (500).
 */
import { randomUUID } from 'node:crypto';
import { json } from '@sveltejs/kit';

export const API_PREFIX = '/api/v1';

/** What each status means, for answers that come without a usable message. */
const STATUS_MESSAGES: Record<number, string> = {
	400: 'Bad request',
	404: 'No such API route; GET /api/v1 lists them',
	405: 'This method is not allowed here',
	413: 'Request body is too large',
	431: 'Request line or headers are too large',
	500: 'Internal error'
};

const KIT_GENERIC = new Set(['Not Found', 'Method Not Allowed', 'Internal Error', 'Payload Too Large']);

export const statusMessage = (status: number) => STATUS_MESSAGES[status] ?? (status >= 500 ? 'Internal error' : 'Request failed');

/** True when `body` is already `{ error: { message: string } }`. */
function isErrorShape(body: unknown): boolean {
	if (!body || typeof body !== 'object') return false;
	const error = (body as { error?: unknown }).error;
	return !!error && typeof error === 'object' && typeof (error as { message?: unknown }).message === 'string';
}

/**
 * Rewrites an /api/v1 failure into the one shape. Keeps the status and the headers that matter
 * (Allow on 405, Retry-After on 429); a `{ message, id }` body (SvelteKit's, from `handleError`)
 * becomes `{ error: { message, id } }`; anything else (HTML, text) gets the status's message.
 * Answers below 400, and failures already in the shape, pass unchanged.
 */
export async function toApiErrorShape(response: Response): Promise<Response> {
	if (response.status < 400) return response;
	const type = response.headers.get('content-type') ?? '';
	let body: unknown = null;
	if (type.includes('application/json')) {
		try {
			body = await response.clone().json();
		} catch {
			body = null;
		}
		if (isErrorShape(body)) return response;
	}
	const error: Record<string, unknown> = { message: statusMessage(response.status) };
	const { message, id } = (body && typeof body === 'object' ? body : {}) as { message?: unknown; id?: unknown };
	// SvelteKit's bare "Not Found" / "Method Not Allowed" get our clearer words; a 500 never
	// passes its message on (handleError already made it safe, but the shape stays generic).
	if (typeof message === 'string' && response.status < 500 && !KIT_GENERIC.has(message)) error.message = message;
	if (typeof id === 'string') {
		error.id = id;
		if (response.status >= 500) error.message = `${statusMessage(response.status)}; quote ${id} when you report it`;
	}
	const headers = new Headers();
	for (const name of ['allow', 'retry-after', 'set-cookie']) {
		const value = response.headers.get(name);
		if (value) headers.set(name, value);
	}
	return json({ error }, { status: response.status, headers });
}

/** The `handle` step: API answers of status ≥ 400 leave in the one shape. */
export async function withApiErrorShape(pathname: string, response: Response): Promise<Response> {
	if (pathname !== API_PREFIX && !pathname.startsWith(API_PREFIX + '/')) return response;
	return toApiErrorShape(response);
}

/** A short id that ties an answer to the server log line. */
export const newErrorId = () => randomUUID().slice(0, 8);

/**
 * The `handleError` hook: logs an unexpected error with an id (the stack stays in the log) and
 * returns a safe message. Known statuses (404 for an unknown path, 413 for a body over the
 * limit, 405) keep SvelteKit's short message, which names no internals.
 */
export function handleServerError(
	input: { error: unknown; status: number; message: string },
	log: (...args: unknown[]) => void = console.error
): App.Error {
	const id = newErrorId();
	if (input.status >= 500) {
		log(`[error ${id}]`, input.error);
		return { message: `Internal error; quote ${id} when you report it`, id };
	}
	const detail = input.error instanceof Error && input.status === 413 ? input.error.message : input.message;
	return { message: detail, id };
}
