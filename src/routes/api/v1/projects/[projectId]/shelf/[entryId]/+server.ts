import type { RequestHandler } from './$types';
import { deleteEntry, getEntry, updateEntry } from '$lib/server/services/shelf';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId', {
		entry: getEntry(apiActor(event), event.params.projectId, event.params.entryId)
	})
);

/** Body: the fields to change plus `version`, the version you last read (stale versions get 409). */
export const PATCH: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return reply('PATCH /api/v1/projects/:projectId/shelf/:entryId', {
		entry: updateEntry(actor, event.params.projectId, event.params.entryId, await readJson(event))
	});
});

export const DELETE: RequestHandler = api((event) => {
	deleteEntry(apiActor(event), event.params.projectId, event.params.entryId);
	return new Response(null, { status: 204 });
});
