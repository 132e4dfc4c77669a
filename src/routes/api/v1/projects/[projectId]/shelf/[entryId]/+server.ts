import type { RequestHandler } from './$types';
import { deleteEntry, getEntry, updateEntry } from '$lib/server/services/shelf';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId', {
		entry: getEntry(apiActor(event), event.params.projectId, event.params.entryId)
	})
);

/**
 * Body: only the fields to change plus `version`, the version you last read (stale versions get 409).
 * A new configuration detaches the entry's notes (`detachedNotes` says how many).
 */
export const PATCH: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const { detachedNotes, ...entry } = updateEntry(actor, event.params.projectId, event.params.entryId, await readJson(event));
	return reply('PATCH /api/v1/projects/:projectId/shelf/:entryId', { entry, detachedNotes });
});

export const DELETE: RequestHandler = api((event) => {
	deleteEntry(apiActor(event), event.params.projectId, event.params.entryId);
	return new Response(null, { status: 204 });
});
