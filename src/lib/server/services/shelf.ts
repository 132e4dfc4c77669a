/**
 * The Shelf: a project's saved configurations. Viewers read, editors write.
 * Updates carry the version the editor last read; a stale version is refused (409).
 */
import { and, eq, sql, type SQL } from 'drizzle-orm';
import { db } from '../db';
import { levelAnnotations, shelfEntries, users } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, conflict, notFound } from '../errors';
import { newId } from '../ids';
import { parseInput, shelfInputSchema, shelfPatchSchema } from '../validation';
import { changedFields, logActivity } from './activity';
import { recordNoteChange } from './note-history';
import {
	afterCursor,
	decodeCursor,
	encodeCursor,
	fillLibraryColumns,
	filterConditions,
	libraryColumns,
	orderOf,
	projectFacets,
	readShelfQuery
} from './shelf-library';
import { ConfigurationError, parseConfiguration } from '../../physics/parse';
import { parseSpecies, type Species } from '../../physics/elements';
import { checkElectrons, sameConfiguration } from '../../physics/implied';
import { BudgetError, checkTermSheetBudget, MAX_ENTRY_LEVELS } from '../../physics/budget';
import { microstateTotal } from '../../physics/microstates';
import { levelTotal } from '../../physics/terms';

/** Checks the notation with the term engine's parser; the text is stored as typed. */
function checkNotation(notation: string) {
	try {
		// The entry page lists every level of the Term sheet: both must fit the engine's budgets.
		const cfg = parseConfiguration(notation);
		checkTermSheetBudget(cfg.subshells, microstateTotal(cfg) <= BigInt(Number.MAX_SAFE_INTEGER));
		const levels = levelTotal(cfg);
		if (levels > BigInt(MAX_ENTRY_LEVELS))
			throw new BudgetError(
				`this configuration has ${levels} single levels, over the limit of ${MAX_ENTRY_LEVELS} for a Shelf entry`,
				Number(levels),
				MAX_ENTRY_LEVELS
			);
	} catch (e) {
		if (e instanceof ConfigurationError) throw badRequest(e.message, { field: 'notation', token: e.token });
		if (e instanceof BudgetError) throw badRequest(e.message, { field: 'notation', limit: e.limit });
		throw e;
	}
}

function checkSpecies(species: string) {
	if (!species) return;
	try {
		parseSpecies(species);
	} catch (e) {
		throw badRequest(e instanceof Error ? e.message : 'Species not understood', { field: 'species' });
	}
}

const entryColumns = {
	id: shelfEntries.id,
	projectId: shelfEntries.projectId,
	title: shelfEntries.title,
	species: shelfEntries.species,
	notation: shelfEntries.notation,
	notes: shelfEntries.notes,
	tags: shelfEntries.tags,
	version: shelfEntries.version,
	createdAt: shelfEntries.createdAt,
	updatedAt: shelfEntries.updatedAt,
	updatedBy: sql<string | null>`(select name from ${users} where ${users.id} = ${shelfEntries.updatedBy})`
};

/** An entry of this project, or 404. Callers check the role first. */
export function readEntry(projectId: string, entryId: string) {
	const row = db
		.select(entryColumns)
		.from(shelfEntries)
		.where(and(eq(shelfEntries.id, entryId), eq(shelfEntries.projectId, projectId)))
		.get();
	if (!row) throw notFound('No such Shelf entry in this project');
	return row;
}

const speciesOrNull = (text: string): Species | null => {
	if (!text) return null;
	try {
		return parseSpecies(text);
	} catch {
		return null;
	}
};

/**
 * Warnings about an entry that do not stop it being saved: the species and the configuration
 * disagree on the number of electrons (counting the closed subshells the notation implies).
 */
export function entryWarnings(entry: { species: string; notation: string }): string[] {
	const species = speciesOrNull(entry.species);
	if (!species) return [];
	try {
		const warning = checkElectrons(species, parseConfiguration(entry.notation)).warning;
		return warning ? [warning] : [];
	} catch {
		return [];
	}
}

/**
 * Whether changing an entry from `before` to `after` keeps its configuration: the notations
 * are compared as parsed configurations with their implied closed subshells (physics/implied.ts),
 * not as typed text, so "2p2" → "[He] 2s2 2p2" keeps the levels and "2p2" → "2p4" does not.
 */
export function keepsConfiguration(before: { species: string; notation: string }, after: { species: string; notation: string }): boolean {
	if (before.notation === after.notation) return true;
	let next;
	try {
		next = parseConfiguration(after.notation);
	} catch {
		return true; // not a configuration: the edit is refused by checkNotation, and nothing is detached
	}
	try {
		return sameConfiguration(parseConfiguration(before.notation), next, speciesOrNull(before.species), speciesOrNull(after.species));
	} catch {
		return false;
	}
}

/** The notes of an entry that are attached to a level (and so would be detached by a configuration change). */
function attachedNoteCount(entryId: string): number {
	return db
		.select({ n: sql<number>`count(*)` })
		.from(levelAnnotations)
		.where(and(eq(levelAnnotations.entryId, entryId), eq(levelAnnotations.detached, false)))
		.get()!.n;
}

