import type { RequestHandler } from './$types';
import { getProject, leaveProject } from '$lib/server/services/projects';
import { api, apiActor, reply } from '$lib/server/http';

/** Your own membership: GET shows your role, DELETE leaves the project (not as its last owner). */
export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/membership', { membership: { role: getProject(apiActor(event), event.params.projectId).role } })
);

export const DELETE: RequestHandler = api((event) => {
	leaveProject(apiActor(event), event.params.projectId);
	return new Response(null, { status: 204 });
});
