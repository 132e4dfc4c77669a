/**
 * The Shelf as a library: each filter alone and in combination, both sorts, paging that neither
 * repeats nor skips an entry under either sort (also when entries share a date or a title), the
 * counts, and a clear 400 for each bad parameter. Parities and open subshells are checked against
 * the general rules of the field: the parity of a configuration is (−1)^Σ l over its electrons
 * (Condon & Shortley 1935; Cowan 1981 sec. 4.1), and a subshell is open when it holds 0 < N < 2(2l+1)
 * electrons (Pauli principle). The product rules (who sees what) are common practice, no source.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { Actor } from './access';
import { db } from './db';
import { shelfEntries } from './db/schema';
import { newId } from './ids';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry, listEntries, updateEntry } from './services/shelf';
import { fillLibraryColumns, libraryColumns, readOpenSubshells } from './services/shelf-library';
import { statusOf, refusal } from './status-of';

let editor: Actor, viewer: Actor, stranger: Actor, projectId: string;

/** The invented entries of the test library (titles say what each is). */
const ENTRIES = [
	// 2p²: Σl = 2 → even; open 2p.
	{ title: 'carbon ground', species: 'C I', notation: '1s2 2s2 2p2', tags: ['nebula'], notes: 'forbidden pair' },
	// 2p³: Σl = 3 → odd; open 2p.
	{ title: 'Nitrogen ground', species: 'N I', notation: '1s2 2s2 2p3', tags: ['nebula', 'odd ones'], notes: '' },
	// 3d⁶4s: Σl = 12 → even; open 3d and 4s.
	{ title: 'iron ion', species: 'Fe II', notation: '[Ar] 3d6 4s', tags: ['iron group'], notes: 'many levels' },
	// 3d⁵4s4p: Σl = 11 → odd; open 3d, 4s, 4p.
	{ title: 'Iron ion, odd', species: 'Fe II', notation: '[Ar] 3d5 4s 4p', tags: ['iron group', 'odd ones'], notes: '' },
	// 4f⁴: Σl = 12 → even; open 4f.
	{ title: 'Neodymium', species: 'Nd III', notation: '[Xe] 4f4', tags: ['lanthanide'], notes: 'Hund ground disputed' },
	// 4f⁷6s²: Σl = 21 → odd; open 4f only (6s² is full).
	{ title: 'europium', species: 'Eu I', notation: '[Xe] 4f7 6s2', tags: ['lanthanide', 'odd ones'], notes: '' },
	// 2p⁵3p: Σl = 6 → even; open 2p and 3p.
	{ title: 'neon excited', species: 'Ne I', notation: '1s2 2s2 2p5 3p', tags: ['coupling'], notes: 'neither LS nor jj' }
];

const titles = (query: Record<string, string>) => listEntries(viewer, projectId, query).entries.map((e) => e.title);
const failure = (query: Record<string, string>) => refusal(() => listEntries(viewer, projectId, query));

