import type { PageServerLoad } from './$types';
import { shelfPicks } from '$lib/server/services/shelf-picks';

/** The tool is public; a signed-in person also gets the configurations on the Shelves they can read. */
export const load: PageServerLoad = ({ locals }) => ({
	shelf: locals.user ? shelfPicks(locals.user) : null
});
