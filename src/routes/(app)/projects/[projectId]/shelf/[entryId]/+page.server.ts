import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { deleteEntry, getEntry, updateEntry } from '$lib/server/services/shelf';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { shelfFieldsFrom } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { entry: forPage(() => getEntry(user, event.params.projectId, event.params.entryId)) };
};

export const actions: Actions = {
	update: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const values = shelfFieldsFrom(form);
		const version = Number(form.get('version'));
		const result = await forAction(() => updateEntry(user, event.params.projectId, event.params.entryId, { ...values, version }), { values });
		return result.ok ? { saved: true } : result.failure;
	},
	delete: async (event) => {
		const user = requireUser(event);
		const result = await forAction(() => deleteEntry(user, event.params.projectId, event.params.entryId));
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${event.params.projectId}`);
	}
};
