/**
 * The history of level notes: every change to a note (created, changed, confirmed, disputed,
 * proposed again, reattached, detached, deleted) writes one row with the note's fields after the
 * change, who and when, in the transaction of the change itself — like the activity log, so a
 * change that rolls back leaves no history row. Viewers read a note's history; it outlives the
 * note (a deleted note's history stays readable by its id until the entry is deleted).
 * The project backup carries it as the `noteHistory` section (below).
 * Rows are found through their entry (joined to its project), so they follow an entry that moves
 * to another project; `project_id` is kept for the cascade and should move with it.
 */
import { and, asc, eq, notExists } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { levelAnnotationHistory, levelAnnotations, shelfEntries, users, ASSIGNMENT_STATUSES } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { notFound } from '../errors';
import { newId } from '../ids';
import type { Tx } from './activity';
import type { BackupSection } from './backup';
import { NOTE_CHANGE_NAMES, type NoteChange } from '../../review';

type NoteRow = typeof levelAnnotations.$inferSelect;

/**
 * Writes the history row of one change with `tx`, the transaction of the change; `note` is the
 * note as it is after the change (for a deletion: as it was).
 */
export function recordNoteChange(tx: Tx, projectId: string, note: NoteRow, change: NoteChange, actor: Pick<Actor, 'id' | 'name'>) {
	const { id, updatedBy: _by, updatedAt: _at, ...fields } = note;
	tx.insert(levelAnnotationHistory)
		// The time in milliseconds, as the note's own updatedAt (the column's default keeps whole seconds only).
		.values({ ...fields, annotationId: id, projectId, change, actorId: actor.id, actorName: actor.name, createdAt: new Date() })
		.run();
}

const historyColumns = {
	id: levelAnnotationHistory.id,
	change: levelAnnotationHistory.change,
	levelKey: levelAnnotationHistory.levelKey,
	observedEnergyText: levelAnnotationHistory.observedEnergyText,
	uncertaintyText: levelAnnotationHistory.uncertaintyText,
	status: levelAnnotationHistory.status,
	comment: levelAnnotationHistory.comment,
	detached: levelAnnotationHistory.detached,
	detachedFrom: levelAnnotationHistory.detachedFrom,
	version: levelAnnotationHistory.version,
	proposedBy: users.name,
	actorName: levelAnnotationHistory.actorName,
	createdAt: levelAnnotationHistory.createdAt
};

/**
 * Every change of one note of an entry, oldest first. Viewers and up; a note id this entry never
 * had is a 404. The energies are the digits as typed (history rows are written with them).
 */
export function noteHistory(actor: Actor, projectId: string, entryId: string, annotationId: string) {
	projectAccess(actor, projectId, 'viewer');
	const rows = db
		.select(historyColumns)
		.from(levelAnnotationHistory)
		.innerJoin(shelfEntries, and(eq(shelfEntries.id, levelAnnotationHistory.entryId), eq(shelfEntries.projectId, projectId)))
		.leftJoin(users, eq(users.id, levelAnnotationHistory.proposedBy))
		.where(and(eq(levelAnnotationHistory.entryId, entryId), eq(levelAnnotationHistory.annotationId, annotationId)))
		.orderBy(asc(levelAnnotationHistory.id))
		.all();
	if (rows.length === 0) throw notFound('No such note on this Shelf entry of this project (nor a deleted one)');
	return rows;
}

/**
 * Gives every note of a project that has no history yet a first row, 'recorded': its state now,
 * by the last person who changed it, at that time — as the migration did for notes older than the
 * history. Used by the import for files without history (format 1) and notes the file's history
 * leaves out, so every note's History has something to show.
 */
