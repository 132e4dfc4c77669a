/**
 * The Shelf as a searchable library: the list's query (text, species, tag, parity, open subshells,
 * sort, paging), the SQL conditions it becomes, and the columns derived from an entry's notation
 * (parity, open subshells) that let SQLite filter on the physics.
 *
 * The derived columns are written by every save of an entry (`libraryColumns`). Rows written
 * without them (before the migration that added them, or by code that inserts rows directly, as a
 * project restore does) hold null and are filled by `fillLibraryColumns` — at start-up for the whole
 * database, and before each list of a project for that project — so a filter never misses an entry.
 */
import { and, asc, desc, eq, gt, isNull, lt, or, sql, type SQL } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';
import { z } from 'zod';
import { db } from '../db';
import { shelfEntries } from '../db/schema';
import { badRequest } from '../errors';
import { parseInput } from '../validation';
import { MAX_N, openSubshells, parseConfiguration } from '../../physics/parse';
import { L_LETTERS, letterToL } from '../../physics/letters';

// ------------------------------------------------------------------ derived columns

/**
 * The parity and open subshells of a notation, as stored beside it. A notation the parser refuses
 * (saved before a parser change) gets parity '' and no open subshells: it matches no physics filter.
 * @example libraryColumns('[Ar] 3d6 4s') // { parity: 'even', openSubshells: ['3d', '4s'] }
 */
export function libraryColumns(notation: string): { parity: 'even' | 'odd' | ''; openSubshells: string[] } {
	try {
		const cfg = parseConfiguration(notation);
		return { parity: cfg.parity, openSubshells: openSubshells(cfg).map((s) => `${s.n}${L_LETTERS[s.l]}`) };
	} catch {
		return { parity: '', openSubshells: [] };
	}
}

/** Computes the derived columns of rows that lack them (one project, or all); returns how many were filled. */
export function fillLibraryColumns(projectId?: string): number {
	const rows = db
		.select({ id: shelfEntries.id, notation: shelfEntries.notation })
		.from(shelfEntries)
		.where(and(isNull(shelfEntries.openSubshells), projectId ? eq(shelfEntries.projectId, projectId) : undefined))
		.all();
	if (rows.length === 0) return 0;
	db.transaction((tx) => {
		for (const r of rows) tx.update(shelfEntries).set(libraryColumns(r.notation)).where(eq(shelfEntries.id, r.id)).run();
	});
	return rows.length;
}

// ------------------------------------------------------------------ the query

export const SHELF_SORTS = ['updated', 'title'] as const;
export type ShelfSort = (typeof SHELF_SORTS)[number];
const QUERY_PARAMS = ['q', 'species', 'tag', 'parity', 'open', 'sort', 'limit', 'cursor'];
/** At most this many subshells in one `open` filter. */
const MAX_OPEN_FILTER = 6;

/** A query parameter sent empty (`?species=`) means no filter, as when it is left out. */
const optional = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (v === '' ? undefined : v), schema.optional());

/**
 * Reads "4f" or "3d 4s" (spaces or commas between) into subshell labels, or says what is wrong.
 * @example readOpenSubshells('3d, 4s') // ['3d', '4s']
 */
export function readOpenSubshells(text: string): { ok: true; labels: string[] } | { ok: false; message: string } {
	const tokens = text.split(/[\s,]+/).filter(Boolean);
	if (tokens.length > MAX_OPEN_FILTER) return { ok: false, message: `open takes at most ${MAX_OPEN_FILTER} subshells, e.g. open=3d 4s` };
	const labels: string[] = [];
	for (const token of tokens) {
		const m = /^(\d{1,2})(\p{L})(\d*)$/u.exec(token);
		const l = m ? letterToL(m[2].toLowerCase()) : null;
		if (!m || l === null)
			return {
				ok: false,
				message: `"${token}" is not a subshell: write n and the l letter (${L_LETTERS.split('').join(' ')}), e.g. 4f or 3d 4s`
			};
		if (m[3])
			return { ok: false, message: `write "${m[1]}${m[2]}" without the occupancy: the filter finds entries where that subshell is open` };
		const n = Number(m[1]);
		if (n < 1 || n > MAX_N || l >= n)
			return { ok: false, message: `there is no ${n}${L_LETTERS[l]} subshell: l must be smaller than n, and n at most ${MAX_N}` };
		const label = `${n}${L_LETTERS[l]}`;
		if (!labels.includes(label)) labels.push(label);
	}
	return { ok: true, labels };
}

export const shelfQuerySchema = z.strictObject(
	{
		limit: optional(
			z.coerce
				.number({ error: 'limit must be a whole number from 1 to 200' })
				.int('limit must be a whole number from 1 to 200')
				.min(1, 'limit must be a whole number from 1 to 200')
				.max(200, 'limit must be a whole number from 1 to 200')
		).transform((v) => v ?? 50),
		cursor: optional(z.string().max(1000, 'cursor is not one this server gave out: send the nextCursor of the previous page')),
		q: optional(z.string().trim().max(100, 'the search text (q) must be at most 100 characters')),
		species: optional(z.string().trim().max(20, 'species must be at most 20 characters, e.g. Fe II')),
		tag: optional(z.string().trim().max(40, 'tag must be at most 40 characters')),
		parity: optional(z.enum(['even', 'odd'], { error: 'parity must be even or odd' })),
		open: optional(z.string().max(100, 'open must be at most 100 characters, e.g. 3d 4s')).transform((text, ctx) => {
			if (text === undefined) return [];
			const read = readOpenSubshells(text);
			if (read.ok) return read.labels;
			ctx.addIssue({ code: 'custom', message: read.message });
			return z.NEVER;
		}),
		sort: optional(z.enum(SHELF_SORTS, { error: 'sort must be updated (newest change first) or title (A to Z)' })).transform(
			(v): ShelfSort => v ?? 'updated'
		)
	},
	{
		error: (issue) =>
			issue.code === 'unrecognized_keys'
				? `unknown parameter ${issue.keys.join(', ')}: the Shelf list takes ${QUERY_PARAMS.join(', ')}`
				: undefined
	}
);

