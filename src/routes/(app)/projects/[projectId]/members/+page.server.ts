import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { addMember, changeMemberRole, leaveProject, listMembers, removeMember } from '$lib/server/services/projects';
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
		return result.ok ? { added: result.value.message } : result.failure;
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
	},
	leave: async (event) => {
		const user = requireUser(event);
		const result = await forAction(() => leaveProject(user, event.params.projectId));
		if (!result.ok) return result.failure;
		redirect(303, '/projects');
	}
};
