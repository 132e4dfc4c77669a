import type { RequestHandler } from './$types';
import { energiesRequestSchema } from '$lib/server/energy-validation';
import { computeResponse } from '$lib/server/compute/pool';
import { api, readJson } from '$lib/server/http';

/**
 * Intermediate-coupling levels of a configuration from its Slater and spin–orbit parameters (no sign-in).
 * Large configurations run in the compute pool; a closed connection (the page's Cancel) stops the task.
 */
export const POST: RequestHandler = api(async (event) => {
	const body = energiesRequestSchema.parse(await readJson(event, 64 * 1024));
	return computeResponse('energies', body, event.request.signal);
});