export function recordUntrackedNotes(tx: Tx, projectId: string) {
	const untracked = tx
		.select({ note: levelAnnotations, actorName: users.name })
		.from(levelAnnotations)
		.innerJoin(shelfEntries, and(eq(shelfEntries.id, levelAnnotations.entryId), eq(shelfEntries.projectId, projectId)))
		.leftJoin(users, eq(users.id, levelAnnotations.updatedBy))
		.where(
			notExists(
				tx
					.select({ id: levelAnnotationHistory.id })
					.from(levelAnnotationHistory)
					.where(eq(levelAnnotationHistory.annotationId, levelAnnotations.id))
			)
		)
		.orderBy(asc(levelAnnotations.updatedAt))
		.all();
	for (const { note, actorName } of untracked) {
		const { id, updatedBy, updatedAt, ...fields } = note;
		tx.insert(levelAnnotationHistory)
			.values({
				...fields,
				annotationId: id,
				projectId,
				change: 'recorded',
				actorId: updatedBy,
				actorName: actorName ?? 'someone',
				createdAt: updatedAt
			})
			.run();
	}
}

// ------------------------------------------------------------------------------------------ backup

const text = (max: number) => z.string().max(max, `must be at most ${max} characters`);
const email = z.string().max(254).nullable();

const historyRowSchema = z.strictObject({
	/** The note's id on the server that wrote the file (`ref` of a level note; a deleted note has none left). */
	note: text(64),
	/** The entry's `ref`. */
	entry: text(64),
	levelKey: text(80),
	observedEnergy: z.number().finite().nullable(),
	observedEnergyText: text(40).nullable(),
	uncertainty: z.number().finite().nonnegative().nullable(),
	uncertaintyText: text(40).nullable(),
	status: z.enum(ASSIGNMENT_STATUSES),
	comment: text(10000),
	detached: z.boolean(),
	detachedFrom: text(200).nullable(),
	version: z.number().int().positive(),
	proposedBy: email,
	change: z.enum(NOTE_CHANGE_NAMES as [NoteChange, ...NoteChange[]]),
	actor: email,
	actorName: text(200),
	createdAt: z.iso.datetime({ offset: true, error: 'must be a date and time in ISO 8601 form' }).transform((s) => new Date(s))
});

/**
 * The project's note history in the backup file, oldest first. People travel by e-mail; note and
 * entry ids are those of the writing server and are mapped to the new ones on restore (a deleted
 * note's rows keep one new id between them).
 */
export const noteHistorySection: BackupSection<z.output<typeof historyRowSchema>[]> = {
	key: 'noteHistory',
	label: 'level note histories',
	schema: z.array(historyRowSchema),
	dump(ctx) {
		const rows = db
			.select({ r: levelAnnotationHistory })
			.from(levelAnnotationHistory)
			.innerJoin(shelfEntries, and(eq(shelfEntries.id, levelAnnotationHistory.entryId), eq(shelfEntries.projectId, ctx.projectId)))
			.orderBy(asc(levelAnnotationHistory.id))
			.all()
			.map(({ r }) => r);
		// Dates stay Date objects here: JSON.stringify writes them in ISO 8601, as the schema reads them.
		return rows.map((r) => ({
			note: r.annotationId,
			entry: r.entryId,
			levelKey: r.levelKey,
			observedEnergy: r.observedEnergy,
			observedEnergyText: r.observedEnergyText,
			uncertainty: r.uncertainty,
			uncertaintyText: r.uncertaintyText,
			status: r.status,
			comment: r.comment,
			detached: r.detached,
			detachedFrom: r.detachedFrom,
			version: r.version,
			proposedBy: ctx.emailOf(r.proposedBy),
			change: r.change,
			actor: ctx.emailOf(r.actorId),
			actorName: r.actorName,
			createdAt: r.createdAt
		}));
	},
	restore(tx, rows, ctx) {
		for (const r of rows) {
			const entryId = ctx.entryIds.get(r.entry);
			if (!entryId) throw new Error(`history row of an entry (${r.entry}) that is not in the file`);
			let annotationId = ctx.noteIds.get(r.note);
			if (!annotationId) ctx.noteIds.set(r.note, (annotationId = newId()));
			const { note: _note, entry: _entry, proposedBy, actor, ...fields } = r;
			tx.insert(levelAnnotationHistory)
				.values({
					...fields,
					annotationId,
					projectId: ctx.projectId,
					entryId,
					proposedBy: ctx.userIdOf(proposedBy),
					actorId: ctx.userIdOf(actor)
				})
				.run();
		}
	}
};
