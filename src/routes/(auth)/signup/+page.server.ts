import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { signUp } from '$lib/server/services/users';
import { startSession } from '$lib/server/session';
import { forAction } from '$lib/server/http';

export const load: PageServerLoad = ({ locals }) => {
	if (locals.user) redirect(303, '/projects');
};

export const actions: Actions = {
	default: async (event) => {
		const form = await event.request.formData();
		const name = String(form.get('name') ?? '');
		const email = String(form.get('email') ?? '');
		const result = await forAction(() => signUp({ name, email, password: String(form.get('password') ?? '') }), { name, email });
		if (!result.ok) return result.failure;
		await startSession(event.cookies, result.value.id);
		redirect(303, '/projects');
	}
};
