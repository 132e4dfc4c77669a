import type { RequestHandler } from './$types';
import { getFitReport } from '$lib/server/services/fit-reports';
import { api, apiActor, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId/fits/:fitId', {
		fit: getFitReport(apiActor(event), event.params.projectId, event.params.entryId, event.params.fitId).report
	})
);
