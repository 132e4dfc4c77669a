import type { RequestHandler } from './$types';
import { couplingTable, MAX_J_COUPLING_TABLE } from '$lib/physics/basis';
import { ServiceError } from '$lib/server/errors';
import { exactJson } from '$lib/physics/exact';
import { halfString, parseHalf } from '$lib/physics/half';
import { api, queryParam, reply } from '$lib/server/http';

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

export const GET: RequestHandler = api((event) => {
	const t = couplingTable(momentum(queryParam(event, 'j1', 10), 'j1'), momentum(queryParam(event, 'j2', 10), 'j2'));
	return reply('GET /api/v1/basis', {
		j1: halfString(t.tj1),
		j2: halfString(t.tj2),
		coupled: t.rows.map((r) => ({
			J: halfString(r.twoJ),
			M: halfString(r.twoM),
			components: r.components.map((c) => ({ m1: halfString(c.tm1), m2: halfString(c.tm2), coefficient: exactJson(c.coefficient) }))
		})),
		uncoupled: t.inverse.map((r) => ({
			m1: halfString(r.tm1),
			m2: halfString(r.tm2),
			components: r.components.map((c) => ({ J: halfString(c.twoJ), M: halfString(c.twoM), coefficient: exactJson(c.coefficient) }))
		}))
	});
});
