import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';
import { createProject, listProjects } from '$lib/server/services/projects';
import { api, apiActor, readJson } from '$lib/server/http';

export const GET: RequestHandler = api((event) => json({ projects: listProjects(apiActor(event)) }));

export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return json({ project: createProject(actor, await readJson(event)) }, { status: 201 });
});
