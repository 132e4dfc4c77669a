import type { RequestHandler } from './$types';
import { copyEntry } from '$lib/server/services/shelf-transfer';
import { api, apiActor, readJson, reply } from '$lib/server/http';

/** Body `{ "projectId": "…" }`: a copy in that project (you edit it), with the level notes and their history. */
export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const made = copyEntry(actor, event.params.projectId, event.params.entryId, await readJson(event));
	return reply('POST /api/v1/projects/:projectId/shelf/:entryId/copy', made, { status: 201 });
});
