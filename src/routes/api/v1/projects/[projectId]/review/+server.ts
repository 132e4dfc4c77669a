import type { RequestHandler } from './$types';
import { awaitingReview } from '$lib/server/services/review';
import { api, apiActor, reply } from '$lib/server/http';

/** Proposed notes the caller could confirm (not their own). `?limit=` 1 … 200. */
export const GET: RequestHandler = api((event) =>
	reply(
		'GET /api/v1/projects/:projectId/review',
		awaitingReview(apiActor(event), event.params.projectId, Object.fromEntries(event.url.searchParams))
	)
);
