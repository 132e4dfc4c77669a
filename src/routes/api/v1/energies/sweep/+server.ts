import type { RequestHandler } from './$types';
import { computeSweep } from '$lib/server/services/energy';
import { api, readJson, reply } from '$lib/server/http';

/** The levels along the LS → jj path H(t) = E_av + (1 − t)·Coulomb + t·spin–orbit (no sign-in). */
export const POST: RequestHandler = api(async (event) =>
	reply('POST /api/v1/energies/sweep', computeSweep(await readJson(event, 64 * 1024)))
);
