/**
 * Per-level annotations of a Shelf entry: observed energy with uncertainty, assignment status
 * and a comment, with who changed them and when. Viewers read; editors write. An edit based on
 * an old version is refused (409), so two people cannot overwrite each other unknowingly.
 */
import { and, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { levelAnnotations, users } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, conflict, notFound, ServiceError } from '../errors';
import { readEntry } from './shelf';
import { logActivity, noteSummary } from './activity';
import { newId } from '../ids';
import { annotationInputSchema, parseInput } from '../validation';
import { parseConfiguration } from '../../physics/parse';
import { termSheet, type TermSheet } from '../../physics/report';
import { BudgetError } from '../../physics/budget';
import { levelKey, levelRefs, levelText } from '../../levels';

const annotationColumns = {
	id: levelAnnotations.id,
	levelKey: levelAnnotations.levelKey,
	observedEnergy: levelAnnotations.observedEnergy,
	uncertainty: levelAnnotations.uncertainty,
	status: levelAnnotations.status,
	comment: levelAnnotations.comment,
	version: levelAnnotations.version,
	updatedAt: levelAnnotations.updatedAt,
	updatedBy: sql<string | null>`(select name from ${users} where ${users.id} = ${levelAnnotations.updatedBy})`
};

/**
 * The Term sheet and level list of a stored entry. An entry saved before the engine's budgets
 * existed may be over them: that is answered with a clear 422 instead of running the computation.
 */
function entryLevels(entry: { notation: string }): { sheet: TermSheet; refs: ReturnType<typeof levelRefs> } {
	try {
		const sheet = termSheet(parseConfiguration(entry.notation));
		return { sheet, refs: levelRefs(sheet.terms) };
	} catch (e) {
		if (e instanceof BudgetError)
			throw new ServiceError(
				422,
				`The configuration ${entry.notation} of this entry is too large to show: ${e.message}. Edit the entry to a smaller configuration.`,
				{
					limit: e.limit
				}
			);
		throw e;
	}
}

function readAnnotations(entryId: string) {
	return db.select(annotationColumns).from(levelAnnotations).where(eq(levelAnnotations.entryId, entryId)).all();
}

export function listAnnotations(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'viewer');
	readEntry(projectId, entryId);
	return readAnnotations(entryId);
}

/** The entry's Term sheet with each level's annotation (or null), for the page and the exports. */
export function annotatedLevels(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'viewer');
	const entry = readEntry(projectId, entryId);
	const { sheet, refs } = entryLevels(entry);
	const notes = new Map(readAnnotations(entryId).map((a) => [a.levelKey, a]));
	const byTerm = new Map(sheet.terms.map((t) => [t.label, t]));
	const levels = refs.map((ref) => {
		const term = byTerm.get(ref.term)!;
		const level = term.levels.find((lv) => lv.J === ref.J)!;
		const key = levelKey(ref);
		return {
			key,
			...ref,
			multiplicity: term.multiplicity,
			letter: term.letter,
			count: Number(term.count), // at most MAX_ENTRY_LEVELS (levelRefs checks), so exact
			g: level.g,
			gDecimal: level.gDecimal,
			hundRank: term.hundRank,
			jRank: term.jOrder.indexOf(ref.J),
			// Occurrence k of a term is its k-th parentage path (the engine's order), so keys need no change.
			parentage: term.parentage?.[ref.occurrence - 1]?.label ?? null,
			annotation: notes.get(key) ?? null
		};
	});
	// Hund's heuristic order (ground level first), then occurrence, then J in the expected multiplet order.
	levels.sort((a, b) => a.hundRank - b.hundRank || a.occurrence - b.occurrence || a.jRank - b.jRank);
	return { entry, sheet, levels };
}

export function saveAnnotation(actor: Actor, projectId: string, entryId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(annotationInputSchema, input);
	const entry = readEntry(projectId, entryId);
	const known = new Set(entryLevels(entry).refs.map(levelKey));
	if (!known.has(data.levelKey))
		throw badRequest(
			`"${data.levelKey}" is not a level of ${entry.notation}; levels are named like term#occurrence|J, e.g. "${[...known][0]}"`,
			{
				field: 'levelKey'
			}
		);
	return db.transaction((tx) => {
		const current = tx
			.select()
			.from(levelAnnotations)
			.where(and(eq(levelAnnotations.entryId, entryId), eq(levelAnnotations.levelKey, data.levelKey)))
			.get();
		const values = {
			observedEnergy: data.observedEnergy,
			uncertainty: data.uncertainty,
			status: data.status,
			comment: data.comment,
			updatedBy: actor.id,
			updatedAt: new Date()
		};
		if (!current) {
			tx.insert(levelAnnotations)
				.values({ id: newId(), entryId, levelKey: data.levelKey, ...values })
				.run();
		} else {
			if (data.version !== undefined && data.version !== current.version)
				throw conflict(
					`The note on ${levelText(data.levelKey)} was changed by someone else since you opened it (you had version ${data.version}, it is now ${current.version}); reload and edit again`,
					{ currentVersion: current.version }
				);
			if (data.version === undefined)
				throw conflict(`The level ${levelText(data.levelKey)} already has a note; send the version you last read to change it`, {
					currentVersion: current.version
				});
			tx.update(levelAnnotations)
				.set({ ...values, version: current.version + 1 })
				.where(eq(levelAnnotations.id, current.id))
				.run();
		}
		const confirmed = data.status === 'confirmed' && current?.status !== 'confirmed';
		logActivity(tx, {
			projectId,
			actor,
			kind: confirmed ? 'note.confirmed' : 'note.saved',
			summary: noteSummary(confirmed ? 'confirmed' : current ? 'changed' : 'added', levelText(data.levelKey), entry.title, data),
			subject: `entry:${entryId}`
		});
		return tx
			.select(annotationColumns)
			.from(levelAnnotations)
			.where(and(eq(levelAnnotations.entryId, entryId), eq(levelAnnotations.levelKey, data.levelKey)))
			.get()!;
	});
}

export function deleteAnnotation(actor: Actor, projectId: string, entryId: string, levelKeyText: string) {
	projectAccess(actor, projectId, 'editor');
	const entry = readEntry(projectId, entryId);
	db.transaction((tx) => {
		const result = tx
			.delete(levelAnnotations)
			.where(and(eq(levelAnnotations.entryId, entryId), eq(levelAnnotations.levelKey, levelKeyText)))
			.run();
		if (result.changes === 0) throw notFound(`No note on ${levelKeyText}`);
		logActivity(tx, {
			projectId,
			actor,
			kind: 'note.deleted',
			summary: `deleted the note on ${levelText(levelKeyText)} of “${entry.title}”`,
			subject: `entry:${entryId}`
		});
	});
}
