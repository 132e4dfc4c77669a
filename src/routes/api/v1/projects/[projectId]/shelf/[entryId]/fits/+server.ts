import type { RequestHandler } from './$types';
import { fitRequestOf, listFitReports, prepareEntryFit, saveFitReport } from '$lib/server/services/fit-reports';
import { compute } from '$lib/server/compute/pool';
import type { FitResponse } from '$lib/api/types';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId/fits', {
		fits: listFitReports(apiActor(event), event.params.projectId, event.params.entryId)
	})
);

/**
 * Fits the entry's configuration and saves the report. Body as POST /api/v1/fit without `config`;
 * without `observed`, the entry's annotated observed energies (not the disputed ones). The role is
 * checked first; the fit runs in the compute pool when large (a closed connection cancels it, and
 * nothing is saved); the report is saved with its activity line in one transaction.
 */
export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const { projectId, entryId } = event.params;
	const prepared = prepareEntryFit(actor, projectId, entryId, await readJson(event, 256 * 1024));
	const answer = await compute('fit', fitRequestOf(prepared), { signal: event.request.signal });
	if (answer.status !== 200) return new Response(answer.body, { status: answer.status, headers: { 'content-type': 'application/json' } });
	const { limits: _, ...result } = JSON.parse(answer.body) as FitResponse;
	const fit = saveFitReport(actor, projectId, prepared, result);
	return reply('POST /api/v1/projects/:projectId/shelf/:entryId/fits', { fit }, { status: 201 });
});
