import type { Actions, PageServerLoad } from './$types';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';
import { matchQuery } from '$lib/server/list-upload-body';
import { listLists } from '$lib/server/services/lists';
import { matchSavedLists } from '$lib/server/services/saved-match';
import { judgeCandidate } from '$lib/server/services/identifications';

/** The chosen lists and options come from the URL (a GET form), so a match can be linked and reloaded. */
export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	const { projectId } = event.params;
	const lists = forPage(() => listLists(user, projectId));
	const query = matchQuery(event.url.searchParams);
	const chosen = query.levelListId !== '' && query.lineListId !== '';
	return { ...lists, query, match: chosen ? forPage(() => matchSavedLists(user, projectId, query)) : null };
};

export const actions: Actions = {
	/** Accept or reject one candidate of a line (the pressed button's `status`), with a note. */
	judge: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const input = {
			lineId: form.text('lineId'),
			upperLevelId: form.text('upperLevelId'),
			lowerLevelId: form.text('lowerLevelId'),
			type: form.text('type'),
			status: form.text('status'),
			note: form.text('note')
		};
		const r = await forAction(() => judgeCandidate(user, event.params.projectId, input), { form: 'judge', lineId: input.lineId });
		return r.ok ? { form: 'judge', judged: r.value.id } : r.failure;
	}
};
