import type { RequestHandler } from './$types';
import { exportFitReport, parseFormat } from '$lib/server/services/exports';
import { api, apiActor, fileResponse } from '$lib/server/http';

/** A saved fit report as a file: `?format=csv|json|tex` (default json), `&download` to save it. */
export const GET: RequestHandler = api((event) => {
	const actor = apiActor(event);
	const format = parseFormat(event.url.searchParams.get('format'));
	const { projectId, entryId, fitId } = event.params;
	return fileResponse(event, exportFitReport(actor, projectId, entryId, fitId, format));
});
