import type { RequestHandler } from './$types';
import { parseConfiguration, subshellLabel } from '$lib/physics/parse';
import { listMicrostates } from '$lib/physics/listing';
import { halfString } from '$lib/physics/half';
import { api, queryParam, reply } from '$lib/server/http';
import { ServiceError } from '$lib/server/errors';

const MAX_PAGE = 500;

/**
 * One page of explicit microstates (on request only; counts come from /terms):
 * `?config=2p2&offset=0&limit=50` (limit ≤ 500).
 */
export const GET: RequestHandler = api((event) => {
	const cfg = parseConfiguration(queryParam(event, 'config'));
	const offsetText = event.url.searchParams.get('offset') ?? '0';
	const limitText = event.url.searchParams.get('limit') ?? '50';
	if (!/^\d{1,30}$/.test(offsetText)) throw new ServiceError(400, 'offset must be a whole number ≥ 0');
	if (!/^\d{1,3}$/.test(limitText) || Number(limitText) > MAX_PAGE)
		throw new ServiceError(400, `limit must be a whole number from 0 to ${MAX_PAGE}`);
	const page = listMicrostates(cfg, { offset: BigInt(offsetText), limit: Number(limitText) });
	return reply('GET /api/v1/microstates', {
		total: page.total.toString(),
		offset: page.offset.toString(),
		subshells: page.subshells.map((s) => subshellLabel(s)),
		items: page.items.map((it) => ({
			index: it.index.toString(),
			ML: it.ML,
			MS: halfString(it.twoMS),
			// Each spin-orbital as m_l with the spin as + or −, e.g. "1+", "-1-".
			orbitals: it.spinOrbitals.map((group) => group.map((o) => `${o.ml}${o.twoMs > 0 ? '+' : '-'}`))
		}))
	});
});
