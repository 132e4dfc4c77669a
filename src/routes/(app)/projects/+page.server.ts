import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { createProject, listProjects } from '$lib/server/services/projects';
import { forAction, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';
import { restoreFromForm } from '$lib/server/restore-form';

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
	},
	/** A backup file (multipart upload) becomes a new project owned by the importer. */
	restore: async (event) => {
		const user = requireUser(event);
		const outcome = await restoreFromForm(user, await readForm(event.request));
		return outcome.ok ? { restored: outcome.report } : fail(outcome.status, { form: 'restore', field: 'file', message: outcome.message });
	}
};
