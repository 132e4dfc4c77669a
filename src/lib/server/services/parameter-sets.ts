/**
 * Parameter sets of a Shelf entry: named Slater and spin–orbit parameters (cm⁻¹) for the entry's
 * configuration, as the Energy solver takes them. Role rules as for level notes: viewers read,
 * editors write. Versioned like entries: a change or deletion sends the version it read, and a
 * stale one is refused (409). Every write logs its activity line in the same transaction.
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { parameterSets, users, type StoredEnergyParameters } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, conflict, notFound } from '../errors';
import { readEntry } from './shelf';
import { logActivity, type Tx } from './activity';
import { newId } from '../ids';
import { parseInput } from '../validation';
import { parameterSetInputSchema, parameterSetPatchSchema } from '../energy-validation';
import { parseConfiguration, asSubshells } from '../../physics/parse';
import { orbitalSet } from '../../physics/determinants';
import { resolveParameters } from '../../physics/slater-parameters';
import { InputError } from '../../physics/input-error';

const setColumns = {
	id: parameterSets.id,
	entryId: parameterSets.entryId,
	name: parameterSets.name,
	notation: parameterSets.notation,
	parameters: parameterSets.parameters,
	comment: parameterSets.comment,
	version: parameterSets.version,
	createdAt: parameterSets.createdAt,
	createdBy: sql<string | null>`(select name from ${users} where ${users.id} = ${parameterSets.createdBy})`,
	updatedAt: parameterSets.updatedAt,
	updatedBy: sql<string | null>`(select name from ${users} where ${users.id} = ${parameterSets.updatedBy})`
};

/**
 * Refuses (400) parameters that cannot occur in the configuration (an F^k of the wrong parity, an
 * unknown subshell, ζ of an s subshell…), in the engine's words, so a saved set always runs.
 */
export function checkParametersFor(notation: string, parameters: StoredEnergyParameters): void {
	try {
		const cfg = parseConfiguration(notation);
		resolveParameters(orbitalSet(cfg), asSubshells(cfg), parameters);
	} catch (e) {
		if (e instanceof RangeError || e instanceof InputError)
			throw badRequest(`These parameters do not fit ${notation}: ${e.message}`, { field: 'parameters' });
		throw e;
	}
}

function readSet(tx: Tx, entryId: string, setId: string) {
	const row = tx
		.select(setColumns)
		.from(parameterSets)
		.where(and(eq(parameterSets.id, setId), eq(parameterSets.entryId, entryId)))
		.get();
	if (!row) throw notFound('No such parameter set on this Shelf entry');
	return row;
}

/**
 * 409 for a stale version. The set as it is now travels with the refusal (`current`), so a page can show
 * what the other person saved beside what was typed, and nothing is overwritten unseen.
 */
const stale = (had: number, now: ReturnType<typeof readSet>) =>
	conflict(
		`This parameter set was changed by someone else${now.updatedBy ? ` (${now.updatedBy})` : ''} since you opened it: you had version ${had}, it is now version ${now.version}, named “${now.name}”. Nothing was changed; look at their values, then try again`,
		{ currentVersion: now.version, current: { name: now.name, comment: now.comment, version: now.version, updatedBy: now.updatedBy } }
	);

/** The activity line of a change: what changed, in words (a rename names both names). */
function changeSummary(before: { name: string }, data: { name?: string; parameters?: unknown; comment?: string }, entryTitle: string) {
	const renamed = data.name !== undefined && data.name !== before.name;
	const what = [data.parameters !== undefined ? 'values' : '', data.comment !== undefined ? 'comment' : ''].filter(Boolean).join(' and ');
	const of = `of “${entryTitle}”`;
	if (renamed && what) return `renamed the parameters “${before.name}” to “${data.name}” and changed their ${what} ${of}`;
	if (renamed) return `renamed the parameters “${before.name}” to “${data.name}” ${of}`;
	return `changed the ${what || 'record'} of the parameters “${before.name}” ${of}`;
}

/** The entry's parameter sets, most recently changed first. */
export function listParameterSets(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'viewer');
	readEntry(projectId, entryId);
	return db
		.select(setColumns)
		.from(parameterSets)
		.where(eq(parameterSets.entryId, entryId))
		.orderBy(desc(parameterSets.updatedAt), desc(parameterSets.id))
		.all();
}

export function getParameterSet(actor: Actor, projectId: string, entryId: string, setId: string) {
	projectAccess(actor, projectId, 'viewer');
	readEntry(projectId, entryId);
	return readSet(db, entryId, setId);
}

/** Saves a new set { name, parameters, comment? } for the entry's present configuration (editors). */
export function createParameterSet(actor: Actor, projectId: string, entryId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(parameterSetInputSchema, input);
	const entry = readEntry(projectId, entryId);
	checkParametersFor(entry.notation, data.parameters);
	const id = newId();
	return db.transaction((tx) => {
		tx.insert(parameterSets)
			.values({ id, entryId, ...data, notation: entry.notation, createdBy: actor.id, updatedBy: actor.id })
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'parameters.saved',
			summary: `saved the parameters “${data.name}” with “${entry.title}”`,
			subject: `entry:${entryId}`
		});
		return readSet(tx, entryId, id);
	});
}

/** Changes name, parameters or comment; `version` is the one you read (409 when stale). */
export function updateParameterSet(actor: Actor, projectId: string, entryId: string, setId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const { version, ...data } = parseInput(parameterSetPatchSchema, input);
	const entry = readEntry(projectId, entryId);
	return db.transaction((tx) => {
		const current = readSet(tx, entryId, setId);
		if (current.version !== version) throw stale(version, current);
		// A set keeps the configuration it was saved for; new values are checked against it.
		if (data.parameters) checkParametersFor(current.notation, data.parameters);
		tx.update(parameterSets)
			.set({ ...data, version: version + 1, updatedBy: actor.id, updatedAt: new Date() })
			.where(and(eq(parameterSets.id, setId), eq(parameterSets.version, version)))
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'parameters.saved',
			summary: changeSummary(current, data, entry.title),
			subject: `entry:${entryId}`
		});
		return readSet(tx, entryId, setId);
	});
}

/** Deletes a set; `version` as read (409 when stale). Fit reports made from it stay, without the link. */
export function deleteParameterSet(actor: Actor, projectId: string, entryId: string, setId: string, version: number) {
	projectAccess(actor, projectId, 'editor');
	if (!Number.isInteger(version))
		throw badRequest('version must be the version of the set you read, e.g. ?version=1', { field: 'version' });
	const entry = readEntry(projectId, entryId);
	db.transaction((tx) => {
		const current = readSet(tx, entryId, setId);
		if (current.version !== version) throw stale(version, current);
		tx.delete(parameterSets).where(eq(parameterSets.id, setId)).run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'parameters.deleted',
			summary: `deleted the parameters “${current.name}” of “${entry.title}”`,
			subject: `entry:${entryId}`
		});
	});
}
