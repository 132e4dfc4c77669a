import type { RequestHandler } from './$types';
import { displayConfiguration, formatConfiguration, parseConfiguration, subshellLabel } from '$lib/physics/parse';
import { jkLevelCountsByJ, jkLevels, jkSplit } from '$lib/physics/jk';
import { halfString } from '$lib/physics/half';
import { api, queryParam, reply } from '$lib/server/http';

/**
 * jK (pair) coupled levels of a core plus one outer electron: `?config=2p5 3p`. A configuration
 * jK does not fit gets a 400 saying why (the engine's JkNotApplicable is a RangeError).
 */
export const GET: RequestHandler = api((event) => {
	const cfg = parseConfiguration(queryParam(event, 'config'));
	const { core, outer } = jkSplit(cfg);
	const levels = jkLevels(cfg);
	const countsByJ = Object.fromEntries([...jkLevelCountsByJ(levels)].map(([twoJ, n]) => [halfString(twoJ), n]));
	return reply('GET /api/v1/jk', {
		configuration: {
			notation: formatConfiguration(cfg),
			pretty: displayConfiguration(cfg),
			parity: cfg.parity,
			core: formatConfiguration(
				core.filter((s) => s.occupancy < 4 * s.l + 2),
				{ superscripts: true }
			),
			outer: subshellLabel(outer, true)
		},
		levels: levels.map((lv) => ({
			core: {
				S: halfString(lv.core.twoS),
				L: lv.core.L,
				J: halfString(lv.core.twoJ),
				occurrence: lv.core.occurrence,
				parentage: lv.core.parentage
			},
			K: halfString(lv.twoK),
			J: halfString(lv.twoJ),
			label: lv.label
		})),
		countsByJ,
		countsAgreeWithLS: true,
		schematic: true
	});
});
