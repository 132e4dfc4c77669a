import type { RequestHandler } from './$types';
import { addMember, listMembers } from '$lib/server/services/projects';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/members', { members: listMembers(apiActor(event), event.params.projectId) })
);

export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	return reply(
		'POST /api/v1/projects/:projectId/members',
		{ member: addMember(actor, event.params.projectId, await readJson(event)) },
		{ status: 201 }
	);
});
