import type { LayoutServerLoad } from './$types';
import { outboxViewIsOn } from '$lib/server/mail';

export const load: LayoutServerLoad = ({ locals }) => ({
	user: locals.user ? { id: locals.user.id, name: locals.user.name, email: locals.user.email, siteRole: locals.user.siteRole } : null,
	/** Whether site admins see the Caught mail link (development and demo only). */
	outbox: locals.user?.siteRole === 'admin' && outboxViewIsOn()
});
