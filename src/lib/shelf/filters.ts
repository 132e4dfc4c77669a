/**
 * The Shelf list's filters as the page keeps them in its URL (?q=&species=&tag=&parity=&open=&sort=),
 * so a reload or a shared link shows the same list. The server reads the same names
 * (GET /api/v1/projects/:projectId/shelf, services/shelf-library.ts) and says what is wrong with a value.
 * Imports nothing: used by the list component and its tests.
 */

export interface ShelfFilters {
	q: string;
	species: string;
	tag: string;
	parity: '' | 'even' | 'odd';
	open: string;
	sort: 'updated' | 'title';
}

export const NO_FILTERS: ShelfFilters = { q: '', species: '', tag: '', parity: '', open: '', sort: 'updated' };

const FILTER_NAMES = ['q', 'species', 'tag', 'parity', 'open'] as const;

/**
 * The filters of a URL's query; unknown values of parity and sort fall back to none and newest first.
 * @example readFilters(new URLSearchParams('tag=iron&sort=title')) // { ...NO_FILTERS, tag: 'iron', sort: 'title' }
 */
export function readFilters(search: URLSearchParams): ShelfFilters {
	const parity = search.get('parity');
	return {
		q: search.get('q') ?? '',
		species: search.get('species') ?? '',
		tag: search.get('tag') ?? '',
		parity: parity === 'even' || parity === 'odd' ? parity : '',
		open: search.get('open') ?? '',
		sort: search.get('sort') === 'title' ? 'title' : 'updated'
	};
}

/** The filters as API params: blanks left out, text trimmed (the default sort is left out too). */
export function filterParams(f: ShelfFilters): Record<string, string> {
	const out: Record<string, string> = {};
	for (const name of FILTER_NAMES) {
		const v = f[name].trim();
		if (v) out[name] = v;
	}
	if (f.sort !== 'updated') out.sort = f.sort;
	return out;
}

/**
 * The query string of the filters for the page's URL ('' when none), in a fixed order.
 * @example filterSearch({ ...NO_FILTERS, species: 'Fe II' }) // '?species=Fe+II'
 */
export function filterSearch(f: ShelfFilters): string {
	const query = new URLSearchParams(filterParams(f)).toString();
	return query ? `?${query}` : '';
}

/** True when some filter (not the sort) narrows the list. */
export const anyFilter = (f: ShelfFilters) => FILTER_NAMES.some((name) => f[name].trim() !== '');

/**
 * The filters that narrow the list, in words, with the name of each (to clear one):
 * @example activeFilters({ ...NO_FILTERS, q: 'ground', parity: 'odd' }) // [{ name: 'q', words: 'text “ground”' }, { name: 'parity', words: 'odd parity' }]
 */
export function activeFilters(f: ShelfFilters): { name: (typeof FILTER_NAMES)[number]; words: string }[] {
	const words: Record<(typeof FILTER_NAMES)[number], (v: string) => string> = {
		q: (v) => `text “${v}”`,
		species: (v) => `species ${v}`,
		tag: (v) => `tag “${v}”`,
		parity: (v) => `${v} parity`,
		open: (v) => `open ${v}`
	};
	return FILTER_NAMES.filter((name) => f[name].trim() !== '').map((name) => ({ name, words: words[name](f[name].trim()) }));
}
