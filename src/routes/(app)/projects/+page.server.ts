import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { createProject, listProjects } from '$lib/server/services/projects';
import { forAction, requireUser } from '$lib/server/http';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { projects: listProjects(user) };
};

export const actions: Actions = {
	create: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const input = { name: String(form.get('name') ?? ''), description: String(form.get('description') ?? '') };
		const result = await forAction(() => createProject(user, input));
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${result.value.id}`);
	}
};
