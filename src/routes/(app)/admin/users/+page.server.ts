import type { Actions, PageServerLoad } from './$types';
import { listUsers, setSiteRole } from '$lib/server/services/users';
import { forAction, forPage, requireUser } from '$lib/server/http';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { users: forPage(() => listUsers(user)) };
};

export const actions: Actions = {
	role: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const result = await forAction(() => setSiteRole(user, String(form.get('userId') ?? ''), String(form.get('siteRole') ?? '')));
		return result.ok ? { changed: true } : result.failure;
	}
};
