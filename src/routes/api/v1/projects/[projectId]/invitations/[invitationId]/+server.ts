import type { RequestHandler } from './$types';
import { revokeInvitation } from '$lib/server/services/invitations';
import { api, apiActor } from '$lib/server/http';

export const DELETE: RequestHandler = api((event) => {
	revokeInvitation(apiActor(event), event.params.projectId, event.params.invitationId);
	return new Response(null, { status: 204 });
});
