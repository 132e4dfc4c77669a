import type { RequestHandler } from './$types';
import { fitAndSave, listFitReports } from '$lib/server/services/fit-reports';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId/fits', {
		fits: listFitReports(apiActor(event), event.params.projectId, event.params.entryId)
	})
);

/**
 * Fits the entry's configuration and saves the report. Body as POST /api/v1/fit without `config`;
 * without `observed`, the entry's annotated observed energies (not the disputed ones).
 */
export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const fit = fitAndSave(actor, event.params.projectId, event.params.entryId, await readJson(event, 256 * 1024));
	return reply('POST /api/v1/projects/:projectId/shelf/:entryId/fits', { fit }, { status: 201 });
});