/**
 * How many notes a change of configuration would detach (0 when the configuration stays the same),
 * so that a page can ask before saving. Viewers may ask; only editors can save.
 */
export function notesDetachedBy(actor: Actor, projectId: string, entryId: string, change: { notation: string; species?: string }): number {
	projectAccess(actor, projectId, 'viewer');
	const current = readEntry(projectId, entryId);
	const after = { notation: change.notation, species: change.species ?? current.species };
	return keepsConfiguration(current, after) ? 0 : attachedNoteCount(entryId);
}

/**
 * One page of the Shelf as a library: `limit` entries (1 … 200, default 50) after `cursor` (the
 * `nextCursor` of the page before, for the same sort), filtered by text `q` (title, notes, species,
 * configuration, tags), `species`, `tag`, `parity` (even, odd) and `open` subshells ("3d 4s": all
 * open), sorted by `sort` = updated (newest change first, the default) or title (A to Z).
 * `matching` counts the entries the filters let through, `total` those of the project; `facets`
 * lists the species and tags in use. `nextCursor` is null on the last page.
 */
export function listEntries(actor: Actor, projectId: string, query: unknown = {}) {
	projectAccess(actor, projectId, 'viewer');
	const f = readShelfQuery(query);
	const after = f.cursor ? decodeCursor(f.cursor, f.sort) : null;
	fillLibraryColumns(projectId);
	const where = filterConditions(projectId, f);
	const rows = db
		.select(entryColumns)
		.from(shelfEntries)
		.where(and(where, after ? afterCursor(after) : undefined))
		.orderBy(...orderOf(f.sort))
		.limit(f.limit + 1)
		.all();
	const page = rows.slice(0, f.limit);
	const last = page[page.length - 1];
	const count = (w: SQL | undefined) =>
		db
			.select({ n: sql<number>`count(*)` })
			.from(shelfEntries)
			.where(w)
			.get()!.n;
	return {
		entries: page,
		nextCursor: rows.length > f.limit && last ? encodeCursor(f.sort, last) : null,
		matching: count(where),
		total: count(eq(shelfEntries.projectId, projectId)),
		facets: projectFacets(projectId)
	};
}

export function getEntry(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'viewer');
	const entry = readEntry(projectId, entryId);
	return { ...entry, warnings: entryWarnings(entry) };
}

export function createEntry(actor: Actor, projectId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(shelfInputSchema, input);
	checkNotation(data.notation);
	checkSpecies(data.species);
	const id = newId();
	db.transaction((tx) => {
		tx.insert(shelfEntries)
			.values({ id, projectId, ...data, ...libraryColumns(data.notation), createdBy: actor.id, updatedBy: actor.id })
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.created',
			summary: `added “${data.title}” (${data.notation}) to the Shelf`,
			subject: `entry:${id}`
		});
	});
	const entry = readEntry(projectId, id);
	return { ...entry, warnings: entryWarnings(entry) };
}

export function updateEntry(actor: Actor, projectId: string, entryId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const { version, ...data } = parseInput(shelfPatchSchema, input);
	if (data.notation !== undefined) checkNotation(data.notation);
	if (data.species !== undefined) checkSpecies(data.species);
	return db.transaction((tx) => {
		const current = readEntry(projectId, entryId);
		if (current.version !== version)
			throw conflict(
				`This entry was changed by ${current.updatedBy ?? 'someone'} since you opened it (you had version ${version}, it is now ${current.version}); reload to see their change, then edit again`,
				{ currentVersion: current.version }
			);
		// A different configuration: every attached note is kept but detached until someone
		// reattaches it to a level of the new configuration or deletes it (never hidden or moved).
		const after = { notation: data.notation ?? current.notation, species: data.species ?? current.species };
		// Each detached note's history records it (note-history.ts).
		const detached = keepsConfiguration(current, after)
			? []
			: tx
					.update(levelAnnotations)
					.set({ detached: true, detachedFrom: current.notation })
					.where(and(eq(levelAnnotations.entryId, entryId), eq(levelAnnotations.detached, false)))
					.returning()
					.all();
		for (const note of detached) recordNoteChange(tx, projectId, note, 'detached', actor);
		const detachedNotes = detached.length;
		db.update(shelfEntries)
			.set({
				...data,
				...(data.notation !== undefined ? libraryColumns(data.notation) : {}),
				version: version + 1,
				updatedBy: actor.id,
				updatedAt: new Date()
			})
			.where(and(eq(shelfEntries.id, entryId), eq(shelfEntries.version, version)))
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.updated',
			summary: `changed ${changedFields(current, data)} of “${data.title ?? current.title}”${detachedNotes ? ` (${detachedNotes} level note${detachedNotes === 1 ? '' : 's'} detached)` : ''}`,
			subject: `entry:${entryId}`
		});
		const entry = readEntry(projectId, entryId);
		return { ...entry, warnings: entryWarnings(entry), detachedNotes };
	});
}

export function deleteEntry(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'editor');
	db.transaction((tx) => {
		const entry = readEntry(projectId, entryId);
		tx.delete(shelfEntries).where(eq(shelfEntries.id, entryId)).run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.deleted',
			summary: `deleted “${entry.title}” (${entry.notation})`,
			subject: `entry:${entryId}`
		});
	});
}
