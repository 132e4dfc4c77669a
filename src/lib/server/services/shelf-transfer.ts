/**
 * Duplicating a Shelf entry, and copying or moving it to another project, with its level notes.
 *
 * Who may do what (roles checked first, source project before target):
 * - duplicate (same project): editor of the project;
 * - copy to another project: viewer of the source (a copy only reads it; the source's log records
 *   that the entry was copied out) and editor of the target;
 * - move to another project: editor of both (it takes the entry out of the source).
 *
 * The notes, as a careful lab notebook keeps them:
 * - a copy is a new record. Each note is copied with its values, comment and proposer, and its
 *   history rows are copied before it, so the copy shows where its values came from; then one
 *   'copied' row. A confirmed note arrives as PROPOSED: a confirmation was given to the original
 *   in its own context and is not carried into a new one (no note is ever created as confirmed);
 *   the copied history still shows who confirmed the original and when. Proposed and disputed
 *   notes keep their status (a dispute is a caution that must travel with the values).
 *   Deleted notes' histories stay with the original only.
 * - a move keeps the very same records: the entry keeps its id, the notes their status and
 *   versions, every history row (deleted notes' included) follows it; each note gets one 'moved' row.
 * Everything — entry, notes, history, one activity row in each project concerned — is written in
 * ONE transaction, so a failure leaves both projects as they were.
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { levelAnnotationHistory, levelAnnotations, shelfEntries } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest } from '../errors';
import { newId } from '../ids';
import { parseInput } from '../validation';
import { logActivity, type Tx } from './activity';
import { recordNoteChange } from './note-history';
import { entryWarnings, readEntry } from './shelf';
import { listProjects } from './projects';

type NoteRow = typeof levelAnnotations.$inferSelect;

const targetSchema = z.object({
	projectId: z
		.string({ error: 'projectId must name the project to copy or move the entry to' })
		.trim()
		.min(1, 'choose the project to copy or move the entry to')
		.max(64, 'projectId is not a project id')
});

const TITLE_MAX = 160;
const copyTitle = (title: string) => {
	const suffix = ' (copy)';
	return (title.length + suffix.length > TITLE_MAX ? title.slice(0, TITLE_MAX - suffix.length - 1) + '…' : title) + suffix;
};
const notesWord = (n: number) => (n === 0 ? 'no notes' : n === 1 ? '1 level note' : `${n} level notes`);

/** The projects other than `exceptId` where the person may add entries (editor or owner), for the chooser. */
export function editableProjects(actor: Actor, exceptId: string) {
	return listProjects(actor)
		.filter((p) => p.id !== exceptId && p.role !== 'viewer')
		.map((p) => ({ id: p.id, name: p.name, role: p.role }));
}

/** Writes a copy of the entry `sourceId` (with its notes and their history) into `projectId`; returns the new id and note count. */
function copyInto(tx: Tx, sourceId: string, projectId: string, title: string, actor: Actor): { id: string; notes: number } {
	const source = tx.select().from(shelfEntries).where(eq(shelfEntries.id, sourceId)).get()!;
	const id = newId();
	const { id: _id, projectId: _p, version: _v, createdAt: _c, updatedAt: _u, createdBy: _cb, updatedBy: _ub, ...fields } = source;
	tx.insert(shelfEntries)
		.values({ ...fields, id, projectId, title, createdBy: actor.id, updatedBy: actor.id })
		.run();
	const notes = tx.select().from(levelAnnotations).where(eq(levelAnnotations.entryId, sourceId)).orderBy(asc(levelAnnotations.id)).all();
	const noteIds = notes.map((n) => n.id);
	const history = noteIds.length
		? tx
				.select()
				.from(levelAnnotationHistory)
				.where(and(eq(levelAnnotationHistory.entryId, sourceId), inArray(levelAnnotationHistory.annotationId, noteIds)))
				.orderBy(asc(levelAnnotationHistory.id))
				.all()
		: [];
	for (const note of notes) {
		const copyId = newId();
		for (const { id: _hid, ...row } of history.filter((h) => h.annotationId === note.id))
			tx.insert(levelAnnotationHistory)
				.values({ ...row, annotationId: copyId, entryId: id, projectId })
				.run();
		const copy: NoteRow = {
			...note,
			id: copyId,
			entryId: id,
			status: note.status === 'confirmed' ? 'proposed' : note.status,
			version: note.version + 1,
			updatedBy: actor.id,
			updatedAt: new Date()
		};
		tx.insert(levelAnnotations).values(copy).run();
		recordNoteChange(tx, projectId, copy, 'copied', actor);
	}
	return { id, notes: notes.length };
}

