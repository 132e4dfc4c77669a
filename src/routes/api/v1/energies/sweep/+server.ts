import type { RequestHandler } from './$types';
import { sweepRequestSchema } from '$lib/server/energy-validation';
import { computeResponse } from '$lib/server/compute/pool';
import { api, readJson } from '$lib/server/http';

/** The levels along the LS → jj path H(t) = E_av + (1 − t)·Coulomb + t·spin–orbit (no sign-in; pooled when large, cancellable). */
export const POST: RequestHandler = api(async (event) => {
	const body = sweepRequestSchema.parse(await readJson(event, 64 * 1024));
	return computeResponse('sweep', body, event.request.signal);
});
