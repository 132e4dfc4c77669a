import type { RequestHandler } from './$types';
import { matchSavedLists } from '$lib/server/services/saved-match';
import { api, apiActor, readJson, reply } from '$lib/server/http';

/**
 * The Line matcher on saved lists: `{ levelListId, lineListId, types?, toleranceUnit?: combined|cm-1|mA, tolerance?, coverage? }`.
 * Indices in `matches`/`unobserved` point into `levelIds` and `lineIds` (the rows' ids, in list order).
 */
export const POST: RequestHandler = api(async (event) => {
	const m = matchSavedLists(apiActor(event), event.params.projectId, await readJson(event));
	return reply('POST /api/v1/projects/:projectId/match', {
		...m.result,
		levelIds: m.levels.map((l) => l.id),
		lineIds: m.lines.map((l) => l.id),
		identifications: m.identifications,
		tolerance: m.options.tolerance,
		types: m.options.types,
		caution: m.caution
	});
});
