import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { deleteEntry, getEntry, notesDetachedBy, updateEntry } from '$lib/server/services/shelf';
import { annotatedLevels, deleteAnnotationById, reattachAnnotation, saveAnnotation } from '$lib/server/services/annotations';
import { pasteNotes, previewPaste } from '$lib/server/services/paste-notes';
import { deleteParameterSet, listParameterSets, updateParameterSet } from '$lib/server/services/parameter-sets';
import { listFitReports } from '$lib/server/services/fit-reports';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm, shelfFieldsFrom } from '$lib/server/forms';
import { splitTags } from '$lib/server/validation';
import { copyEntry, duplicateEntry, editableProjects, moveEntry } from '$lib/server/services/shelf-transfer';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	const { projectId, entryId } = event.params;
	// One role check and one read of the entry: annotatedLevels returns the entry with its levels;
	// the Energy solver's records and the projects this entry can be copied or moved to follow.
	return forPage(() => ({
		...annotatedLevels(user, projectId, entryId),
		parameterSets: listParameterSets(user, projectId, entryId),
		fits: listFitReports(user, projectId, entryId),
		targets: editableProjects(user, projectId)
	}));
};

export const actions: Actions = {
	update: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const values = shelfFieldsFrom(form);
		const version = Number(form.text('version'));
		const { projectId, entryId } = event.params;
		// Ask before a configuration change detaches notes: the form comes back with the count to confirm.
		const count = await forAction(() => notesDetachedBy(user, projectId, entryId, values));
		if (!count.ok) return count.failure;
		if (count.value > 0 && form.text('confirmDetach') !== String(count.value))
			return fail(409, {
				message: `Changing the configuration to ${values.notation} detaches ${count.value} note${count.value === 1 ? '' : 's'} from ${count.value === 1 ? 'its level' : 'their levels'}: they are kept and listed apart until you reattach them to a level of the new configuration or delete them. Save again to confirm.`,
				field: 'notation',
				confirmDetach: count.value,
				values
			});
		const result = await forAction(() => updateEntry(user, projectId, entryId, { ...values, version }), { values });
		return result.ok ? { saved: true, detachedNotes: result.value.detachedNotes } : result.failure;
	},
	/**
	 * Only the tags, with the version the editor read (the list and the entry page edit them in place).
	 * A stale version answers 409 with the tags as they are now, and what was typed comes back untouched.
	 */
	tags: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const typed = form.text('tags');
		const version = Number(form.text('version'));
		const { projectId, entryId } = event.params;
		const result = await forAction(() => updateEntry(user, projectId, entryId, { tags: splitTags(typed), version }), {
			form: 'tags',
			typed
		});
		if (result.ok) return { form: 'tags', tags: result.value.tags, version: result.value.version };
		if (result.failure.status !== 409) return result.failure;
		const now = getEntry(user, projectId, entryId);
		return fail(409, { ...result.failure.data, currentTags: now.tags, currentVersion: now.version });
	},
	annotate: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const levelKey = form.text('levelKey');
		const versionText = form.text('version');
		// Energies go on as typed; the one energy reader (energyText.ts, through the schema) decides what they mean.
		const input = {
			levelKey,
			observedEnergy: form.text('observedEnergy'),
			uncertainty: form.text('uncertainty'),
			status: form.text('status') || 'proposed',
			comment: form.text('comment'),
			...(versionText ? { version: Number(versionText) } : {})
		};
		const result = await forAction(() => saveAnnotation(user, event.params.projectId, event.params.entryId, input), {
			levelKey,
			typed: { observedEnergy: input.observedEnergy, uncertainty: input.uncertainty, comment: input.comment }
		});
		// `reopened`: new values turned a confirmed note back to proposed; the page says so.
		return result.ok ? { annotated: levelKey, reopened: result.value.reopened } : result.failure;
	},
	/** The preview of a pasted column of energies (for pages without JavaScript; with it, the page previews as you type). */
	pastePreview: async (event) => {
		const user = requireUser(event);
		const text = (await readForm(event.request)).text('text');
		const result = await forAction(() => previewPaste(user, event.params.projectId, event.params.entryId, text), { form: 'paste', text });
		return result.ok ? { form: 'paste', text, preview: result.value } : result.failure;
	},
	/** Saves a pasted column of energies: every line or none, checked against the note versions the preview showed. */
	paste: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const text = form.text('text');
		let seen: unknown;
		try {
			seen = JSON.parse(form.text('seen') || '{}');
		} catch {
			seen = null; // the service says what `seen` must be
		}
		const result = await forAction(() => pasteNotes(user, event.params.projectId, event.params.entryId, { text, seen }), {
			form: 'paste',
			text
		});
		return result.ok ? { form: 'paste', pasted: result.value } : result.failure;
	},
	/** Deletes one note (attached or detached) by id. */
	deleteNote: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const annotationId = form.text('annotationId');
		const result = await forAction(() => deleteAnnotationById(user, event.params.projectId, event.params.entryId, annotationId), {
			noteId: annotationId
		});
		return result.ok ? { noteDeleted: true } : result.failure;
	},
	/** Attaches a detached note to a level of the present configuration. */
	reattach: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const annotationId = form.text('annotationId');
		const input = { levelKey: form.text('levelKey'), version: Number(form.text('version')) };
		const result = await forAction(() => reattachAnnotation(user, event.params.projectId, event.params.entryId, annotationId, input), {
			noteId: annotationId
		});
		return result.ok ? { reattached: input.levelKey } : result.failure;
	},
	/**
	 * Renames a saved parameter set and/or changes its comment, with the version the editor read. A stale
	 * version is refused (409) with the set as it is now (`current`); what was typed comes back untouched.
	 */
	editSet: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const setId = form.text('setId');
		const typed = { name: form.text('name'), comment: form.text('comment') };
		const version = Number(form.text('version'));
		const { projectId, entryId } = event.params;
		const result = await forAction(() => updateParameterSet(user, projectId, entryId, setId, { ...typed, version }), {
			form: 'parameterSet',
			setId,
			typed
		});
		if (!result.ok) return result.failure;
		return { form: 'parameterSet', setId, saved: { name: result.value.name, version: result.value.version } };
	},
	/** Deletes a saved parameter set (version as read); fit reports made from it stay, with the values they used. */
	deleteSet: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const setId = form.text('setId');
		const version = Number(form.text('version'));
		const { projectId, entryId } = event.params;
		const result = await forAction(() => deleteParameterSet(user, projectId, entryId, setId, version), { form: 'parameterSet', setId });
		if (!result.ok) return result.failure;
		return { form: 'parameterSet', setId, deleted: form.text('name') };
	},
	/** A copy here, titled "… (copy)", with its notes; opens the copy. */
	duplicate: async (event) => {
		const user = requireUser(event);
		const result = await forAction(() => duplicateEntry(user, event.params.projectId, event.params.entryId), { form: 'transfer' });
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${event.params.projectId}/shelf/${result.value.entry.id}`);
	},
	/** A copy in the chosen project; stays here and links to the copy. */
	copy: async (event) => {
		const user = requireUser(event);
		const targetId = (await readForm(event.request)).text('projectId');
		const result = await forAction(() => copyEntry(user, event.params.projectId, event.params.entryId, { projectId: targetId }), {
			form: 'transfer'
		});
		if (!result.ok) return result.failure;
		return { form: 'transfer', copied: { projectId: targetId, entryId: result.value.entry.id, notes: result.value.notes } };
	},
	/** The entry goes to the chosen project (its link changes): opens it there. */
	move: async (event) => {
		const user = requireUser(event);
		const targetId = (await readForm(event.request)).text('projectId');
		const result = await forAction(() => moveEntry(user, event.params.projectId, event.params.entryId, { projectId: targetId }), {
			form: 'transfer'
		});
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${targetId}/shelf/${event.params.entryId}`);
	},
	delete: async (event) => {
		const user = requireUser(event);
		const result = await forAction(() => deleteEntry(user, event.params.projectId, event.params.entryId));
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${event.params.projectId}`);
	}
};
