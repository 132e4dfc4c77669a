/**
 * One error type for the service layer. Pages turn it into SvelteKit errors or form
 * failures; the JSON API turns it into `{ "error": { "message", ... } }`.
 */
export class ServiceError extends Error {
	constructor(
		readonly status: 400 | 401 | 403 | 404 | 409 | 413 | 422 | 429 | 502,
		message: string,
		readonly details: Record<string, unknown> = {}
	) {
		super(message);
		this.name = 'ServiceError';
	}
}

export const notFound = (what = 'Not found') => new ServiceError(404, what);
export const badRequest = (message: string, details: Record<string, unknown> = {}) => new ServiceError(400, message, details);
export const conflict = (message: string, details: Record<string, unknown> = {}) => new ServiceError(409, message, details);
/** 502: the mail server (or another service the app relies on) did not take what was handed to it. */
// The transport's reason goes to the server log only: it names hosts and ports nobody outside needs.
export const mailNotSent = (what: string) =>
	new ServiceError(
		502,
		`${what} could not be sent: the mail server did not take it. Try again later, or tell the site admin (the server log says why).`
	);
