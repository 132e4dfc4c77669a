import type { RequestHandler } from './$types';
import { MAX_J_SYMBOL, MAX_J_9J } from '$lib/physics/wigner';
import { api, queryParam } from '$lib/server/http';
import { computeResponse } from '$lib/server/compute/pool';
import { ServiceError } from '$lib/server/errors';

const KINDS = ['3j', '6j', '9j', 'cg'] as const;

/**
 * One Wigner symbol or Clebsch–Gordan coefficient, exact and as a float:
 * `?symbol=3j&args=1,1,0,1,-1,0` (cg: j1,m1,j2,m2,J,M). j ≤ MAX_J_SYMBOL (9j: ≤ MAX_J_9J).
 */
export const GET: RequestHandler = api((event) => {
	const symbol = queryParam(event, 'symbol', 4);
	if (!(KINDS as readonly string[]).includes(symbol))
		throw new ServiceError(400, `symbol must be one of ${KINDS.join(', ')} (j ≤ ${MAX_J_SYMBOL}; 9j: j ≤ ${MAX_J_9J})`);
	const args = queryParam(event, 'args', 200)
		.split(',')
		.map((s) => s.trim());
	return computeResponse('wigner', { symbol: symbol as (typeof KINDS)[number], args });
});
