import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { signUp } from '$lib/server/services/users';
import { startSession } from '$lib/server/session';
import { forAction } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = ({ locals }) => {
	if (locals.user) redirect(303, '/projects');
};

export const actions: Actions = {
	default: async (event) => {
		const form = await readForm(event.request);
		const name = form.text('name');
		const email = form.text('email');
		const result = await forAction(() => signUp({ name, email, password: form.text('password') }), { name, email });
		if (!result.ok) return result.failure;
		await startSession(event.cookies, result.value.id);
		redirect(303, '/projects');
	}
};
