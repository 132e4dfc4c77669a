import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { addMember, changeMemberRole, leaveProject, listMembers, removeMember } from '$lib/server/services/projects';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { members: forPage(() => listMembers(user, event.params.projectId)) };
};

export const actions: Actions = {
	add: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const email = form.text('email');
		const result = await forAction(() => addMember(user, event.params.projectId, { email, role: form.text('role') }), {
			form: 'add',
			email
		});
		return result.ok ? { added: result.value.message } : result.failure;
	},
	role: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const result = await forAction(() => changeMemberRole(user, event.params.projectId, form.text('userId'), form.text('role')));
		return result.ok ? { changed: true } : result.failure;
	},
	remove: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const result = await forAction(() => removeMember(user, event.params.projectId, form.text('userId')));
		return result.ok ? { removed: true } : result.failure;
	},
	leave: async (event) => {
		const user = requireUser(event);
		const result = await forAction(() => leaveProject(user, event.params.projectId));
		if (!result.ok) return result.failure;
		redirect(303, '/projects');
	}
};
