import type { RequestHandler } from './$types';
import { duplicateEntry } from '$lib/server/services/shelf-transfer';
import { api, apiActor, reply } from '$lib/server/http';

/** A copy of the entry in the same project, titled "… (copy)", with its level notes (services/shelf-transfer.ts). */
export const POST: RequestHandler = api((event) =>
	reply(
		'POST /api/v1/projects/:projectId/shelf/:entryId/duplicate',
		duplicateEntry(apiActor(event), event.params.projectId, event.params.entryId),
		{
			status: 201
		}
	)
);
