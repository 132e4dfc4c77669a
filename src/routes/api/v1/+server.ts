import type { RequestHandler } from './$types';
import { API_ROUTES } from '$lib/api/routes';
import { api, reply } from '$lib/server/http';

/** The index, generated from the one route list (src/lib/api/routes.json, read by routes.ts), so scripts can discover the API. */
export const GET: RequestHandler = api(() =>
	reply('GET /api/v1', {
		name: 'Termwright API',
		version: 1,
		routes: API_ROUTES.map((r) => ({ method: r.method, path: r.path, summary: r.summary, access: r.access }))
	})
);