beforeAll(async () => {
	editor = await signUp({ name: 'Lib Editor', email: 'lib-editor@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Lib Viewer', email: 'lib-viewer@example.org', password: 'long-enough-pw' });
	stranger = await signUp({ name: 'Lib Stranger', email: 'lib-stranger@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'Library' }).id;
	addMember(editor, projectId, { email: 'lib-viewer@example.org', role: 'viewer' });
	for (const e of ENTRIES) createEntry(editor, projectId, e);
	// Distinct, known update times (1 minute apart, the last entry newest), so the date sort is checkable.
	const all = db
		.select({ id: shelfEntries.id, title: shelfEntries.title })
		.from(shelfEntries)
		.where(eq(shelfEntries.projectId, projectId))
		.all();
	for (const row of all) {
		const i = ENTRIES.findIndex((e) => e.title === row.title);
		db.update(shelfEntries)
			.set({ updatedAt: new Date(Date.UTC(2026, 0, 1, 12, i)) })
			.where(eq(shelfEntries.id, row.id))
			.run();
	}
});

describe('derived columns', () => {
	it('parity (−1)^Σl and the open subshells of each notation', () => {
		expect(libraryColumns('1s2 2s2 2p2')).toEqual({ parity: 'even', openSubshells: ['2p'] });
		expect(libraryColumns('1s2 2s2 2p3')).toEqual({ parity: 'odd', openSubshells: ['2p'] });
		expect(libraryColumns('[Ar] 3d5 4s 4p')).toEqual({ parity: 'odd', openSubshells: ['3d', '4s', '4p'] });
		// 6s² and the [Xe] core are full, so only 4f is open.
		expect(libraryColumns('[Xe] 4f7 6s2')).toEqual({ parity: 'odd', openSubshells: ['4f'] });
		// A closed-shell configuration has no open subshell and is even (every full subshell has even l·N).
		expect(libraryColumns('1s2 2s2 2p6')).toEqual({ parity: 'even', openSubshells: [] });
		expect(libraryColumns('not a configuration')).toEqual({ parity: '', openSubshells: [] });
	});

	it('rows written without them (a restore, an old database) are filled before the list is read', () => {
		const p = createProject(editor, { name: 'Unfilled' }).id;
		db.insert(shelfEntries).values({ id: newId(), projectId: p, title: 'raw row', notation: '2p5 3d' }).run();
		expect(db.select().from(shelfEntries).where(eq(shelfEntries.projectId, p)).get()?.openSubshells).toBeNull();
		// 2p⁵3d: Σl = 5 + 2 = 7 → odd.
		expect(listEntries(editor, p, { parity: 'odd', open: '3d' }).entries.map((e) => e.title)).toEqual(['raw row']);
		expect(fillLibraryColumns(p)).toBe(0);
	});

	it('a change of configuration recomputes them', () => {
		const p = createProject(editor, { name: 'Changing' }).id;
		const e = createEntry(editor, p, { title: 'moving target', notation: '2p2' });
		expect(listEntries(editor, p, { parity: 'odd' }).entries).toHaveLength(0);
		updateEntry(editor, p, e.id, { notation: '2p 3s', version: e.version }); // 2p3s: Σl = 1 → odd
		expect(listEntries(editor, p, { parity: 'odd', open: '3s' }).entries.map((x) => x.title)).toEqual(['moving target']);
	});
});

describe('filters', () => {
	it('no filter: every entry, newest change first, with the counts', () => {
		const page = listEntries(viewer, projectId, {});
		expect(page.entries.map((e) => e.title)).toEqual(ENTRIES.map((e) => e.title).reverse());
		expect(page).toMatchObject({ matching: 7, total: 7, nextCursor: null });
		expect(page.facets.species).toEqual(['C I', 'Eu I', 'Fe II', 'N I', 'Nd III', 'Ne I']);
		expect(page.facets.tags).toEqual(['coupling', 'iron group', 'lanthanide', 'nebula', 'odd ones']);
	});

	it('text searches title, notes, species, configuration and tags, ignoring ASCII case', () => {
		expect(titles({ q: 'IRON' })).toEqual(['Iron ion, odd', 'iron ion']); // titles (and a tag)
		expect(titles({ q: 'disputed' })).toEqual(['Neodymium']); // notes
		expect(titles({ q: 'Nd III' })).toEqual(['Neodymium']); // species
		expect(titles({ q: '4f7' })).toEqual(['europium']); // configuration
		expect(titles({ q: 'coupl' })).toEqual(['neon excited']); // a tag
		expect(titles({ q: '50%' })).toEqual([]); // % is a character, not a wildcard
	});

	it('species, tag and parity each filter', () => {
		expect(titles({ species: 'fe ii' })).toEqual(['Iron ion, odd', 'iron ion']);
		expect(titles({ tag: 'Lanthanide' })).toEqual(['europium', 'Neodymium']);
		expect(titles({ tag: 'lanth' })).toEqual([]); // a tag matches whole
		expect(titles({ parity: 'odd' })).toEqual(['europium', 'Iron ion, odd', 'Nitrogen ground']);
		expect(titles({ parity: 'even' })).toEqual(['neon excited', 'Neodymium', 'iron ion', 'carbon ground']);
	});

	it('open subshells: every one given must be open (a full 6s² does not count)', () => {
		expect(titles({ open: '4f' })).toEqual(['europium', 'Neodymium']);
		expect(titles({ open: '3d 4s' })).toEqual(['Iron ion, odd', 'iron ion']);
		expect(titles({ open: '3d,4s, 4p' })).toEqual(['Iron ion, odd']);
		expect(titles({ open: '2p' })).toEqual(['neon excited', 'Nitrogen ground', 'carbon ground']);
		expect(titles({ open: '6s' })).toEqual([]);
	});

	it('filters combine (all must hold), and the count says how many match', () => {
		expect(titles({ tag: 'odd ones', parity: 'odd', open: '4f' })).toEqual(['europium']);
		expect(titles({ species: 'Fe II', parity: 'even' })).toEqual(['iron ion']);
		expect(titles({ tag: 'nebula', q: 'forbidden' })).toEqual(['carbon ground']);
		expect(titles({ tag: 'nebula', parity: 'odd', open: '3d' })).toEqual([]);
		const page = listEntries(viewer, projectId, { tag: 'odd ones', limit: '2' });
		expect(page).toMatchObject({ matching: 3, total: 7 });
		expect(page.entries).toHaveLength(2);
		// An empty parameter is no filter.
		expect(titles({ species: '', tag: '', parity: '', open: '' })).toHaveLength(7);
	});
});

describe('sort and paging', () => {
	/** Every page of a query, in order. */
	function allPages(query: Record<string, string>) {
		const seen: string[] = [];
		let cursor: string | undefined;
		let pages = 0;
		do {
			const page = listEntries(viewer, projectId, { ...query, ...(cursor ? { cursor } : {}) });
			seen.push(...page.entries.map((e) => e.title));
			cursor = page.nextCursor ?? undefined;
			pages++;
		} while (cursor && pages < 50);
		return { seen, pages };
	}

	it('title sorts A to Z ignoring ASCII case', () => {
		expect(titles({ sort: 'title' })).toEqual([
			'carbon ground',
			'europium',
			'iron ion',
			'Iron ion, odd',
			'Neodymium', // "neod" before "neon"
			'neon excited',
			'Nitrogen ground'
		]);
	});

	it('pages of 2 under each sort give each entry once, in the order of one big page', () => {
		for (const sort of ['updated', 'title']) {
			const { seen, pages } = allPages({ sort, limit: '2' });
			expect(pages).toBe(4);
			expect(seen).toEqual(titles({ sort }));
		}
		// With a filter as well.
		expect(allPages({ sort: 'title', limit: '1', tag: 'odd ones' }).seen).toEqual(['europium', 'Iron ion, odd', 'Nitrogen ground']);
	});

	it('paging stays stable when entries share an update time or a title (ties broken by id)', () => {
		const p = createProject(editor, { name: 'Ties' }).id;
		const same = new Date(Date.UTC(2026, 1, 1));
		for (let i = 0; i < 5; i++) {
			const e = createEntry(editor, p, { title: i % 2 ? 'Twin' : 'twin', notation: '2p2' });
			db.update(shelfEntries).set({ updatedAt: same }).where(eq(shelfEntries.id, e.id)).run();
		}
		for (const sort of ['updated', 'title']) {
			const ids: string[] = [];
			let cursor: string | undefined;
			do {
				const page = listEntries(editor, p, { sort, limit: '2', ...(cursor ? { cursor } : {}) });
				ids.push(...page.entries.map((e) => e.id));
				cursor = page.nextCursor ?? undefined;
			} while (cursor);
			expect(ids).toHaveLength(5);
			expect(new Set(ids).size).toBe(5);
		}
	});

	it('a cursor of one sort is refused under the other', () => {
		const next = listEntries(viewer, projectId, { sort: 'title', limit: '2' }).nextCursor!;
		expect(failure({ sort: 'updated', cursor: next })).toMatchObject({ status: 400, message: expect.stringMatching(/sorted by title/) });
	});
});

describe('bad parameters get a 400 saying what is allowed', () => {
	it.each([
		[{ parity: 'both' }, /parity must be even or odd/],
		[{ sort: 'species' }, /sort must be updated .* or title/],
		[{ open: '4x' }, /"4x" is not a subshell: write n and the l letter/],
		[{ open: '2d' }, /no 2d subshell: l must be smaller than n/],
		[{ open: '4f7' }, /without the occupancy/],
		[{ open: '1s 2s 2p 3s 3p 3d 4s' }, /at most 6 subshells/],
		[{ limit: '0' }, /limit must be a whole number from 1 to 200/],
		[{ limit: 'ten' }, /limit must be a whole number from 1 to 200/],
		[{ cursor: 'nonsense' }, /cursor is not one this server gave out/],
		[{ q: 'x'.repeat(101) }, /at most 100 characters/],
		[{ spcies: 'Fe II' }, /unknown parameter spcies: the Shelf list takes q, species, tag, parity, open, sort/]
	])('%j', (query, message) => {
		const f = failure(query as Record<string, string>);
		expect(f.status).toBe(400);
		expect(f.message).toMatch(message);
	});

	it('readOpenSubshells reads spaces and commas, upper-case letters and repeats', () => {
		expect(readOpenSubshells(' 3D, 4s  3d')).toEqual({ ok: true, labels: ['3d', '4s'] });
	});
});

describe('who may list', () => {
	it('a viewer lists; a non-member gets 404', () => {
		expect(statusOf(() => listEntries(viewer, projectId, { tag: 'nebula' }))).toBe('ok');
		expect(statusOf(() => listEntries(stranger, projectId, {}))).toBe(404);
		// The role is checked before the parameters: a non-member learns nothing from a bad query either.
		expect(statusOf(() => listEntries(stranger, projectId, { parity: 'both' }))).toBe(404);
	});
});
