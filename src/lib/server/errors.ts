/**
 * One error type for the service layer. Pages turn it into SvelteKit errors or form
 * failures; the JSON API turns it into `{ "error": { "message", ... } }`.
 */
export class ServiceError extends Error {
	constructor(
		readonly status: 400 | 401 | 403 | 404 | 409 | 413 | 422 | 429,
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
