import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { getProject } from '$lib/server/services/projects';
import { forPage, requireUser } from '$lib/server/http';

/**
 * The Shelf's list is the project page (its first tab); /projects/:id/shelf?tag=… is kept as a link
 * to it with the same filters (role checked first, so a non-member still gets 404).
 */
export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	const project = forPage(() => getProject(user, event.params.projectId));
	redirect(307, `/projects/${project.id}${event.url.search}`);
};
