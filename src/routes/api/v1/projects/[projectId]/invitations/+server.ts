import type { RequestHandler } from './$types';
import { createInvitation, listInvitations } from '$lib/server/services/invitations';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/invitations', { invitations: listInvitations(apiActor(event), event.params.projectId) })
);

/** 201 with the invitation; 502 when the mail server did not take the mail (the invitation stays, marked 'failed'). */
export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const invitation = await createInvitation(actor, event.params.projectId, await readJson(event), event.url.origin);
	return reply('POST /api/v1/projects/:projectId/invitations', { invitation }, { status: 201 });
});
