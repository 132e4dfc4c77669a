import type { RequestHandler } from './$types';
import { api, queryParam } from '$lib/server/http';
import { ServiceError } from '$lib/server/errors';
import { computeResponse } from '$lib/server/compute/pool';

/**
 * Term sheet of a configuration: `?config=3d5 4s` (at most 200 characters), optional `&gs=free`.
 * Large configurations are computed in the worker pool; over the engine's budget is a 400.
 */
export const GET: RequestHandler = api((event) => {
	const config = queryParam(event, 'config');
	const gs = event.url.searchParams.get('gs') ?? 'exact';
	if (gs !== 'exact' && gs !== 'free') throw new ServiceError(400, 'gs must be "exact" (g_s = 2) or "free" (g_s = 2.00231930436)');
	return computeResponse('terms', { config, gs });
});
