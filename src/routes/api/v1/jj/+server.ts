import type { RequestHandler } from './$types';
import { api, queryParam } from '$lib/server/http';
import { computeResponse } from '$lib/server/compute/pool';

/**
 * jj-coupled levels of a configuration, one entry per level: `?config=2p5 3p`.
 * `&counts=only` gives just the number of levels of each J (any size; listing stops at MAX_JJ_LEVELS).
 * Large configurations are computed in the worker pool (src/lib/server/compute).
 */
export const GET: RequestHandler = api((event) =>
	computeResponse('jj', { config: queryParam(event, 'config'), countsOnly: event.url.searchParams.get('counts') === 'only' })
);
