/**
 * The backup section of the Line matcher's saved work (services/backup.ts, BACKUP_SECTIONS): level lists with
 * their levels, line lists with their lines, and identifications. Rows travel with their id as `ref`, so the
 * identifications can point at them; people by e-mail; Shelf entries a level list was made from by their `ref`.
 */
import { asc, eq, inArray } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import {
	IDENTIFICATION_STATUSES,
	IDENTIFICATION_TYPES,
	LEVEL_LIST_SOURCES,
	LINE_MEDIA,
	LINE_UNITS,
	identifications,
	levelListRows,
	levelLists,
	lineListRows,
	lineLists
} from '../db/schema';
import { newId } from '../ids';
import { badRequest } from '../errors';
import type { Tx } from './activity';
import type { BackupContext, BackupSection } from './backup';

const isoDate = z.iso.datetime({ offset: true, error: 'must be a date and time in ISO 8601 form' }).transform((s) => new Date(s));
const email = z.string().max(254).nullable();
const text = (max: number) => z.string().max(max, `must be at most ${max} characters`);
const finite = z.number().finite();
const ref = z.number().int().positive();

const listFields = {
	ref: text(64),
	name: text(120).min(1),
	version: z.number().int().positive(),
	createdBy: email,
	createdAt: isoDate
};

const sectionSchema = z.strictObject({
	levelLists: z.array(
		z.strictObject({
			...listFields,
			source: z.enum(LEVEL_LIST_SOURCES),
			sourceEntries: z.array(text(64)),
			rows: z.array(
				z.strictObject({
					ref,
					position: z.number().int().positive(),
					energy: finite,
					energyText: text(40),
					uncertainty: finite.nonnegative().nullable(),
					J: text(8),
					parity: z.enum(['even', 'odd']),
					configuration: text(200),
					term: text(200),
					g: finite.nullable()
				})
			)
		})
	),
	lineLists: z.array(
		z.strictObject({
			...listFields,
			rows: z.array(
				z.strictObject({
					ref,
					position: z.number().int().positive(),
					wavelength: finite.positive(),
					wavelengthText: text(40),
					unit: z.enum(LINE_UNITS),
					medium: z.enum(LINE_MEDIA),
					uncertainty: finite.nonnegative().nullable(),
					intensity: finite.nonnegative().nullable(),
					comment: text(200)
				})
			)
		})
	),
	identifications: z.array(
		z.strictObject({
			line: ref,
			upper: ref,
			lower: ref,
			type: z.enum(IDENTIFICATION_TYPES),
			residual: finite.nullable(),
			status: z.enum(IDENTIFICATION_STATUSES),
			note: text(500),
			version: z.number().int().positive(),
			updatedBy: email,
			updatedAt: isoDate
		})
	)
});

type Section = z.output<typeof sectionSchema>;
type SectionFile = z.input<typeof sectionSchema>;

function dump(ctx: BackupContext): SectionFile {
	const { projectId } = ctx;
	const levels = db
		.select()
		.from(levelLists)
		.where(eq(levelLists.projectId, projectId))
		.orderBy(asc(levelLists.createdAt), asc(levelLists.id))
		.all();
	const lines = db
		.select()
		.from(lineLists)
		.where(eq(lineLists.projectId, projectId))
		.orderBy(asc(lineLists.createdAt), asc(lineLists.id))
		.all();
	const rowsOf = <T extends { listId: string }>(table: typeof levelListRows | typeof lineListRows, ids: string[]) =>
		ids.length ? (db.select().from(table).where(inArray(table.listId, ids)).orderBy(asc(table.id)).all() as unknown as T[]) : [];
	const levelRows = rowsOf<typeof levelListRows.$inferSelect>(
		levelListRows,
		levels.map((l) => l.id)
	);
	const lineRows = rowsOf<typeof lineListRows.$inferSelect>(
		lineListRows,
		lines.map((l) => l.id)
	);
	const verdicts = db
		.select()
		.from(identifications)
		.where(eq(identifications.projectId, projectId))
		.orderBy(asc(identifications.updatedAt), asc(identifications.id))
		.all();
	const list = (l: { id: string; name: string; version: number; createdBy: string | null; createdAt: Date }) => ({
		ref: l.id,
		name: l.name,
		version: l.version,
		createdBy: ctx.emailOf(l.createdBy),
		createdAt: l.createdAt.toISOString()
	});
	return {
		levelLists: levels.map((l) => ({
			...list(l),
			source: l.source,
			sourceEntries: l.sourceEntries,
			rows: levelRows.filter((r) => r.listId === l.id).map(({ id, listId: _l, ...r }) => ({ ref: id, ...r }))
		})),
		lineLists: lines.map((l) => ({
			...list(l),
			rows: lineRows.filter((r) => r.listId === l.id).map(({ id, listId: _l, ...r }) => ({ ref: id, ...r }))
		})),
		identifications: verdicts.map((v) => ({
			line: v.lineId,
			upper: v.upperLevelId,
			lower: v.lowerLevelId,
			type: v.type,
			residual: v.residual,
			status: v.status,
			note: v.note,
			version: v.version,
			updatedBy: ctx.emailOf(v.updatedBy),
			updatedAt: v.updatedAt.toISOString()
		}))
	};
}

