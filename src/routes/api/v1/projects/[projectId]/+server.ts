import type { RequestHandler } from './$types';
import { deleteProject, getProject, updateProject } from '$lib/server/services/projects';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId', { project: getProject(apiActor(event), event.params.projectId) })
);

export const PATCH: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return reply('PATCH /api/v1/projects/:projectId', { project: updateProject(actor, event.params.projectId, await readJson(event)) });
});

export const DELETE: RequestHandler = api((event) => {
	deleteProject(apiActor(event), event.params.projectId);
	return new Response(null, { status: 204 });
});
