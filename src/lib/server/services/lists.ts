/**
 * A project's saved level lists and line lists for the Line matcher. Editors upload a CSV file (every row
 * checked; a file with any problem saves nothing) or make a level list from Shelf entries' level notes;
 * viewers read. Each save or deletion is one transaction with its activity row. Rows are never edited:
 * a corrected list is a new upload.
 */
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { levelListRows, levelLists, lineListRows, lineLists, users } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, notFound, ServiceError } from '../errors';
import { newId } from '../ids';
import { parseInput } from '../validation';
import { logActivity, type Tx } from './activity';
import { annotatedLevels } from './annotations';
import {
	MAX_UPLOAD_BYTES,
	MAX_UPLOAD_PROBLEMS,
	parseLevelUpload,
	parseLineUpload,
	UPLOAD_LIMITS_TEXT,
	type Parsed,
	type UploadedLevel,
	type UploadedLine
} from '../../lines/uploads';

export type ListKind = 'levels' | 'lines';

/** Rows shown in an upload preview. */
export const PREVIEW_ROWS = 20;
/** Rows written per INSERT (well under SQLite's limit of bound variables). */
const INSERT_CHUNK = 500;
/** Shelf entries one level list may be made from. */
export const MAX_SOURCE_ENTRIES = 50;

const nameSchema = z
	.string({ error: 'name must be text' })
	.trim()
	.min(1, 'Give the list a name')
	.max(120, 'The name must be at most 120 characters');

const uploadSchema = z.object({
	name: nameSchema,
	csv: z.string({ error: 'csv must be the text of the file' })
});

/** What an upload read: the first rows, every problem (up to MAX_UPLOAD_PROBLEMS listed) and the counts. */
export interface UploadPreview<T> {
	rowCount: number;
	first: T[];
	problems: Parsed<T>['problems'];
	problemCount: number;
}

const preview = <T>(parsed: Parsed<T>): UploadPreview<T> => ({
	rowCount: parsed.rows.length,
	first: parsed.rows.slice(0, PREVIEW_ROWS),
	problems: parsed.problems,
	problemCount: parsed.problemCount
});

function checkSize(csv: string) {
	const bytes = Buffer.byteLength(csv, 'utf8');
	if (bytes > MAX_UPLOAD_BYTES)
		throw new ServiceError(
			413,
			`The file is ${(bytes / 1024 / 1024).toFixed(1)} MB; an upload may be ${UPLOAD_LIMITS_TEXT}. Split it into smaller files.`,
			{
				limit: MAX_UPLOAD_BYTES
			}
		);
	if (csv.trim() === '') throw badRequest('The file is empty; it needs a header row and at least one row of data', { field: 'file' });
}

/** A 422 carrying every problem, for the form (and the API) to list. Nothing has been saved. */
function refused<T>(parsed: Parsed<T>, noun: string): ServiceError {
	const listed = Math.min(parsed.problems.length, MAX_UPLOAD_PROBLEMS);
	return new ServiceError(
		422,
		`Nothing was saved: the ${noun} file has ${parsed.problemCount} problem${parsed.problemCount === 1 ? '' : 's'}` +
			(parsed.problemCount > listed ? ` (the first ${listed} are listed)` : '') +
			'. Correct them and upload the file again.',
		{ field: 'file', problems: parsed.problems, problemCount: parsed.problemCount }
	);
}

function insertChunks<T>(rows: T[], write: (chunk: T[]) => void) {
	for (let i = 0; i < rows.length; i += INSERT_CHUNK) write(rows.slice(i, i + INSERT_CHUNK));
}

const levelRowValues = (listId: string, rows: UploadedLevel[], offset: number) =>
	rows.map((r, i) => ({ listId, position: offset + i + 1, ...r }));

