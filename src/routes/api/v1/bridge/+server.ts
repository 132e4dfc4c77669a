import type { RequestHandler } from './$types';
import { api, queryParam } from '$lib/server/http';
import { computeResponse } from '$lib/server/compute/pool';

/**
 * LS ↔ jj correlation by J (non-crossing rule), both sides in schematic order: `?config=2p 3p`.
 * Large configurations are computed in the worker pool (src/lib/server/compute).
 */
export const GET: RequestHandler = api((event) => computeResponse('bridge', { config: queryParam(event, 'config') }));
