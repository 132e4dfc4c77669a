/**
 * Per-level annotations of a Shelf entry: observed energy with uncertainty, assignment status
 * and a comment, with who changed them and when. Viewers read; editors write. An edit based on
 * an old version is refused (409), so two people cannot overwrite each other unknowingly.
 * Statuses follow the review rule of src/lib/review.ts (nobody confirms their own proposal).
 * Every change writes its history row (note-history.ts) and its activity log line in the
 * transaction of the change.
 */
import { and, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { levelAnnotations, users } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, conflict, notFound, ServiceError } from '../errors';
import { entryWarnings, readEntry } from './shelf';
import { logActivity, noteSummary, type Tx } from './activity';
import { recordNoteChange } from './note-history';
import { newId } from '../ids';
import { RecentMap } from '../recent';
import { annotationInputSchema, parseInput, reattachSchema } from '../validation';
import { parseConfiguration } from '../../physics/parse';
import { termSheet, type TermSheet } from '../../physics/report';
import { BudgetError } from '../../physics/budget';
import { levelKey, levelRefs, levelText } from '../../levels';
import { numberText } from '../../energyText';
import { reviewOutcome, type NoteChange } from '../../review';
import type { ActivityKind } from '../../activity';

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
	updatedBy: sql<string | null>`(select name from ${users} where ${users.id} = ${levelAnnotations.updatedBy})`,
	proposedById: levelAnnotations.proposedBy,
	proposedBy: sql<string | null>`(select name from ${users} where ${users.id} = ${levelAnnotations.proposedBy})`
};

type AnnotationRow = {
	observedEnergy: number | null;
	observedEnergyText: string | null;
	uncertainty: number | null;
	uncertaintyText: string | null;
};