/** The columns every saved list has, for a list of the file restored as `id` in this project. */
function listValues(
	l: { name: string; rows: unknown[]; version: number; createdBy: string | null; createdAt: Date },
	id: string,
	ctx: BackupContext
) {
	return {
		id,
		projectId: ctx.projectId,
		name: l.name,
		rowCount: l.rows.length,
		version: l.version,
		createdBy: ctx.userIdOf(l.createdBy),
		createdAt: l.createdAt
	};
}

/** Writes a list's rows under `listId` and notes each row's new id by the `ref` it had in the file. */
function restoreRows<T extends typeof levelListRows | typeof lineListRows>(
	tx: Tx,
	table: T,
	listId: string,
	rows: (Omit<T['$inferInsert'], 'listId'> & { ref: number })[],
	newIds: Map<number, number>
) {
	for (const { ref: old, ...r } of rows) {
		const row = tx
			.insert(table)
			// TypeScript cannot follow a spread of a generic row back to the table's insert type; the row is that type less listId.
			.values({ listId, ...r } as unknown as T['$inferInsert'])
			.returning({ id: table.id })
			.get();
		newIds.set(old, row.id);
	}
}

function restore(tx: Tx, data: Section, ctx: BackupContext) {
	const { projectId } = ctx;
	const levelIds = new Map<number, number>();
	const lineIds = new Map<number, number>();
	for (const l of data.levelLists) {
		const id = newId();
		tx.insert(levelLists)
			.values({
				...listValues(l, id, ctx),
				source: l.source,
				// Entries of the file get new ids; a source entry that is not in the file is dropped from the list.
				sourceEntries: l.sourceEntries.map((e) => ctx.entryIds.get(e)).filter((e): e is string => !!e)
			})
			.run();
		restoreRows(tx, levelListRows, id, l.rows, levelIds);
	}
	for (const l of data.lineLists) {
		const id = newId();
		tx.insert(lineLists)
			.values(listValues(l, id, ctx))
			.run();
		restoreRows(tx, lineListRows, id, l.rows, lineIds);
	}
	for (const v of data.identifications) {
		const lineId = lineIds.get(v.line);
		const upperLevelId = levelIds.get(v.upper);
		const lowerLevelId = levelIds.get(v.lower);
		if (!lineId || !upperLevelId || !lowerLevelId)
			throw badRequest('The backup is damaged: an identification refers to a line or level that is not in the file. Nothing was imported.');
		const { line: _l, upper: _u, lower: _w, updatedBy, ...fields } = v;
		tx.insert(identifications)
			.values({ id: newId(), projectId, lineId, upperLevelId, lowerLevelId, ...fields, updatedBy: ctx.userIdOf(updatedBy) })
			.run();
	}
}

export const listsSection: BackupSection<Section> = {
	key: 'lineMatcher',
	label: 'level lists, line lists and identifications',
	schema: sectionSchema as unknown as z.ZodType<Section>,
	dump: dump as unknown as (ctx: BackupContext) => Section,
	restore
};
