/**
 * Typed calls to /api/v1 from the pages. The route key names the response type (./types), so no
 * page declares or casts an API body. Failures throw `ApiError` with the server's message.
 */
import type { ApiErrorBody, ApiRequests, ApiResponses, ApiWrites, RouteKey } from './types';

/** A refused or failed request: the server's message, and the token or field at fault when it names one. */
export class ApiError extends Error {
	readonly status: number;
	readonly token: string;
	readonly field: string;
	constructor(status: number, message: string, token = '', field = '') {
		super(message);
		this.name = 'ApiError';
		this.status = status;
		this.token = token;
		this.field = field;
	}
}

export type GetKey = Extract<RouteKey, `GET ${string}`>;
export type PostKey = keyof ApiRequests;
export type Params = Record<string, string | number | bigint | boolean | null | undefined>;

/**
 * The URL of a route: `:name` segments are filled from `params`, the other params become the query
 * (null and undefined are left out).
 * @example apiUrl('GET /api/v1/terms', { config: '2p2' }) // '/api/v1/terms?config=2p2'
 */
export function apiUrl(route: RouteKey, params: Params = {}): string {
	const rest: Record<string, string> = {};
	for (const [k, v] of Object.entries(params)) if (v !== null && v !== undefined) rest[k] = String(v);
	const path = route.slice(route.indexOf(' ') + 1).replace(/:([A-Za-z]+)/g, (_, name: string) => {
		const v = rest[name];
		if (v === undefined) throw new Error(`apiUrl: ${route} needs ${name}`);
		delete rest[name];
		return encodeURIComponent(v);
	});
	const query = new URLSearchParams(rest).toString();
	return query ? `${path}?${query}` : path;
}

/** Reads a response as the route's body, or throws ApiError with the server's words. */
export async function readApi<K extends RouteKey>(_route: K, res: Response): Promise<ApiResponses[K]> {
	const body: unknown = await res.json().catch(() => null);
	if (!res.ok) {
		const err = (body as ApiErrorBody | null)?.error;
		throw new ApiError(res.status, err?.message ?? `The server answered ${res.status}`, err?.token ?? '', err?.field ?? '');
	}
	return body as ApiResponses[K];
}

/** Sends one request. Network failures become ApiError status 0; an abort rethrows the AbortError. */
async function send<K extends RouteKey>(route: K, url: string, init: RequestInit): Promise<ApiResponses[K]> {
	let res: Response;
	try {
		res = await fetch(url, init);
	} catch (e) {
		if ((e as Error).name === 'AbortError') throw e;
		throw new ApiError(0, 'Could not reach the server; check the connection and try again');
	}
	return readApi(route, res);
}

/** GET a route. */
export function apiGet<K extends GetKey>(route: K, params: Params = {}, signal?: AbortSignal): Promise<ApiResponses[K]> {
	return send(route, apiUrl(route, params), { signal });
}

/** POST a JSON body to a compute route; the body is typed by `ApiRequests`. */
export function apiPost<K extends PostKey>(route: K, body: ApiRequests[K], signal?: AbortSignal): Promise<ApiResponses[K]> {
	return send(route, apiUrl(route), {
		method: 'POST',
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify(body),
		signal
	});
}

/** Sends a project write (POST, PATCH, PUT) with its JSON body; `params` fill the path (`:projectId`, `:entryId`). */
export function apiWrite<K extends keyof ApiWrites>(
	route: K,
	params: Params,
	body: ApiWrites[K],
	signal?: AbortSignal
): Promise<ApiResponses[K]> {
	return send(route, apiUrl(route, params), {
		method: route.slice(0, route.indexOf(' ')),
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify(body),
		signal
	});
}
