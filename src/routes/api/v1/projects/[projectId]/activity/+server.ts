import type { RequestHandler } from './$types';
import { listActivity } from '$lib/server/services/activity';
import { api, apiActor, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply(
		'GET /api/v1/projects/:projectId/activity',
		listActivity(apiActor(event), event.params.projectId, Object.fromEntries(event.url.searchParams))
	)
);
