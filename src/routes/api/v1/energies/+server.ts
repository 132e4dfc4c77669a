import type { RequestHandler } from './$types';
import { computeEnergies } from '$lib/server/services/energy';
import { api, readJson, reply } from '$lib/server/http';

/** Intermediate-coupling levels of a configuration from its Slater and spin–orbit parameters (no sign-in). */
export const POST: RequestHandler = api(async (event) => reply('POST /api/v1/energies', computeEnergies(await readJson(event, 64 * 1024))));
