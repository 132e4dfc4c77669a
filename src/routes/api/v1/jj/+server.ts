import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';
import { parseConfiguration, formatConfiguration } from '$lib/physics/parse';
import { jjLevels, jjLevelCountsByJ, assertLsJjAgree } from '$lib/physics/jj';
import { levelCountsByJ } from '$lib/physics/terms';
import { halfString } from '$lib/physics/half';
import { api, queryParam } from '$lib/server/http';

/** jj-coupled levels of a configuration, one entry per level: `?config=2p5 3p`. */
export const GET: RequestHandler = api((event) => {
	const cfg = parseConfiguration(queryParam(event, 'config'));
	const jjCounts = jjLevelCountsByJ(cfg);
	// The level count of each J must agree with LS coupling; this throws if it does not.
	assertLsJjAgree(levelCountsByJ(cfg), jjCounts);
	const levels = jjLevels(cfg).map((lv) => ({
		J: halfString(lv.twoJ),
		group: lv.couplingLabel,
		subshells: lv.subshellLabel,
		label: lv.label,
		pieces: lv.labelPieces,
		intermediates: lv.intermediates.map(halfString)
	}));
	const countsByJ = Object.fromEntries([...jjCounts.entries()].sort((a, b) => a[0] - b[0]).map(([tj, n]) => [halfString(tj), n]));
	return json({ configuration: formatConfiguration(cfg), levels, countsByJ, countsAgreeWithLS: true });
});
