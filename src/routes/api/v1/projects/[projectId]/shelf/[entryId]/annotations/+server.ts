import type { RequestHandler } from './$types';
import { deleteAnnotation, listAnnotations, saveAnnotation } from '$lib/server/services/annotations';
import { api, apiActor, queryParam, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId/annotations', {
		annotations: listAnnotations(apiActor(event), event.params.projectId, event.params.entryId)
	})
);

/**
 * Creates or changes the note on one level. Body: { levelKey, observedEnergy, uncertainty, status, comment, version? };
 * changing an existing note needs the version you read (409 when stale). The review rule
 * (src/lib/review.ts): a new note cannot be confirmed (400), nor a note by its proposer (403).
 */
export const PUT: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const { reopened, ...annotation } = saveAnnotation(actor, event.params.projectId, event.params.entryId, await readJson(event));
	return reply('PUT /api/v1/projects/:projectId/shelf/:entryId/annotations', { annotation, reopened });
});

/** `?level=<levelKey>` */
export const DELETE: RequestHandler = api((event) => {
	deleteAnnotation(apiActor(event), event.params.projectId, event.params.entryId, queryParam(event, 'level', 80));
	return new Response(null, { status: 204 });
});