function insertLevelList(
	tx: Tx,
	actor: Actor,
	projectId: string,
	list: { name: string; source: 'upload' | 'shelf'; sourceEntries?: string[] },
	rows: UploadedLevel[]
) {
	const id = newId();
	tx.insert(levelLists)
		.values({
			id,
			projectId,
			name: list.name,
			source: list.source,
			sourceEntries: list.sourceEntries ?? [],
			rowCount: rows.length,
			createdBy: actor.id
		})
		.run();
	let offset = 0;
	insertChunks(rows, (chunk) => {
		tx.insert(levelListRows)
			.values(levelRowValues(id, chunk, offset))
			.run();
		offset += chunk.length;
	});
	const from =
		list.source === 'upload'
			? 'from a file'
			: `from ${list.sourceEntries?.length ?? 0} Shelf entr${list.sourceEntries?.length === 1 ? 'y' : 'ies'}`;
	logActivity(tx, {
		projectId,
		actor,
		kind: 'list.uploaded',
		summary: `saved the level list “${list.name}” (${rows.length} levels, ${from})`,
		subject: `level-list:${id}`
	});
	return id;
}

/**
 * Reads an uploaded level file; with `save`, stores it (one transaction, with its activity row) when it has no
 * problem. Editors only. A file with problems: 422 with `problems` [{ row, column, message }] and `problemCount`
 * when saving; the preview (no `save`) returns them instead. Over 5 MB: 413.
 */
export function uploadLevelList(actor: Actor, projectId: string, input: unknown, options: { save: boolean }) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(uploadSchema, input);
	checkSize(data.csv);
	const parsed = parseLevelUpload(data.csv);
	if (!options.save) return { preview: preview(parsed), list: null };
	if (parsed.problemCount > 0 || parsed.rows.length === 0)
		throw parsed.problemCount ? refused(parsed, 'level') : badRequest('The file has no rows of data under its header', { field: 'file' });
	const id = db.transaction((tx) => insertLevelList(tx, actor, projectId, { name: data.name, source: 'upload' }, parsed.rows));
	return { preview: preview(parsed), list: readLevelList(projectId, id) };
}

/** The same for a line file. */
export function uploadLineList(actor: Actor, projectId: string, input: unknown, options: { save: boolean }) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(uploadSchema, input);
	checkSize(data.csv);
	const parsed = parseLineUpload(data.csv);
	if (!options.save) return { preview: preview(parsed), list: null };
	if (parsed.problemCount > 0 || parsed.rows.length === 0)
		throw parsed.problemCount ? refused(parsed, 'line') : badRequest('The file has no rows of data under its header', { field: 'file' });
	const id = db.transaction((tx) => {
		const listId = newId();
		tx.insert(lineLists).values({ id: listId, projectId, name: data.name, rowCount: parsed.rows.length, createdBy: actor.id }).run();
		let offset = 0;
		insertChunks(parsed.rows, (chunk: UploadedLine[]) => {
			tx.insert(lineListRows)
				.values(chunk.map((r, i) => ({ listId, position: offset + i + 1, ...r })))
				.run();
			offset += chunk.length;
		});
		logActivity(tx, {
			projectId,
			actor,
			kind: 'list.uploaded',
			summary: `uploaded the line list “${data.name}” (${parsed.rows.length} lines)`,
			subject: `line-list:${listId}`
		});
		return listId;
	});
	return { preview: preview(parsed), list: readLineList(projectId, id) };
}

const shelfListSchema = z.object({
	name: nameSchema,
	entryIds: z
		.array(z.string().max(64, 'an entry id is at most 64 characters'), { error: 'entryIds must be a list of Shelf entry ids' })
		.min(1, 'Choose at least one Shelf entry')
		.max(MAX_SOURCE_ENTRIES, `Choose at most ${MAX_SOURCE_ENTRIES} Shelf entries`)
});

/**
 * A level list made from the level notes of one or several Shelf entries (of either parity): every attached
 * note with an observed energy that is not disputed becomes a level, with the entry's configuration, the term
 * (° for odd) and J. Editors only; 400 when the entries hold no such note.
 */
export function levelListFromShelf(actor: Actor, projectId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(shelfListSchema, input);
	const entryIds = [...new Set(data.entryIds)];
	const rows: UploadedLevel[] = [];
	for (const entryId of entryIds) {
		const { entry, sheet, levels } = annotatedLevels(actor, projectId, entryId);
		for (const level of levels) {
			const a = level.annotation;
			if (!a || a.observedEnergy === null || a.status === 'disputed') continue;
			rows.push({
				energy: a.observedEnergy,
				energyText: a.observedEnergyText ?? String(a.observedEnergy),
				uncertainty: a.uncertainty,
				J: level.J,
				parity: sheet.configuration.parity,
				configuration: entry.notation,
				term: level.term + (sheet.configuration.parity === 'odd' ? '°' : ''),
				g: null
			});
		}
	}
	if (rows.length === 0)
		throw badRequest('None of the chosen entries has a level note with an observed energy (disputed notes are left out)', {
			field: 'entryIds'
		});
	rows.sort((a, b) => a.energy - b.energy);
	const id = db.transaction((tx) =>
		insertLevelList(tx, actor, projectId, { name: data.name, source: 'shelf', sourceEntries: entryIds }, rows)
	);
	return readLevelList(projectId, id);
}

