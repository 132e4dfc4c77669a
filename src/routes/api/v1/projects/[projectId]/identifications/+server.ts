import type { RequestHandler } from './$types';
import { judgeCandidate, listIdentifications } from '$lib/server/services/identifications';
import { api, apiActor, readJson, reply } from '$lib/server/http';

/** `?lineListId=&status=accepted|rejected` */
export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/identifications', {
		identifications: listIdentifications(apiActor(event), event.params.projectId, Object.fromEntries(event.url.searchParams))
	})
);

/** `{ lineId, upperLevelId, lowerLevelId, type, status: accepted|rejected, note? }`; the residual is computed here. */
export const PUT: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return reply('PUT /api/v1/projects/:projectId/identifications', {
		identification: judgeCandidate(actor, event.params.projectId, await readJson(event))
	});
});
