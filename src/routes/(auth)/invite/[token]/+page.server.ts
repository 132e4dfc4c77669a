import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { acceptInvitation, invitationForToken, signUpByInvitation } from '$lib/server/services/invitations';
import { startSession } from '$lib/server/session';
import { forAction } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

/** Anyone holding the link may see what it offers (the project, the role, the address); nothing else. */
export const load: PageServerLoad = ({ params, locals }) => {
	const invitation = invitationForToken(params.token);
	return {
		invitation: invitation && {
			state: invitation.state,
			refusal: invitation.refusal,
			email: invitation.email,
			role: invitation.role,
			projectName: invitation.projectName,
			invitedByName: invitation.invitedByName,
			expiresAt: invitation.expiresAt,
			hasAccount: invitation.hasAccount
		},
		signedInAs: locals.user?.email ?? null
	};
};

export const actions: Actions = {
	/** The signed-in account joins (only the one that uses the invited address). */
	accept: async (event) => {
		const result = await forAction(() => acceptInvitation(event.locals.user, event.params.token));
		if (!result.ok) return result.failure;
		redirect(303, `/projects/${result.value.projectId}`);
	},
	/** A new account for the invited address, and it joins; then signed in. */
	signup: async (event) => {
		if (event.locals.user) return fail(409, { message: 'You are signed in already; sign out first to create another account' });
		const form = await readForm(event.request);
		const name = form.text('name');
		const result = await forAction(() => signUpByInvitation(event.params.token, { name, password: form.text('password') }), { name });
		if (!result.ok) return result.failure;
		await startSession(event.cookies, result.value.actor.id);
		redirect(303, `/projects/${result.value.projectId}`);
	}
};
