import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { createProject, listProjects } from '$lib/server/services/projects';
import { forAction, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { projects: listProjects(user) };
};

export const actions: Actions = {
	create: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const input = { name: form.text('name'), description: form.text('description') };
		const result = await forAction(() => createProject(user, input));
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${result.value.id}`);
	}
};