const createdByName = (column: typeof levelLists.createdBy | typeof lineLists.createdBy) =>
	sql<string | null>`(select name from ${users} where ${users.id} = ${column})`;

const levelListColumns = {
	id: levelLists.id,
	name: levelLists.name,
	source: levelLists.source,
	sourceEntries: levelLists.sourceEntries,
	rowCount: levelLists.rowCount,
	version: levelLists.version,
	createdAt: levelLists.createdAt,
	createdBy: createdByName(levelLists.createdBy)
};
const lineListColumns = {
	id: lineLists.id,
	name: lineLists.name,
	source: lineLists.source,
	rowCount: lineLists.rowCount,
	version: lineLists.version,
	createdAt: lineLists.createdAt,
	createdBy: createdByName(lineLists.createdBy)
};

function readLevelList(projectId: string, listId: string) {
	const list = db
		.select(levelListColumns)
		.from(levelLists)
		.where(and(eq(levelLists.projectId, projectId), eq(levelLists.id, listId)))
		.get();
	if (!list) throw notFound('No such level list in this project');
	return list;
}

function readLineList(projectId: string, listId: string) {
	const list = db
		.select(lineListColumns)
		.from(lineLists)
		.where(and(eq(lineLists.projectId, projectId), eq(lineLists.id, listId)))
		.get();
	if (!list) throw notFound('No such line list in this project');
	return list;
}

/** The project's level lists and line lists, newest first. Viewers read. */
export function listLists(actor: Actor, projectId: string) {
	projectAccess(actor, projectId, 'viewer');
	return {
		levelLists: db
			.select(levelListColumns)
			.from(levelLists)
			.where(eq(levelLists.projectId, projectId))
			.orderBy(desc(levelLists.createdAt), desc(levelLists.id))
			.all(),
		lineLists: db
			.select(lineListColumns)
			.from(lineLists)
			.where(eq(lineLists.projectId, projectId))
			.orderBy(desc(lineLists.createdAt), desc(lineLists.id))
			.all()
	};
}

/** One level list with its rows in file order. Viewers read. */
export function getLevelList(actor: Actor, projectId: string, listId: string) {
	projectAccess(actor, projectId, 'viewer');
	const list = readLevelList(projectId, listId);
	const rows = db.select().from(levelListRows).where(eq(levelListRows.listId, listId)).orderBy(asc(levelListRows.position)).all();
	return { list, rows: rows.map(({ listId: _l, ...r }) => r) };
}

/** One line list with its rows in file order. Viewers read. */
export function getLineList(actor: Actor, projectId: string, listId: string) {
	projectAccess(actor, projectId, 'viewer');
	const list = readLineList(projectId, listId);
	const rows = db.select().from(lineListRows).where(eq(lineListRows.listId, listId)).orderBy(asc(lineListRows.position)).all();
	return { list, rows: rows.map(({ listId: _l, ...r }) => r) };
}

/** Deletes a list, its rows and the identifications that use them (one transaction, logged). Editors only. */
export function deleteList(actor: Actor, projectId: string, kind: ListKind, listId: string) {
	projectAccess(actor, projectId, 'editor');
	const list = kind === 'levels' ? readLevelList(projectId, listId) : readLineList(projectId, listId);
	db.transaction((tx) => {
		if (kind === 'levels') tx.delete(levelLists).where(eq(levelLists.id, listId)).run();
		else tx.delete(lineLists).where(eq(lineLists.id, listId)).run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'list.deleted',
			summary: `deleted the ${kind === 'levels' ? 'level' : 'line'} list “${list.name}” and its identifications`,
			subject: `${kind === 'levels' ? 'level' : 'line'}-list:${listId}`
		});
	});
	return { deleted: listId };
}
