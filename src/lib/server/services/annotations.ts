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
import { entryWarnings, readEntry } from './shelf';
import { logActivity, noteSummary } from './activity';
import { newId } from '../ids';
import { RecentMap } from '../recent';
import { annotationInputSchema, parseInput, reattachSchema } from '../validation';
import { parseConfiguration } from '../../physics/parse';
import { termSheet, type TermSheet } from '../../physics/report';
import { BudgetError } from '../../physics/budget';
import { levelKey, levelRefs, levelText } from '../../levels';
import { numberText } from '../../energyText';

const annotationColumns = {
	id: levelAnnotations.id,
	levelKey: levelAnnotations.levelKey,
	observedEnergy: levelAnnotations.observedEnergy,
	observedEnergyText: levelAnnotations.observedEnergyText,
	uncertainty: levelAnnotations.uncertainty,
	uncertaintyText: levelAnnotations.uncertaintyText,
	status: levelAnnotations.status,
	comment: levelAnnotations.comment,
	detached: levelAnnotations.detached,
	detachedFrom: levelAnnotations.detachedFrom,
	version: levelAnnotations.version,
	updatedAt: levelAnnotations.updatedAt,
	updatedBy: sql<string | null>`(select name from ${users} where ${users.id} = ${levelAnnotations.updatedBy})`
};

type AnnotationRow = {
	observedEnergy: number | null;
	observedEnergyText: string | null;
	uncertainty: number | null;
	uncertaintyText: string | null;
};

/** Notes saved before the text was kept have only the number; their text is its shortest decimal. */
function withTexts<R extends AnnotationRow>(a: R): R & { observedEnergyText: string | null; uncertaintyText: string | null } {
	return {
		...a,
		observedEnergyText: a.observedEnergyText ?? (a.observedEnergy === null ? null : numberText(a.observedEnergy)),
		uncertaintyText: a.uncertaintyText ?? (a.uncertainty === null ? null : numberText(a.uncertainty))
	};
}

/**
 * The Term sheet and level list of a stored entry. An entry saved before the engine's budgets
 * existed may be over them: that is answered with a clear 422 instead of running the computation.
 */
type EntryLevels = { sheet: TermSheet; refs: ReturnType<typeof levelRefs> };

/** Term sheets of recently opened entries: every page view, note save and export of an entry needs one. */
const recentSheets = new RecentMap<EntryLevels>(64);

function entryLevels(entry: { notation: string }): EntryLevels {
	const hit = recentSheets.get(entry.notation);
	if (hit) return hit;
	try {
		const sheet = termSheet(parseConfiguration(entry.notation));
		const levels = { sheet, refs: levelRefs(sheet.terms) };
		recentSheets.set(entry.notation, levels);
		return levels;
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
	return db
		.select(annotationColumns)
		.from(levelAnnotations)
		.where(eq(levelAnnotations.entryId, entryId))
		.orderBy(levelAnnotations.levelKey)
		.all()
		.map(withTexts);
}

/** The attached note on a level, if any (a detached note with the same key does not count). */
const attachedOn = (entryId: string, key: string) =>
	and(eq(levelAnnotations.entryId, entryId), eq(levelAnnotations.levelKey, key), eq(levelAnnotations.detached, false));

function checkKnownLevel(entry: { notation: string }, key: string) {
	const known = new Set(entryLevels(entry).refs.map(levelKey));
	if (!known.has(key))
		throw badRequest(`"${key}" is not a level of ${entry.notation}; levels are named like term#occurrence|J, e.g. "${[...known][0]}"`, {
			field: 'levelKey'
		});
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
	const all = readAnnotations(entryId);
	const notes = new Map(all.filter((a) => !a.detached).map((a) => [a.levelKey, a]));
	// Notes written for an earlier configuration: kept and shown apart until reattached or deleted.
	const detached = all.filter((a) => a.detached);
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
	return { entry, sheet, levels, detached, warnings: entryWarnings(entry) };
}

export function saveAnnotation(actor: Actor, projectId: string, entryId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(annotationInputSchema, input);
	const entry = readEntry(projectId, entryId);
	checkKnownLevel(entry, data.levelKey);
	return db.transaction((tx) => {
		const current = tx.select().from(levelAnnotations).where(attachedOn(entryId, data.levelKey)).get();
		const values = {
			observedEnergy: data.observedEnergy?.value ?? null,
			observedEnergyText: data.observedEnergy?.text ?? null,
			uncertainty: data.uncertainty?.value ?? null,
			uncertaintyText: data.uncertainty?.text ?? null,
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
		return withTexts(tx.select(annotationColumns).from(levelAnnotations).where(attachedOn(entryId, data.levelKey)).get()!);
	});
}

/** Deletes the attached note on a level (`levelKey`); detached notes are deleted by id. */
export function deleteAnnotation(actor: Actor, projectId: string, entryId: string, levelKeyText: string) {
	projectAccess(actor, projectId, 'editor');
	const entry = readEntry(projectId, entryId);
	db.transaction((tx) => {
		const result = tx.delete(levelAnnotations).where(attachedOn(entryId, levelKeyText)).run();
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

function noteById(entryId: string, annotationId: string) {
	const note = db
		.select()
		.from(levelAnnotations)
		.where(and(eq(levelAnnotations.id, annotationId), eq(levelAnnotations.entryId, entryId)))
		.get();
	if (!note) throw notFound('No such note on this Shelf entry');
	return note;
}

/** Deletes one note (attached or detached) by its id. */
export function deleteAnnotationById(actor: Actor, projectId: string, entryId: string, annotationId: string) {
	projectAccess(actor, projectId, 'editor');
	readEntry(projectId, entryId);
	noteById(entryId, annotationId);
	db.delete(levelAnnotations).where(eq(levelAnnotations.id, annotationId)).run();
}

/**
 * Attaches a note (usually a detached one) to a level of the entry's present configuration.
 * Input: { levelKey, version } with the note's version as last read (409 when stale). Refused
 * (409) when that level already has an attached note: delete or move that one first.
 */
export function reattachAnnotation(actor: Actor, projectId: string, entryId: string, annotationId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(reattachSchema, input);
	const entry = readEntry(projectId, entryId);
	checkKnownLevel(entry, data.levelKey);
	return db.transaction((tx) => {
		const note = noteById(entryId, annotationId);
		if (note.version !== data.version)
			throw conflict(
				`This note was changed by someone else since you opened it (you had version ${data.version}, it is now ${note.version}); reload and try again`,
				{ currentVersion: note.version }
			);
		const occupied = tx.select({ id: levelAnnotations.id }).from(levelAnnotations).where(attachedOn(entryId, data.levelKey)).get();
		if (occupied && occupied.id !== annotationId)
			throw conflict(`${levelText(data.levelKey)} already has a note; delete it or attach this note to another level`, {
				field: 'levelKey'
			});
		tx.update(levelAnnotations)
			.set({
				levelKey: data.levelKey,
				detached: false,
				detachedFrom: null,
				version: note.version + 1,
				updatedBy: actor.id,
				updatedAt: new Date()
			})
			.where(eq(levelAnnotations.id, annotationId))
			.run();
		return withTexts(tx.select(annotationColumns).from(levelAnnotations).where(eq(levelAnnotations.id, annotationId)).get()!);
	});
}