const answer = (projectId: string, entryId: string, notes: number) => {
	const entry = readEntry(projectId, entryId);
	return { entry: { ...entry, warnings: entryWarnings(entry) }, notes };
};

/** A copy of the entry in its own project, titled "… (copy)", with its notes (see the file comment). Editors. */
export function duplicateEntry(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'editor');
	const source = readEntry(projectId, entryId);
	const made = db.transaction((tx) => {
		const made = copyInto(tx, entryId, projectId, copyTitle(source.title), actor);
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.copied',
			summary: `duplicated “${source.title}” (${source.notation}) with ${notesWord(made.notes)}`,
			subject: `entry:${made.id}`
		});
		return made;
	});
	return answer(projectId, made.id, made.notes);
}

/** Checks both roles (source first) and reads the target; refuses the entry's own project. */
function readTransfer(actor: Actor, projectId: string, entryId: string, input: unknown, sourceRole: 'viewer' | 'editor') {
	const from = projectAccess(actor, projectId, sourceRole).project;
	const { projectId: targetId } = parseInput(targetSchema, input);
	const target = projectAccess(actor, targetId, 'editor').project;
	const source = readEntry(projectId, entryId);
	if (targetId === projectId)
		throw badRequest('The entry is already in this project: choose another project, or use Duplicate for a copy here', {
			field: 'projectId'
		});
	return { source, from, target };
}

/** A copy of the entry in another project, same title, with its notes (see the file comment). Viewer of the source, editor of the target. */
export function copyEntry(actor: Actor, projectId: string, entryId: string, input: unknown) {
	const { source, from, target } = readTransfer(actor, projectId, entryId, input, 'viewer');
	const made = db.transaction((tx) => {
		const made = copyInto(tx, entryId, target.id, source.title, actor);
		const what = `“${source.title}” (${source.notation}) with ${notesWord(made.notes)}`;
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.copied',
			summary: `copied ${what} to the project “${target.name}”`,
			subject: `entry:${entryId}`
		});
		logActivity(tx, {
			projectId: target.id,
			actor,
			kind: 'entry.copied',
			summary: `copied ${what} here from the project “${from.name}”`,
			subject: `entry:${made.id}`
		});
		return made;
	});
	return answer(target.id, made.id, made.notes);
}

/** Moves the entry, its notes and all their history to another project (see the file comment). Editor of both. */
export function moveEntry(actor: Actor, projectId: string, entryId: string, input: unknown) {
	const { source, from, target } = readTransfer(actor, projectId, entryId, input, 'editor');
	const notes = db.transaction((tx) => {
		tx.update(shelfEntries)
			.set({ projectId: target.id, version: source.version + 1, updatedBy: actor.id, updatedAt: new Date() })
			.where(eq(shelfEntries.id, entryId))
			.run();
		tx.update(levelAnnotationHistory).set({ projectId: target.id }).where(eq(levelAnnotationHistory.entryId, entryId)).run();
		const notes = tx.select().from(levelAnnotations).where(eq(levelAnnotations.entryId, entryId)).orderBy(asc(levelAnnotations.id)).all();
		for (const note of notes) recordNoteChange(tx, target.id, note, 'moved', actor);
		const what = `“${source.title}” (${source.notation}) with ${notesWord(notes.length)}`;
		logActivity(tx, {
			projectId,
			actor,
			kind: 'entry.moved',
			summary: `moved ${what} to the project “${target.name}”`,
			subject: `entry:${entryId}`
		});
		logActivity(tx, {
			projectId: target.id,
			actor,
			kind: 'entry.moved',
			summary: `moved ${what} here from the project “${from.name}”`,
			subject: `entry:${entryId}`
		});
		return notes.length;
	});
	return answer(target.id, entryId, notes);
}
