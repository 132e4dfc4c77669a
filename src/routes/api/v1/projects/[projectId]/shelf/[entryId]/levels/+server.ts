import type { RequestHandler } from './$types';
import { exportAnnotatedLevels, parseFormat } from '$lib/server/services/exports';
import { api, apiActor, fileResponse } from '$lib/server/http';

/** The entry's levels with their annotations: `?format=csv|json|tex` (default json). */
export const GET: RequestHandler = api((event) => {
	const actor = apiActor(event);
	const format = parseFormat(event.url.searchParams.get('format'));
	return fileResponse(event, exportAnnotatedLevels(actor, event.params.projectId, event.params.entryId, format));
});
