import type { RequestHandler } from './$types';
import { createEntry, listEntries } from '$lib/server/services/shelf';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf', { entries: listEntries(apiActor(event), event.params.projectId) })
);

export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return reply(
		'POST /api/v1/projects/:projectId/shelf',
		{ entry: createEntry(actor, event.params.projectId, await readJson(event)) },
		{ status: 201 }
	);
});
