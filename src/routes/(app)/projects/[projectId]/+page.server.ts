import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { deleteProject, getProject, updateProject } from '$lib/server/services/projects';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	// The Shelf itself is fetched by the page from /api/v1 in the browser.
	return { project: forPage(() => getProject(user, event.params.projectId)) };
};

export const actions: Actions = {
	rename: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const result = await forAction(
			() =>
				updateProject(user, event.params.projectId, {
					name: form.text('name'),
					description: form.text('description')
				}),
			{ form: 'rename' }
		);
		return result.ok ? { saved: true } : result.failure;
	},
	delete: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const project = forPage(() => getProject(user, event.params.projectId));
		if (form.text('confirm') !== project.name)
			return fail(400, { form: 'delete', field: 'confirm', message: `Type the project name "${project.name}" to confirm` });
		const result = await forAction(() => deleteProject(user, event.params.projectId), { form: 'delete' });
		if (!result.ok) return result.failure;
		redirect(303, '/projects');
	}
};
