/**
 * Every /api/v1 route, in one list (./routes.json): the `/api/v1` index is generated from it, `reply` in
 * $lib/server/http type-checks each handler's body against ./types by its key, and
 * routes.test.ts fails when a `+server.ts` exports a method that is not listed here (or the
 * other way round), so the index cannot drift from the code.
 */
import type { RouteKey } from './types';
import listed from './routes.json';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Who may call a route: `public` needs no sign-in; the project roles are the least role needed. */
export type RouteAccess = 'public' | 'signed-in' | 'viewer' | 'editor' | 'owner';

export interface ApiRoute {
	method: HttpMethod;
	path: string;
	summary: string;
	access: RouteAccess;
}

type Listed = { [K in RouteKey]: { summary: string; access: RouteAccess } };

const ACCESS: readonly RouteAccess[] = ['public', 'signed-in', 'viewer', 'editor', 'owner'];

// The list itself is data (routes.json: "METHOD /path": { summary, access }, in index order). Its keys
// must be exactly the contract's route keys in ./types — the compiler checks both ways here.
type JsonKey = keyof typeof listed;
const SAME_KEYS: [Exclude<RouteKey, JsonKey>, Exclude<JsonKey, RouteKey>] extends [never, never] ? true : false = true;

/** JSON widens each access to a string: check it once, at load, against the allowed words. */
function checkedList(): Listed {
	for (const [key, route] of Object.entries(listed))
		if (!(ACCESS as readonly string[]).includes(route.access))
			throw new Error(`routes.json: "${key}" has access "${route.access}"; allowed: ${ACCESS.join(', ')}`);
	return listed as Listed;
}

const LISTED: Listed = SAME_KEYS && checkedList();

/** The routes in the order listed, as plain data. */
export const API_ROUTES: readonly ApiRoute[] = Object.entries(LISTED).map(([key, info]) => {
	const [method, path] = key.split(' ') as [HttpMethod, string];
	return { method, path, ...info };
});

/** "GET /api/v1/projects/:projectId" for a route. */
export const routeKey = (r: Pick<ApiRoute, 'method' | 'path'>) => `${r.method} ${r.path}`;
