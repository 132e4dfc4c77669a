import type { PageServerLoad } from './$types';
import { activityActors, listActivity } from '$lib/server/services/activity';
import { forPage, requireUser } from '$lib/server/http';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	const { projectId } = event.params;
	const query = Object.fromEntries(event.url.searchParams);
	return forPage(() => ({
		...listActivity(user, projectId, query),
		actors: activityActors(user, projectId),
		filter: { actor: query.actor ?? '', kind: query.kind ?? '', paged: Boolean(query.cursor) }
	}));
};
