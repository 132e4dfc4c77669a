import type { RequestHandler } from './$types';
import { fitRequestSchema } from '$lib/server/energy-validation';
import { computeResponse } from '$lib/server/compute/pool';
import { api, readJson } from '$lib/server/http';

/** Least-squares fit of radial parameters to observed levels (no sign-in; nothing is saved; pooled when large, cancellable). */
export const POST: RequestHandler = api(async (event) => {
	const body = fitRequestSchema.parse(await readJson(event, 256 * 1024));
	return computeResponse('fit', body, event.request.signal);
});
