import type { Actions, PageServerLoad } from './$types';
import { createToken, listTokens, revokeToken } from '$lib/server/services/tokens';
import { forAction, requireUser } from '$lib/server/http';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { tokens: listTokens(user) };
};

export const actions: Actions = {
	create: async (event) => {
		const user = requireUser(event);
		const name = String((await event.request.formData()).get('name') ?? '');
		const result = await forAction(() => createToken(user, name));
		return result.ok ? { secret: result.value.secret } : result.failure;
	},
	revoke: async (event) => {
		const user = requireUser(event);
		const id = String((await event.request.formData()).get('id') ?? '');
		const result = await forAction(() => revokeToken(user, id));
		return result.ok ? { revoked: true } : result.failure;
	}
};
