import type { Handle, HandleServerError } from '@sveltejs/kit';
import { resolveSession } from '$lib/server/session';
import { handleServerError, withApiErrorShape } from '$lib/server/api-errors';
import { withSecurityHeaders } from '$lib/server/security-headers';

export const handle: Handle = async ({ event, resolve }) => {
	await resolveSession(event);
	const response = await withApiErrorShape(event.url.pathname, await resolve(event));
	return withSecurityHeaders(response, event.url.protocol === 'https:');
};

export const handleError: HandleServerError = (input) => handleServerError(input);
