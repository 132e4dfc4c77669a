import type { RequestHandler } from './$types';
import { termSheet } from '$lib/physics/report';
import { api, queryParam, reply } from '$lib/server/http';
import { ServiceError } from '$lib/server/errors';

/** Term sheet of a configuration: `?config=3d5 4s` (at most 200 characters), optional `&gs=free`. */
export const GET: RequestHandler = api((event) => {
	const config = queryParam(event, 'config');
	const gs = event.url.searchParams.get('gs') ?? 'exact';
	if (gs !== 'exact' && gs !== 'free') throw new ServiceError(400, 'gs must be "exact" (g_s = 2) or "free" (g_s = 2.00231930436)');
	return reply('GET /api/v1/terms', termSheet(config, { gs }));
});
