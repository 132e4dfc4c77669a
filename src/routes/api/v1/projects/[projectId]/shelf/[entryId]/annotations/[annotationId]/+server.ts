import type { RequestHandler } from './$types';
import { deleteAnnotationById, reattachAnnotation } from '$lib/server/services/annotations';
import { api, apiActor, readJson, reply } from '$lib/server/http';

/** Reattaches a note (e.g. a detached one) to a level of the present configuration. Body: { levelKey, version }. */
export const PATCH: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const { projectId, entryId, annotationId } = event.params;
	return reply('PATCH /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId', {
		annotation: reattachAnnotation(actor, projectId, entryId, annotationId, await readJson(event))
	});
});

/** Deletes one note, attached or detached. */
export const DELETE: RequestHandler = api((event) => {
	const { projectId, entryId, annotationId } = event.params;
	deleteAnnotationById(apiActor(event), projectId, entryId, annotationId);
	return new Response(null, { status: 204 });
});
