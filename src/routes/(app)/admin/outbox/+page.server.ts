import type { PageServerLoad } from './$types';
import { requireSiteAdmin } from '$lib/server/access';
import { capturedMail, mailIsCaptured } from '$lib/server/mail';
import { forPage, requireUser } from '$lib/server/http';

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	forPage(() => requireSiteAdmin(user));
	return { captured: mailIsCaptured, mail: capturedMail() };
};
