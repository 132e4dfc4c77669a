import type { RequestHandler } from './$types';
import { api, queryParam } from '$lib/server/http';
import { computeResponse } from '$lib/server/compute/pool';

/**
 * LS ↔ jK ↔ jj correlation by J (non-crossing rule), every side in schematic order: `?config=2p5 3p`,
 * optional `&zeta=2p:1,3p:0.022` (ζ per open subshell for the jj order; defaults in the answer).
 * Large configurations are computed in the worker pool (src/lib/server/compute).
 */
export const GET: RequestHandler = api((event) =>
	computeResponse('bridge', { config: queryParam(event, 'config'), zeta: (event.url.searchParams.get('zeta') ?? '').slice(0, 200) })
);
