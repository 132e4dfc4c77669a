import type { RequestHandler } from './$types';
import { moveEntry } from '$lib/server/services/shelf-transfer';
import { api, apiActor, readJson, reply } from '$lib/server/http';

/** Body `{ "projectId": "…" }`: the entry, its level notes and all their history move there (you edit both projects). */
export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const moved = moveEntry(actor, event.params.projectId, event.params.entryId, await readJson(event));
	return reply('POST /api/v1/projects/:projectId/shelf/:entryId/move', moved);
});