export type ShelfQuery = z.output<typeof shelfQuerySchema>;

export const readShelfQuery = (input: unknown): ShelfQuery => parseInput(shelfQuerySchema, input);

// ------------------------------------------------------------------ cursor (one per sort)

type Cursor = { sort: 'updated'; at: number; id: string } | { sort: 'title'; title: string; id: string };

export function encodeCursor(sort: ShelfSort, row: { updatedAt: Date; title: string; id: string }): string {
	const key = sort === 'updated' ? row.updatedAt.getTime() : row.title;
	return Buffer.from(JSON.stringify([sort, key, row.id])).toString('base64url');
}

const notOurs = () => badRequest('cursor is not one this server gave out: send the nextCursor of the previous page', { field: 'cursor' });

export function decodeCursor(cursor: string, sort: ShelfSort): Cursor {
	let value: unknown;
	try {
		value = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
	} catch {
		throw notOurs();
	}
	if (!Array.isArray(value) || value.length !== 3 || typeof value[2] !== 'string' || !/^[A-Za-z0-9_-]{1,64}$/.test(value[2]))
		throw notOurs();
	const [s, key, id] = value as [unknown, unknown, string];
	if (s !== sort)
		throw badRequest(`this cursor belongs to the list sorted by ${String(s)}, not by ${sort}: start again from the first page`, {
			field: 'cursor'
		});
	if (s === 'updated' && typeof key === 'number' && Number.isSafeInteger(key)) return { sort: s, at: key, id };
	if (s === 'title' && typeof key === 'string' && key.length <= 160) return { sort: s, title: key, id };
	throw notOurs();
}

// ------------------------------------------------------------------ SQL

/** `text` with % and _ taken literally, inside a LIKE pattern (case-insensitive for ASCII, as SQLite's LIKE). */
const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
const contains = (column: SQLiteColumn, q: string) => sql`${column} like ${likePattern(q)} escape '\\'`;
/** Some element (`value`) of the JSON array in `column` passes `test`. */
const arrayHas = (column: SQLiteColumn, test: SQL) => sql`exists (select 1 from json_each(${column}) where ${test})`;

const titleKey = sql`${shelfEntries.title} collate nocase`;

/** The conditions of the filters (not the cursor): used for the page and for the count of matches. */
export function filterConditions(projectId: string, f: ShelfQuery): SQL | undefined {
	return and(
		eq(shelfEntries.projectId, projectId),
		f.q
			? or(
					contains(shelfEntries.title, f.q),
					contains(shelfEntries.notes, f.q),
					contains(shelfEntries.species, f.q),
					contains(shelfEntries.notation, f.q),
					arrayHas(shelfEntries.tags, sql`value like ${likePattern(f.q)} escape '\\'`)
				)
			: undefined,
		f.species ? sql`${shelfEntries.species} = ${f.species} collate nocase` : undefined,
		f.tag ? arrayHas(shelfEntries.tags, sql`value = ${f.tag} collate nocase`) : undefined,
		f.parity ? eq(shelfEntries.parity, f.parity) : undefined,
		...f.open.map((label) => arrayHas(shelfEntries.openSubshells, sql`value = ${label}`))
	);
}

/** Rows after the cursor, in the order of its sort. */
export function afterCursor(c: Cursor): SQL | undefined {
	if (c.sort === 'updated') {
		const t = new Date(c.at);
		return or(lt(shelfEntries.updatedAt, t), and(eq(shelfEntries.updatedAt, t), lt(shelfEntries.id, c.id)));
	}
	return or(sql`${titleKey} > ${c.title}`, and(sql`${titleKey} = ${c.title}`, gt(shelfEntries.id, c.id)));
}

/** Newest change first (ties by id), or title A to Z ignoring ASCII case (ties by id): a total order, so pages never overlap. */
export const orderOf = (sort: ShelfSort): SQL[] =>
	sort === 'updated' ? [desc(shelfEntries.updatedAt), desc(shelfEntries.id)] : [asc(titleKey), asc(shelfEntries.id)];

/** The species and tags used in a project, for the list's filter menus. */
export function projectFacets(projectId: string): { species: string[]; tags: string[] } {
	const species = db
		.selectDistinct({ v: shelfEntries.species })
		.from(shelfEntries)
		.where(and(eq(shelfEntries.projectId, projectId), sql`${shelfEntries.species} <> ''`))
		.orderBy(shelfEntries.species)
		.all()
		.map((r) => r.v);
	const tags = db
		.all<{ v: string }>(
			sql`select distinct j.value as v from ${shelfEntries}, json_each(${shelfEntries.tags}) j
			where ${shelfEntries.projectId} = ${projectId} order by j.value collate nocase`
		)
		.map((r) => r.v);
	return { species, tags };
}