/** Notes saved before the text was kept have only the number; their text is its shortest decimal. */
export function withTexts<R extends AnnotationRow>(a: R): R & { observedEnergyText: string | null; uncertaintyText: string | null } {
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

/**
 * Changes made through this module (detaching is done by a change of the entry's configuration, in shelf.ts;
 * copying and moving by shelf-transfer.ts, which logs the entry, not each note).
 */
type NoteEdit = Exclude<NoteChange, 'detached' | 'recorded' | 'copied' | 'moved'>;

/** The activity kind and the verb of its summary for a kind of note change. */
const NOTE_ACTIVITY: Record<NoteEdit, { kind: ActivityKind; verb: string }> = {
	created: { kind: 'note.saved', verb: 'added' },
	changed: { kind: 'note.saved', verb: 'changed' },
	reopened: { kind: 'note.saved', verb: 'changed' },
	confirmed: { kind: 'note.confirmed', verb: 'confirmed' },
	disputed: { kind: 'note.disputed', verb: 'disputed' },
	reattached: { kind: 'note.reattached', verb: 'reattached' },
	deleted: { kind: 'note.deleted', verb: 'deleted' }
};

type NoteRow = typeof levelAnnotations.$inferSelect;

/**
 * The history row and the activity line of one change to a note, with the transaction of the change.
 * `verb` replaces the summary's usual verb for the change ("pasted" instead of "added").
 */
export function recordChange(
	tx: Tx,
	actor: Actor,
	projectId: string,
	entry: { id: string; title: string },
	note: NoteRow,
	change: NoteEdit,
	verb = NOTE_ACTIVITY[change].verb
) {
	recordNoteChange(tx, projectId, note, change, actor);
	const { kind } = NOTE_ACTIVITY[change];
	const values = { observedEnergy: note.observedEnergyText ?? note.observedEnergy, uncertainty: note.uncertaintyText ?? note.uncertainty };
	const summary =
		change === 'deleted'
			? `deleted the note on ${levelText(note.levelKey)} of “${entry.title}”`
			: noteSummary(verb, levelText(note.levelKey), entry.title, {
					...values,
					status: change === 'reopened' ? 'proposed again: its values changed' : note.status
				});
	logActivity(tx, { projectId, actor, kind, summary, subject: `entry:${entry.id}` });
}

/** The digits a note holds (notes saved before the digits were kept: the shortest decimal of the number). */
export const digits = (value: number | null, text: string | null) => text ?? (value === null ? null : numberText(value));

/** A number as sent: its value and its digits as typed. */
type TypedNumber = { value: number; text: string };

/** The columns a note's save writes: observed energy and uncertainty with their digits, the comment, who and when. */
export function noteValues(
	energy: TypedNumber | null | undefined,
	uncertainty: TypedNumber | null | undefined,
	comment: string,
	actorId: string
) {
	return {
		observedEnergy: energy?.value ?? null,
		observedEnergyText: energy?.text ?? null,
		uncertainty: uncertainty?.value ?? null,
		uncertaintyText: uncertainty?.text ?? null,
		comment,
		updatedBy: actorId,
		updatedAt: new Date()
	};
}

type SavedValues = Pick<typeof levelAnnotations.$inferSelect, 'observedEnergy' | 'observedEnergyText' | 'uncertainty' | 'uncertaintyText'>;

/** Whether a save gives the note other values (by their digits) than it has; a new note always has new values. */
export const noteValuesChanged = (current: SavedValues | undefined, values: ReturnType<typeof noteValues>) =>
	!current ||
	digits(current.observedEnergy, current.observedEnergyText) !== values.observedEnergyText ||
	digits(current.uncertainty, current.uncertaintyText) !== values.uncertaintyText;

/**
 * Creates or changes the note on one level. The review rule (src/lib/review.ts) decides the
 * status: a new note cannot be confirmed (400); its proposer cannot confirm it (403); new values
 * make the saver the proposer and a confirmed note proposed again. The answer's `reopened` says
 * when that happened.
 */
export function saveAnnotation(actor: Actor, projectId: string, entryId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(annotationInputSchema, input);
	const entry = readEntry(projectId, entryId);
	checkKnownLevel(entry, data.levelKey);
	return db.transaction((tx) => {
		const current = tx.select().from(levelAnnotations).where(attachedOn(entryId, data.levelKey)).get();
		if (current && data.version === undefined)
			throw conflict(`The level ${levelText(data.levelKey)} already has a note; send the version you last read to change it`, {
				currentVersion: current.version
			});
		if (current && data.version !== current.version)
			throw conflict(
				`The note on ${levelText(data.levelKey)} was changed by someone else since you opened it (you had version ${data.version}, it is now ${current.version}); reload and edit again`,
				{ currentVersion: current.version }
			);
		const values = noteValues(data.observedEnergy, data.uncertainty, data.comment, actor.id);
		const review = reviewOutcome(current ?? null, data.status, noteValuesChanged(current, values), actor.id);
		if (!review.ok) throw new ServiceError(review.status, review.message, { field: 'status' });
		const reviewed = { status: review.status, proposedBy: review.proposedBy };
		if (!current) {
			tx.insert(levelAnnotations)
				.values({ id: newId(), entryId, levelKey: data.levelKey, ...values, ...reviewed })
				.run();
		} else {
			tx.update(levelAnnotations)
				.set({ ...values, ...reviewed, version: current.version + 1 })
				.where(eq(levelAnnotations.id, current.id))
				.run();
		}
		const saved = tx.select().from(levelAnnotations).where(attachedOn(entryId, data.levelKey)).get()!;
		recordChange(tx, actor, projectId, entry, saved, review.change);
		const note = withTexts(tx.select(annotationColumns).from(levelAnnotations).where(eq(levelAnnotations.id, saved.id)).get()!);
		return { ...note, reopened: review.reopened };
	});
}

/** Deletes the attached note on a level (`levelKey`); detached notes are deleted by id. */
export function deleteAnnotation(actor: Actor, projectId: string, entryId: string, levelKeyText: string) {
	projectAccess(actor, projectId, 'editor');
	const entry = readEntry(projectId, entryId);
	db.transaction((tx) => {
		const note = tx.select().from(levelAnnotations).where(attachedOn(entryId, levelKeyText)).get();
		if (!note) throw notFound(`No note on ${levelKeyText}`);
		tx.delete(levelAnnotations).where(eq(levelAnnotations.id, note.id)).run();
		recordChange(tx, actor, projectId, entry, note, 'deleted');
	});
}

function noteById(tx: Tx, entryId: string, annotationId: string) {
	const note = tx
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
	const entry = readEntry(projectId, entryId);
	db.transaction((tx) => {
		const note = noteById(tx, entryId, annotationId);
		tx.delete(levelAnnotations).where(eq(levelAnnotations.id, annotationId)).run();
		recordChange(tx, actor, projectId, entry, note, 'deleted');
	});
}

/**
 * Attaches a note (usually a detached one) to a level of the entry's present configuration.
 * Input: { levelKey, version } with the note's version as last read (409 when stale). Refused
 * (409) when that level already has an attached note: delete or move that one first.
 * Putting the note on a level is proposing that its energy belongs there, so the person who
 * reattaches becomes its proposer and a confirmed note is proposed again (src/lib/review.ts).
 */
export function reattachAnnotation(actor: Actor, projectId: string, entryId: string, annotationId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(reattachSchema, input);
	const entry = readEntry(projectId, entryId);
	checkKnownLevel(entry, data.levelKey);
	return db.transaction((tx) => {
		const note = noteById(tx, entryId, annotationId);
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
				status: note.status === 'confirmed' ? 'proposed' : note.status,
				proposedBy: actor.id,
				updatedBy: actor.id,
				updatedAt: new Date()
			})
			.where(eq(levelAnnotations.id, annotationId))
			.run();
		const saved = noteById(tx, entryId, annotationId);
		recordChange(tx, actor, projectId, entry, saved, 'reattached');
		return withTexts(tx.select(annotationColumns).from(levelAnnotations).where(eq(levelAnnotations.id, annotationId)).get()!);
	});
}
