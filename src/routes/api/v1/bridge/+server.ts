import type { RequestHandler } from './$types';
import { formatConfiguration, parseConfiguration } from '$lib/physics/parse';
import { couplingBridge } from '$lib/physics/bridge';
import { jjLevelCountsByJ, MAX_JJ_LEVELS } from '$lib/physics/jj';
import { ServiceError } from '$lib/server/errors';
import { halfString } from '$lib/physics/half';
import { api, queryParam, reply } from '$lib/server/http';

/** LS ↔ jj correlation by J (non-crossing rule), both sides in schematic order: `?config=2p 3p`. */
export const GET: RequestHandler = api((event) => {
	const cfg = parseConfiguration(queryParam(event, 'config'));
	let levels = 0;
	for (const n of jjLevelCountsByJ(cfg).values()) levels += n;
	if (levels > MAX_JJ_LEVELS)
		throw new ServiceError(
			400,
			`${formatConfiguration(cfg)} has ${levels} levels, more than the ${MAX_JJ_LEVELS} the Coupling bridge can join one by one. The Term sheet still gives its terms and the number of levels of each J, and the jj levels can be counted by J (GET /api/v1/jj?counts=only); or bridge a smaller configuration, e.g. with fewer open subshells.`,
			{ field: 'config', levels, limit: MAX_JJ_LEVELS }
		);
	const b = couplingBridge(cfg);
	return reply('GET /api/v1/bridge', {
		configuration: { notation: formatConfiguration(cfg), pretty: formatConfiguration(cfg, { superscripts: true }), parity: cfg.parity },
		schematic: true,
		ls: b.ls.map((x) => ({ label: x.label, J: halfString(x.twoJ) })),
		jj: b.jj.map((x) => ({
			label: x.label,
			J: halfString(x.twoJ),
			group: x.level.couplingLabel,
			subshells: x.level.subshellLabel,
			spinOrbitWeight: x.spinOrbitWeight
		})),
		links: b.links.map((l) => ({ J: halfString(l.twoJ), ls: l.ls, jj: l.jj }))
	});
});
