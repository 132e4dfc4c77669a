import type { RequestHandler } from './$types';
import { exportAnnotatedLevels, parseFormat } from '$lib/server/services/exports';
import { api, apiActor } from '$lib/server/http';

/** The entry's levels with their annotations: `?format=csv|json|tex` (default json). */
export const GET: RequestHandler = api((event) => {
	const actor = apiActor(event);
	const format = parseFormat(event.url.searchParams.get('format'));
	const file = exportAnnotatedLevels(actor, event.params.projectId, event.params.entryId, format);
	const download = event.url.searchParams.get('download') !== null;
	return new Response(file.body, {
		headers: {
			'content-type': file.type,
			...(download ? { 'content-disposition': `attachment; filename="${file.filename}"` } : {})
		}
	});
});
