import type { RequestHandler } from './$types';
import { createEntry, listEntries } from '$lib/server/services/shelf';
import { api, apiActor, readJson, reply } from '$lib/server/http';

/** One page of the Shelf as a library: filters, sort and paging as in `listEntries` (services/shelf.ts). */
export const GET: RequestHandler = api((event) =>
	reply(
		'GET /api/v1/projects/:projectId/shelf',
		listEntries(apiActor(event), event.params.projectId, Object.fromEntries(event.url.searchParams))
	)
);

export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return reply(
		'POST /api/v1/projects/:projectId/shelf',
		{ entry: createEntry(actor, event.params.projectId, await readJson(event)) },
		{ status: 201 }
	);
});
