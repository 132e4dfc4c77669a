import type { RequestHandler } from './$types';
import { levelListFromShelf, listLists, uploadLevelList } from '$lib/server/services/lists';
import { api, apiActor, readJson, reply } from '$lib/server/http';
import { UPLOAD_BODY_BYTES, uploadBody } from '$lib/server/list-upload-body';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/level-lists', { levelLists: listLists(apiActor(event), event.params.projectId).levelLists })
);

/**
 * `{ name, csv }` uploads a level file (`preview: true` only reads it: first rows and every problem);
 * `{ name, entryIds }` makes the list from those Shelf entries' level notes. A file with problems: 422, nothing saved.
 */
export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const { projectId } = event.params;
	const body = await readJson(event, UPLOAD_BODY_BYTES);
	if ((body as Record<string, unknown>).entryIds !== undefined) {
		const list = levelListFromShelf(actor, projectId, body);
		return reply('POST /api/v1/projects/:projectId/level-lists', { list, preview: null }, { status: 201 });
	}
	const { input, preview } = uploadBody(body);
	const r = uploadLevelList(actor, projectId, input, { save: !preview });
	return reply('POST /api/v1/projects/:projectId/level-lists', r, { status: preview ? 200 : 201 });
});
