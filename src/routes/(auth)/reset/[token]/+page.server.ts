import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { resetPassword, resetTokenUser } from '$lib/server/services/password-reset';
import { startSession } from '$lib/server/session';
import { forAction } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = ({ params }) => ({ valid: resetTokenUser(params.token) !== null });

export const actions: Actions = {
	default: async (event) => {
		const password = (await readForm(event.request)).text('password');
		const result = await forAction(() => resetPassword(event.params.token, password));
		if (!result.ok) return result.failure;
		await startSession(event.cookies, result.value.userId);
		redirect(303, `/account?ended=reset&tokens=${result.value.tokens}`);
	}
};
