import { describe, expect, it } from 'vitest';
import { activeFilters, anyFilter, filterParams, filterSearch, NO_FILTERS, readFilters } from './filters';

// The URL form of the Shelf list's filters: the names are the API's (routes.ts, GET …/shelf). Common practice, no source.
describe('Shelf list filters in the URL', () => {
	it('reads back what it writes, so a reload shows the same list', () => {
		const f = { q: 'ground', species: 'Fe II', tag: 'iron group', parity: 'odd' as const, open: '3d 4s', sort: 'title' as const };
		expect(readFilters(new URLSearchParams(filterSearch(f)))).toEqual(f);
	});
	it('leaves blanks and the default sort out of the URL', () => {
		expect(filterSearch({ ...NO_FILTERS, q: '  ' })).toBe('');
		expect(filterSearch({ ...NO_FILTERS, species: 'Fe II' })).toBe('?species=Fe+II');
		expect(filterParams({ ...NO_FILTERS, tag: ' iron ', sort: 'updated' })).toEqual({ tag: 'iron' });
	});
	it('falls back to no parity and newest first for values it does not know', () => {
		const f = readFilters(new URLSearchParams('parity=both&sort=size'));
		expect(f.parity).toBe('');
		expect(f.sort).toBe('updated');
	});
	it('names the filters that narrow the list, and not the sort', () => {
		expect(anyFilter({ ...NO_FILTERS, sort: 'title' })).toBe(false);
		expect(activeFilters({ ...NO_FILTERS, q: 'ground', parity: 'odd', sort: 'title' })).toEqual([
			{ name: 'q', words: 'text “ground”' },
			{ name: 'parity', words: 'odd parity' }
		]);
	});
});
