import type { RequestHandler } from './$types';
import { deleteList, getLineList } from '$lib/server/services/lists';
import { api, apiActor, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply(
		'GET /api/v1/projects/:projectId/line-lists/:lineListId',
		getLineList(apiActor(event), event.params.projectId, event.params.lineListId)
	)
);

/** Deletes the list, its lines and their identifications. */
export const DELETE: RequestHandler = api((event) => {
	deleteList(apiActor(event), event.params.projectId, 'lines', event.params.lineListId);
	return new Response(null, { status: 204 });
});
