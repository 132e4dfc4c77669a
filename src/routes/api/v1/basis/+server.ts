import type { RequestHandler } from './$types';
import { MAX_J_COUPLING_TABLE } from '$lib/physics/basis';
import { ServiceError } from '$lib/server/errors';
import { parseHalf } from '$lib/physics/half';
import { api, queryParam } from '$lib/server/http';
import { computeResponse } from '$lib/server/compute/pool';

/** Coupled ↔ uncoupled table of j1 ⊗ j2 with exact coefficients: `?j1=1&j2=1/2` (each ≤ 10). */
function momentum(text: string, name: string): number {
	let twice: number;
	try {
		twice = parseHalf(text);
	} catch {
		throw new ServiceError(400, `${name} = "${text}" is not an integer or half-integer; write e.g. 2 or 3/2`, { field: name });
	}
	if (twice < 0 || twice > 2 * MAX_J_COUPLING_TABLE)
		throw new ServiceError(400, `${name} must be from 0 to ${MAX_J_COUPLING_TABLE}, got ${text}`, { field: name });
	return twice;
}

export const GET: RequestHandler = api((event) =>
	computeResponse('basis', { tj1: momentum(queryParam(event, 'j1', 10), 'j1'), tj2: momentum(queryParam(event, 'j2', 10), 'j2') })
);
