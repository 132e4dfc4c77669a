import type { Actions, PageServerLoad } from './$types';
import { addMember, changeMemberRole, listMembers, removeMember } from '$lib/server/services/projects';
import { forAction, forPage, requireUser } from '$lib/server/http';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { members: forPage(() => listMembers(user, event.params.projectId)) };
};

export const actions: Actions = {
	add: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const email = String(form.get('email') ?? '');
		const result = await forAction(() => addMember(user, event.params.projectId, { email, role: String(form.get('role') ?? '') }), {
			email
		});
		return result.ok ? { added: result.value.name } : result.failure;
	},
	role: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const result = await forAction(() =>
			changeMemberRole(user, event.params.projectId, String(form.get('userId') ?? ''), String(form.get('role') ?? ''))
		);
		return result.ok ? { changed: true } : result.failure;
	},
	remove: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const result = await forAction(() => removeMember(user, event.params.projectId, String(form.get('userId') ?? '')));
		return result.ok ? { removed: true } : result.failure;
	}
};
