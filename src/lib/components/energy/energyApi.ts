/**
 * The Energy solver's calls to the API, in one small file so the client data layer can take them
 * over later. POST bodies as in src/lib/server/energy-validation.ts; failures throw ApiError.
 */
import { ApiError, apiUrl, readApi } from '$lib/api/client';
import type { ApiResponses, GsChoice } from '$lib/api/types';

export interface EnergyParametersBody {
	Eav?: number;
	F?: { k: number; a: string; b: string; value: number }[];
	G?: { k: number; a: string; b: string; value: number }[];
	zeta?: { shell: string; value: number }[];
}

type PostKey = 'POST /api/v1/energies' | 'POST /api/v1/energies/sweep' | 'POST /api/v1/fit';

/** POST a JSON body to one of the Energy solver routes. An abort rethrows the AbortError; a network failure becomes ApiError status 0. */
async function post<K extends PostKey>(route: K, body: unknown, signal?: AbortSignal): Promise<ApiResponses[K]> {
	let res: Response;
	try {
		res = await fetch(apiUrl(route), {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify(body),
			signal
		});
	} catch (e) {
		if ((e as Error).name === 'AbortError') throw e;
		throw new ApiError(0, 'Could not reach the server; check the connection and try again');
	}
	return readApi(route, res);
}

/** POST /api/v1/energies. */
export const postEnergies = (body: { config: string; parameters: EnergyParametersBody; gs: GsChoice }, signal?: AbortSignal) =>
	post('POST /api/v1/energies', body, signal);

/** POST /api/v1/energies/sweep. */
export const postSweep = (body: { config: string; parameters: EnergyParametersBody; points?: number }, signal?: AbortSignal) =>
	post('POST /api/v1/energies/sweep', body, signal);

/** POST /api/v1/fit. */
export const postFit = (
	body: {
		config: string;
		parameters: EnergyParametersBody;
		vary: string[];
		observed: { J: string; energy: number; uncertainty?: number; assign?: string | number }[];
	},
	signal?: AbortSignal
) => post('POST /api/v1/fit', body, signal);

/** Turns { "F2(3d,3d)": 60000, "zeta(3d)": 80 } into the API's lists; F and G values are multiplied by `scale`. */
export function parametersBody(values: Record<string, number>, Eav: number, scale = 1): EnergyParametersBody {
	const body: Required<EnergyParametersBody> = { Eav, F: [], G: [], zeta: [] };
	for (const [id, value] of Object.entries(values)) {
		if (!Number.isFinite(value)) continue;
		const fg = /^([FG])(\d+)\(([^,]+),([^)]+)\)$/.exec(id);
		const z = /^zeta\(([^)]+)\)$/.exec(id);
		if (fg) body[fg[1] as 'F' | 'G'].push({ k: Number(fg[2]), a: fg[3], b: fg[4], value: value * scale });
		else if (z) body.zeta.push({ shell: z[1], value });
	}
	return body;
}
