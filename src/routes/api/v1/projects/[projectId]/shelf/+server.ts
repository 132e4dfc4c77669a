import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';
import { createEntry, listEntries } from '$lib/server/services/shelf';
import { api, apiActor, readJson } from '$lib/server/http';

export const GET: RequestHandler = api((event) => json({ entries: listEntries(apiActor(event), event.params.projectId) }));

export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return json({ entry: createEntry(actor, event.params.projectId, await readJson(event)) }, { status: 201 });
});
