import type { PageServerLoad } from './$types';
import { outboxForAdmin } from '$lib/server/services/outbox';
import { forPage, requireUser } from '$lib/server/http';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { mail: forPage(() => outboxForAdmin(user)) };
};
