import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { changeMemberRole, getProject, leaveProject, listMembers, removeMember } from '$lib/server/services/projects';
import { addOrInvite, listInvitations, resendInvitation, revokeInvitation } from '$lib/server/services/invitations';
import { forAction, forPage, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	const { projectId } = event.params;
	const members = forPage(() => listMembers(user, projectId));
	// Only owners see the invitations (their addresses and links are the owners' business).
	const invitations = forPage(() => (getProject(user, projectId).role === 'owner' ? listInvitations(user, projectId) : []));
	return { members, invitations };
};

export const actions: Actions = {
	add: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const email = form.text('email');
		const result = await forAction(() => addOrInvite(user, event.params.projectId, { email, role: form.text('role') }, event.url.origin), {
			form: 'add',
			email
		});
		return result.ok ? { added: result.value.message } : result.failure;
	},
	resend: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const result = await forAction(() => resendInvitation(user, event.params.projectId, form.text('invitationId'), event.url.origin));
		return result.ok ? { resent: `A new link went to ${result.value.email}; the earlier one no longer works.` } : result.failure;
	},
	revoke: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const result = await forAction(() => revokeInvitation(user, event.params.projectId, form.text('invitationId')));
		return result.ok ? { revoked: true } : result.failure;
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
