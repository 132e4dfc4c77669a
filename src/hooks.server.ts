import type { Handle } from '@sveltejs/kit';
import { resolveSession } from '$lib/server/session';

export const handle: Handle = async ({ event, resolve }) => {
	await resolveSession(event);
	return resolve(event);
};
