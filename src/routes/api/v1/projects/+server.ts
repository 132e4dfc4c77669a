import type { RequestHandler } from './$types';
import { createProject, listProjects } from '$lib/server/services/projects';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) => reply('GET /api/v1/projects', { projects: listProjects(apiActor(event)) }));

export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return reply('POST /api/v1/projects', { project: createProject(actor, await readJson(event)) }, { status: 201 });
});
