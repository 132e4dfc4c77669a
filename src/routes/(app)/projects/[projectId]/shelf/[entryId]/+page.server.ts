import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { deleteEntry, updateEntry } from '$lib/server/services/shelf';
import { annotatedLevels, saveAnnotation } from '$lib/server/services/annotations';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { shelfFieldsFrom } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	const { projectId, entryId } = event.params;
	// One role check and one read of the entry: annotatedLevels returns the entry with its levels.
	return forPage(() => annotatedLevels(user, projectId, entryId));
};

/** '' → null; anything else must read as a number (zod then says what is allowed). */
const optionalNumber = (v: FormDataEntryValue | null) => {
	const text = String(v ?? '')
		.trim()
		.replace(',', '.');
	return text === '' ? null : Number(text);
};

export const actions: Actions = {
	update: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const values = shelfFieldsFrom(form);
		const version = Number(form.get('version'));
		const result = await forAction(() => updateEntry(user, event.params.projectId, event.params.entryId, { ...values, version }), {
			values
		});
		return result.ok ? { saved: true } : result.failure;
	},
	annotate: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const levelKey = String(form.get('levelKey') ?? '');
		const versionText = String(form.get('version') ?? '');
		const input = {
			levelKey,
			observedEnergy: optionalNumber(form.get('observedEnergy')),
			uncertainty: optionalNumber(form.get('uncertainty')),
			status: String(form.get('status') ?? 'proposed'),
			comment: String(form.get('comment') ?? ''),
			...(versionText ? { version: Number(versionText) } : {})
		};
		const result = await forAction(() => saveAnnotation(user, event.params.projectId, event.params.entryId, input), { levelKey });
		return result.ok ? { annotated: levelKey } : result.failure;
	},
	delete: async (event) => {
		const user = requireUser(event);
		const result = await forAction(() => deleteEntry(user, event.params.projectId, event.params.entryId));
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${event.params.projectId}`);
	}
};
