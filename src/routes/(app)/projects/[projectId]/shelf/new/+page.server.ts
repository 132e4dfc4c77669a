import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { projectAccess } from '$lib/server/access';
import { createEntry } from '$lib/server/services/shelf';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm, shelfFieldsFrom } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	forPage(() => projectAccess(user, event.params.projectId, 'editor'));
	const q = event.url.searchParams;
	const species = (q.get('species') ?? '').trim();
	const notation = (q.get('config') ?? '').trim();
	// "Save to Shelf" from the Builder: a title from the species and configuration, to edit or keep.
	const title = q.get('title') ?? [species, notation].filter(Boolean).join(' ').slice(0, 160);
	return { prefill: { title, species, notation, notes: '', tags: [] } };
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireUser(event);
		const values = shelfFieldsFrom(await readForm(event.request));
		const result = await forAction(() => createEntry(user, event.params.projectId, values), { values });
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${event.params.projectId}/shelf/${result.value.id}`);
	}
};
