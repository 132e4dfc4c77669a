import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';
import { couplingTable } from '$lib/physics/basis';
import { exactJson } from '$lib/physics/exact';
import { halfString, parseHalf } from '$lib/physics/half';
import { api, queryParam } from '$lib/server/http';

/** Coupled ↔ uncoupled table of j1 ⊗ j2 with exact coefficients: `?j1=1&j2=1/2` (each ≤ 10). */
export const GET: RequestHandler = api((event) => {
	const t = couplingTable(parseHalf(queryParam(event, 'j1', 10)), parseHalf(queryParam(event, 'j2', 10)));
	return json({
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
