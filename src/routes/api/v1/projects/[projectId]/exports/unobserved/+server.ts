import type { RequestHandler } from './$types';
import { exportUnobservedLines } from '$lib/server/services/list-exports';
import { parseFormat } from '$lib/server/services/exports';
import { api, apiActor } from '$lib/server/http';
import { fileResponse } from '$lib/server/file-response';
import { matchQuery } from '$lib/server/list-upload-body';

/** Strong predicted lines no observed line explains: `?levelListId=&lineListId=&types=E1,M1&toleranceUnit=&tolerance=&coverage=&format=`. */
export const GET: RequestHandler = api((event) => {
	const format = parseFormat(event.url.searchParams.get('format'));
	const file = exportUnobservedLines(apiActor(event), event.params.projectId, matchQuery(event.url.searchParams), format);
	return fileResponse(event, file);
});
