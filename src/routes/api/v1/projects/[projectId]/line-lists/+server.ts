import type { RequestHandler } from './$types';
import { listLists, uploadLineList } from '$lib/server/services/lists';
import { api, apiActor, readJson, reply } from '$lib/server/http';
import { UPLOAD_BODY_BYTES, uploadBody } from '$lib/server/list-upload-body';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/line-lists', { lineLists: listLists(apiActor(event), event.params.projectId).lineLists })
);

/** `{ name, csv }` uploads a line file (`preview: true` only reads it). A file with problems: 422, nothing saved. */
export const POST: RequestHandler = api(async (event) => {
	const { input, preview } = uploadBody(await readJson(event, UPLOAD_BODY_BYTES));
	const r = uploadLineList(apiActor(event), event.params.projectId, input, { save: !preview });
	return reply('POST /api/v1/projects/:projectId/line-lists', r, { status: preview ? 200 : 201 });
});
