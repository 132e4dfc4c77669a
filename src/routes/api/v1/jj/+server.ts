import type { RequestHandler } from './$types';
import { parseConfiguration, formatConfiguration } from '$lib/physics/parse';
import { jjLevels, jjLevelCountsByJ, assertLsJjAgree, MAX_JJ_LEVELS } from '$lib/physics/jj';
import { ServiceError } from '$lib/server/errors';
import { levelCountsByJ } from '$lib/physics/terms';
import { halfString } from '$lib/physics/half';
import { api, queryParam, reply } from '$lib/server/http';

/**
 * jj-coupled levels of a configuration, one entry per level: `?config=2p5 3p`.
 * `&counts=only` gives just the number of levels of each J (any size; listing stops at MAX_JJ_LEVELS).
 */
export const GET: RequestHandler = api((event) => {
	const cfg = parseConfiguration(queryParam(event, 'config'));
	const jjCounts = jjLevelCountsByJ(cfg);
	// The level count of each J must agree with LS coupling; this throws if it does not.
	assertLsJjAgree(levelCountsByJ(cfg), jjCounts);
	const countsByJ = Object.fromEntries([...jjCounts.entries()].sort((a, b) => a[0] - b[0]).map(([tj, n]) => [halfString(tj), n]));
	if (event.url.searchParams.get('counts') === 'only')
		return reply('GET /api/v1/jj', { configuration: formatConfiguration(cfg), countsByJ, countsAgreeWithLS: true });
	const total = [...jjCounts.values()].reduce((a, b) => a + b, 0);
	if (total > MAX_JJ_LEVELS)
		throw new ServiceError(
			400,
			`This configuration has ${total} jj levels; at most ${MAX_JJ_LEVELS} are listed. Add &counts=only for the number of levels of each J.`
		);
	const levels = jjLevels(cfg).map((lv) => ({
		J: halfString(lv.twoJ),
		group: lv.couplingLabel,
		subshells: lv.subshellLabel,
		label: lv.label,
		pieces: lv.labelPieces,
		intermediates: lv.intermediates.map(halfString)
	}));
	return reply('GET /api/v1/jj', { configuration: formatConfiguration(cfg), levels, countsByJ, countsAgreeWithLS: true });
});
