import type { RequestHandler } from './$types';
import { noteHistory } from '$lib/server/services/note-history';
import { api, apiActor, reply } from '$lib/server/http';

/** Every change of one note, oldest first (a deleted note's too). */
export const GET: RequestHandler = api((event) => {
	const { projectId, entryId, annotationId } = event.params;
	return reply('GET /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId/history', {
		history: noteHistory(apiActor(event), projectId, entryId, annotationId)
	});
});
