import type { RequestHandler } from './$types';
import { computeFit } from '$lib/server/services/energy';
import { api, readJson, reply } from '$lib/server/http';

/** Least-squares fit of radial parameters to observed levels (no sign-in; nothing is saved). */
export const POST: RequestHandler = api(async (event) => reply('POST /api/v1/fit', computeFit(await readJson(event, 256 * 1024))));
