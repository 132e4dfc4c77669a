import type { LayoutServerLoad } from './$types';
import { getProject } from '$lib/server/services/projects';
import { forPage, requireUser } from '$lib/server/http';

export const load: LayoutServerLoad = (event) => {
	const user = requireUser(event);
	return { project: forPage(() => getProject(user, event.params.projectId)) };
};
