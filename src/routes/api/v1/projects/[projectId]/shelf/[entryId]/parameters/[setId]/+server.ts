import type { RequestHandler } from './$types';
import { deleteParameterSet, getParameterSet, updateParameterSet } from '$lib/server/services/parameter-sets';
import { api, apiActor, queryParam, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId', {
		parameterSet: getParameterSet(apiActor(event), event.params.projectId, event.params.entryId, event.params.setId)
	})
);

/** Body: the fields to change and `version`, the version you read (409 when stale). */
export const PATCH: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const { projectId, entryId, setId } = event.params;
	const parameterSet = updateParameterSet(actor, projectId, entryId, setId, await readJson(event));
	return reply('PATCH /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId', { parameterSet });
});

/** `?version=<the version you read>` */
export const DELETE: RequestHandler = api((event) => {
	const actor = apiActor(event);
	const { projectId, entryId, setId } = event.params;
	deleteParameterSet(actor, projectId, entryId, setId, Number(queryParam(event, 'version', 12)));
	return new Response(null, { status: 204 });
});
