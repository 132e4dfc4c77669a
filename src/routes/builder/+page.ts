import type { PageLoad } from './$types';

export const ssr = true;

/** `/builder?config=3d5 4s&gs=free` prefills the Builder; the Term sheet itself is fetched in the browser. */
export const load: PageLoad = ({ url }) => ({
	config: (url.searchParams.get('config') ?? '').slice(0, 200),
	gs: url.searchParams.get('gs') === 'free' ? ('free' as const) : ('exact' as const)
});
