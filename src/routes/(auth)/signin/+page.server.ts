import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { checkPassword } from '$lib/server/services/users';
import { startSession } from '$lib/server/session';
import { forAction } from '$lib/server/http';
import { safeNext } from '$lib/server/safe-redirect';
import { readForm } from '$lib/server/forms';

export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, safeNext(url.searchParams.get('next'), url.origin));
};

export const actions: Actions = {
	default: async (event) => {
		const form = await readForm(event.request);
		const email = form.text('email');
		const result = await forAction(() => checkPassword({ email, password: form.text('password') }, event.getClientAddress()), {
			email
		});
		if (!result.ok) return result.failure;
		await startSession(event.cookies, result.value.id);
		redirect(303, safeNext(event.url.searchParams.get('next'), event.url.origin));
	}
};
