import type { Actions, PageServerLoad } from './$types';
import { listUsers, setSiteRole } from '$lib/server/services/users';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { users: forPage(() => listUsers(user)) };
};

export const actions: Actions = {
	role: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const result = await forAction(() => setSiteRole(user, form.text('userId'), form.text('siteRole')));
		return result.ok ? { changed: true } : result.failure;
	}
};
