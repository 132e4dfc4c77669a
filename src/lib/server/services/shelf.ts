/**
 * The Shelf: a project's saved configurations. Viewers read, editors write.
 * Updates carry the version the editor last read; a stale version is refused (409).
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { shelfEntries, users } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, conflict, notFound } from '../errors';
import { newId } from '../ids';
import { parseInput, shelfInputSchema, shelfPatchSchema } from '../validation';
import { changedFields, logActivity } from './activity';
import { ConfigurationError, parseConfiguration } from '../../physics/parse';
import { parseSpecies } from '../../physics/elements';
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

export function listEntries(actor: Actor, projectId: string) {
	projectAccess(actor, projectId, 'viewer');
	return db
		.select(entryColumns)
		.from(shelfEntries)
		.where(eq(shelfEntries.projectId, projectId))
		.orderBy(desc(shelfEntries.updatedAt))
		.all();
}

export function getEntry(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'viewer');
	return readEntry(projectId, entryId);
}

export function createEntry(actor: Actor, projectId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(shelfInputSchema, input);
	checkNotation(data.notation);
	checkSpecies(data.species);
	const id = newId();
	db.transaction((tx) => {
		tx.insert(shelfEntries)
			.values({ id, projectId, ...data, createdBy: actor.id, updatedBy: actor.id })
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.created',
			summary: `added “${data.title}” (${data.notation}) to the Shelf`,
			subject: `entry:${id}`
		});
	});
	return readEntry(projectId, id);
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
		db.update(shelfEntries)
			.set({ ...data, version: version + 1, updatedBy: actor.id, updatedAt: new Date() })
			.where(and(eq(shelfEntries.id, entryId), eq(shelfEntries.version, version)))
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.updated',
			summary: `changed ${changedFields(current, data)} of “${data.title ?? current.title}”`,
			subject: `entry:${entryId}`
		});
		return readEntry(projectId, entryId);
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
