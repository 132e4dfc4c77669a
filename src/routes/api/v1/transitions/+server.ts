import type { RequestHandler } from './$types';
import { transitionFinder } from '$lib/physics/finder';
import { api, queryParam, reply } from '$lib/server/http';
import { parseTypesParam } from '$lib/server/lines-validation';

/**
 * Transition finder: `?lower=2p2&upper=2p 3s&types=E1,M1,E2` (types default E1). Same notation twice gives
 * the forbidden lines within one configuration. Multiplets with their J lines and LS strengths; no energies.
 */
export const GET: RequestHandler = api((event) => {
	const lower = queryParam(event, 'lower');
	const upper = queryParam(event, 'upper');
	const types = parseTypesParam(event.url.searchParams.get('types'));
	return reply('GET /api/v1/transitions', transitionFinder(lower, upper, types));
});
