import type { RequestHandler } from './$types';
import { listMembers } from '$lib/server/services/projects';
import { addOrInvite } from '$lib/server/services/invitations';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/members', { members: listMembers(apiActor(event), event.params.projectId) })
);

export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	// 202: the same answer whether or not an account uses the e-mail (no account discovery); without one, an invitation is mailed.
	const result = await addOrInvite(actor, event.params.projectId, await readJson(event), event.url.origin);
	return reply('POST /api/v1/projects/:projectId/members', { result }, { status: 202 });
});
