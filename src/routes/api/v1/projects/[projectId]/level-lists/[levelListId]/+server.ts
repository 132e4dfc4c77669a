import type { RequestHandler } from './$types';
import { deleteList, getLevelList } from '$lib/server/services/lists';
import { api, apiActor, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply(
		'GET /api/v1/projects/:projectId/level-lists/:levelListId',
		getLevelList(apiActor(event), event.params.projectId, event.params.levelListId)
	)
);

/** Deletes the list, its levels and the identifications that use them. */
export const DELETE: RequestHandler = api((event) => {
	deleteList(apiActor(event), event.params.projectId, 'levels', event.params.levelListId);
	return new Response(null, { status: 204 });
});
