import type { RequestHandler } from './$types';
import { exportIdentifiedLines } from '$lib/server/services/list-exports';
import { parseFormat } from '$lib/server/services/exports';
import { api, apiActor, queryParam } from '$lib/server/http';
import { fileResponse } from '$lib/server/file-response';

/** The accepted identifications of a line list: `?lineListId=&format=csv|json|tex[&download]`. */
export const GET: RequestHandler = api((event) => {
	const format = parseFormat(event.url.searchParams.get('format'));
	const file = exportIdentifiedLines(apiActor(event), event.params.projectId, queryParam(event, 'lineListId', 64), format);
	return fileResponse(event, file);
});
