import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { dev } from '$app/environment';
import { resolveSession } from '$lib/server/session';
import { handleServerError, withApiErrorShape } from '$lib/server/api-errors';
import { withSecurityHeaders } from '$lib/server/security-headers';
import { startCatcherWithApp } from '$lib/server/mail-catcher-start';
import { fillLibraryColumns } from '$lib/server/services/shelf-library';

export const handle: Handle = async ({ event, resolve }) => {
	await resolveSession(event);
	const response = await withApiErrorShape(event.url.pathname, await resolve(event));
	return withSecurityHeaders(response, event.url.protocol === 'https:');
};

export const handleError: HandleServerError = (input) => handleServerError(input);

/** Starts the local mail catcher with the app when it is wanted (MAIL_CATCHER=on, or `npm run dev`). */
/** Also fills the Shelf's derived columns (parity, open subshells) of rows saved before they existed. */
export const init: ServerInit = async () => {
	fillLibraryColumns();
	await startCatcherWithApp(dev);
};
