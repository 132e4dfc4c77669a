import type { Actions } from './$types';
import { requestPasswordReset } from '$lib/server/services/password-reset';
import { forAction } from '$lib/server/http';

export const actions: Actions = {
	default: async (event) => {
		const email = String((await event.request.formData()).get('email') ?? '');
		const result = await forAction(() => requestPasswordReset(email, event.url.origin), { email });
		return result.ok ? { sent: true } : result.failure;
	}
};
