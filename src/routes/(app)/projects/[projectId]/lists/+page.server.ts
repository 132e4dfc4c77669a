import type { Actions, PageServerLoad } from './$types';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';
import { readUploadForm } from '$lib/server/list-upload-form';
import { deleteList, levelListFromShelf, listLists, uploadLevelList, uploadLineList } from '$lib/server/services/lists';
import { listEntries } from '$lib/server/services/shelf';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	const { projectId } = event.params;
	const lists = forPage(() => listLists(user, projectId));
	const shelf = forPage(() => listEntries(user, projectId, { limit: 200, sort: 'title' }));
	return { ...lists, entries: shelf.entries.map((e) => ({ id: e.id, title: e.title, notation: e.notation })) };
};

const upload = (kind: 'levels' | 'lines') => (kind === 'levels' ? uploadLevelList : uploadLineList);

export const actions: Actions = {
	/** Reads the file and shows its first rows and every problem; saves nothing. */
	preview: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const r = await forAction(
			async () => {
				const f = await readUploadForm(form);
				return { ...f, ...upload(f.kind)(user, event.params.projectId, { name: f.name, csv: f.csv }, { save: false }) };
			},
			{ form: 'upload' }
		);
		if (!r.ok) return r.failure;
		const { kind, name, fileName, csv, preview } = r.value;
		// The text comes back in a hidden field only when it can be saved as it is.
		return { form: 'upload', kind, name, fileName, preview, csv: preview.problemCount === 0 ? csv : null };
	},
	/** Saves the file (or the previewed text) when it has no problem; otherwise lists them and saves nothing. */
	save: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const kind = form.text('kind') === 'lines' ? 'lines' : 'levels';
		const r = await forAction(
			async () => {
				const f = await readUploadForm(form);
				return upload(f.kind)(user, event.params.projectId, { name: f.name, csv: f.csv }, { save: true }).list!;
			},
			{ form: 'upload', kind, name: form.text('name') }
		);
		if (!r.ok) return r.failure;
		return { form: 'upload', saved: { kind, name: r.value.name, rowCount: r.value.rowCount } };
	},
	/** A level list from the chosen Shelf entries' level notes. */
	fromShelf: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const r = await forAction(
			() => levelListFromShelf(user, event.params.projectId, { name: form.text('name'), entryIds: form.all('entryIds') }),
			{
				form: 'fromShelf'
			}
		);
		if (!r.ok) return r.failure;
		return { form: 'fromShelf', saved: { kind: 'levels', name: r.value.name, rowCount: r.value.rowCount } };
	},
	delete: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const kind = form.text('kind') === 'lines' ? 'lines' : 'levels';
		const r = await forAction(() => deleteList(user, event.params.projectId, kind, form.text('listId')), { form: 'delete' });
		return r.ok ? { form: 'delete', deleted: true } : r.failure;
	}
};
