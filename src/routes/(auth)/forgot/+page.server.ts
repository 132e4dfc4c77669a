import type { Actions } from './$types';
import { RESET_REQUESTED, requestPasswordReset } from '$lib/server/services/password-reset';
import { forAction } from '$lib/server/http';

export const actions: Actions = {
	default: async (event) => {
		const email = String((await event.request.formData()).get('email') ?? '');
		const result = await forAction(() => requestPasswordReset(email, event.url.origin, event.getClientAddress()), { email });
		return result.ok ? { sent: RESET_REQUESTED } : result.failure;
	}
};
