import type { Actions } from './$types';
import { RESET_REQUESTED, requestPasswordReset } from '$lib/server/services/password-reset';
import { forAction } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

export const actions: Actions = {
	default: async (event) => {
		const email = (await readForm(event.request)).text('email');
		const result = await forAction(() => requestPasswordReset(email, event.url.origin, event.getClientAddress()), { email });
		return result.ok ? { sent: RESET_REQUESTED } : result.failure;
	}
};
