/**
 * Identifications: an editor's verdict that an observed line is (accepted) or is not (rejected) the transition
 * between two levels of a saved level list. A line may carry several accepted identifications (a blend).
 * A new verdict on the same (line, upper, lower) changes the row. The residual is computed here from the saved
 * rows (σ_obs − (E_upper − E_lower), cm⁻¹), never taken from the client; the pair must obey the type's J and
 * parity rules. Each verdict is one transaction with its activity row. Viewers read.
 */
import { and, asc, eq, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import { z } from 'zod';
import { db } from '../db';
import { IDENTIFICATION_STATUSES, identifications, levelListRows, levelLists, lineListRows, lineLists, users } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, notFound } from '../errors';
import { newId } from '../ids';
import { parseInput } from '../validation';
import { logActivity } from './activity';
import { jParityAllows, TRANSITION_TYPES, type TransitionType } from '../../physics/transitions';
import { toVacuumAngstrom, ANGSTROM_PER_CM } from '../../physics/airvac';
import { parseHalf } from '../../physics/half';

const rowId = (what: string) =>
	z.coerce
		.number({ error: `${what} must be a row id` })
		.int(`${what} must be a whole number`)
		.positive(`${what} must be a row id`);

export const verdictSchema = z.object({
	lineId: rowId('lineId'),
	upperLevelId: rowId('upperLevelId'),
	lowerLevelId: rowId('lowerLevelId'),
	type: z.enum(TRANSITION_TYPES as [TransitionType, ...TransitionType[]], { error: 'type must be E1, M1 or E2' }),
	status: z.enum(IDENTIFICATION_STATUSES, { error: 'status must be accepted or rejected' }),
	note: z.string({ error: 'note must be text' }).trim().max(500, 'The note must be at most 500 characters').default('')
});

/** A line row of a line list of this project, or 404. */
function lineOfProject(projectId: string, lineId: number) {
	const row = db
		.select({ line: lineListRows, listName: lineLists.name })
		.from(lineListRows)
		.innerJoin(lineLists, eq(lineLists.id, lineListRows.listId))
		.where(and(eq(lineListRows.id, lineId), eq(lineLists.projectId, projectId)))
		.get();
	if (!row) throw notFound('No such line in this project’s line lists');
	return row;
}

function levelOfProject(projectId: string, levelId: number) {
	const row = db
		.select({ level: levelListRows })
		.from(levelListRows)
		.innerJoin(levelLists, eq(levelLists.id, levelListRows.listId))
		.where(and(eq(levelListRows.id, levelId), eq(levelLists.projectId, projectId)))
		.get();
	if (!row) throw notFound('No such level in this project’s level lists');
	return row.level;
}

/** Observed vacuum wavenumber (cm⁻¹) of a saved line. */
export const lineWavenumber = (line: Pick<typeof lineListRows.$inferSelect, 'wavelength' | 'unit' | 'medium'>) =>
	ANGSTROM_PER_CM / toVacuumAngstrom(line.wavelength, line.unit, line.medium);

/**
 * Accepts or rejects one candidate of a line (editors). 400 when the levels are of different lists, the
 * "upper" level is not above the "lower" one, or the type's J/parity rules forbid the pair; 404 for ids
 * outside the project. Returns the saved identification.
 */
export function judgeCandidate(actor: Actor, projectId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const v = parseInput(verdictSchema, input);
	const { line } = lineOfProject(projectId, v.lineId);
	const upper = levelOfProject(projectId, v.upperLevelId);
	const lower = levelOfProject(projectId, v.lowerLevelId);
	if (upper.listId !== lower.listId) throw badRequest('The two levels must come from the same level list', { field: 'lowerLevelId' });
	if (!(upper.energy > lower.energy))
		throw badRequest(`The upper level (${upper.energyText} cm⁻¹) must lie above the lower level (${lower.energyText} cm⁻¹)`, {
			field: 'upperLevelId'
		});
	if (!jParityAllows(v.type, parseHalf(lower.J), lower.parity, parseHalf(upper.J), upper.parity))
		throw badRequest(`${v.type} does not connect J=${lower.J} (${lower.parity}) with J=${upper.J} (${upper.parity})`, { field: 'type' });
	const residual = lineWavenumber(line) - (upper.energy - lower.energy);
	const id = db.transaction((tx) => {
		const pair = and(
			eq(identifications.lineId, v.lineId),
			eq(identifications.upperLevelId, v.upperLevelId),
			eq(identifications.lowerLevelId, v.lowerLevelId)
		);
		const current = tx.select().from(identifications).where(pair).get();
		const values = { type: v.type, residual, status: v.status, note: v.note, updatedBy: actor.id, updatedAt: new Date() };
		let rowId: string;
		if (current) {
			tx.update(identifications)
				.set({ ...values, version: sql`${identifications.version} + 1` })
				.where(eq(identifications.id, current.id))
				.run();
			rowId = current.id;
		} else {
			rowId = newId();
			tx.insert(identifications)
				.values({ id: rowId, projectId, lineId: v.lineId, upperLevelId: v.upperLevelId, lowerLevelId: v.lowerLevelId, ...values })
				.run();
		}
		const what = `${line.wavelengthText} ${line.unit === 'A' ? 'Å' : line.unit} (${line.medium}) as ${lower.term || 'J=' + lower.J} – ${upper.term || 'J=' + upper.J} ${v.type}`;
		logActivity(tx, {
			projectId,
			actor,
			kind: v.status === 'accepted' ? 'identification.accepted' : 'identification.rejected',
			summary: `${v.status} ${what}${v.note ? `: ${v.note}` : ''}`,
			subject: `line:${v.lineId}`
		});
		return rowId;
	});
	return readIdentifications(projectId, [eq(identifications.id, id)])[0];
}

const upperLevel = alias(levelListRows, 'upper_level');
const lowerLevel = alias(levelListRows, 'lower_level');

function readIdentifications(projectId: string, where: SQL[]) {
	return db
		.select({
			id: identifications.id,
			lineId: identifications.lineId,
			lineListId: lineListRows.listId,
			upperLevelId: identifications.upperLevelId,
			lowerLevelId: identifications.lowerLevelId,
			levelListId: upperLevel.listId,
			type: identifications.type,
			residual: identifications.residual,
			status: identifications.status,
			note: identifications.note,
			version: identifications.version,
			updatedAt: identifications.updatedAt,
			updatedBy: sql<string | null>`(select name from ${users} where ${users.id} = ${identifications.updatedBy})`
		})
		.from(identifications)
		.innerJoin(lineListRows, eq(lineListRows.id, identifications.lineId))
		.innerJoin(upperLevel, eq(upperLevel.id, identifications.upperLevelId))
		.innerJoin(lowerLevel, eq(lowerLevel.id, identifications.lowerLevelId))
		.where(and(eq(identifications.projectId, projectId), ...where))
		.orderBy(asc(lineListRows.position), asc(identifications.updatedAt))
		.all();
}

/** The verdicts on the lines of one line list (no role check: callers have checked it). */
export function identificationsOfLineList(projectId: string, lineListId: string) {
	return readIdentifications(projectId, [eq(lineListRows.listId, lineListId)]);
}

const listQuerySchema = z.object({
	lineListId: z.string().max(64).optional(),
	status: z.enum(IDENTIFICATION_STATUSES, { error: 'status must be accepted or rejected' }).optional()
});

/** The project's identifications, optionally of one line list and one status, in line order. Viewers read. */
export function listIdentifications(actor: Actor, projectId: string, query: unknown) {
	projectAccess(actor, projectId, 'viewer');
	const q = parseInput(listQuerySchema, query);
	const where: SQL[] = [];
	if (q.lineListId) where.push(eq(lineListRows.listId, q.lineListId));
	if (q.status) where.push(eq(identifications.status, q.status));
	return readIdentifications(projectId, where);
}

/** Accepted identifications per line id, for the blend count. */
export function acceptedPerLine(rows: { lineId: number; status: string }[]): Map<number, number> {
	const counts = new Map<number, number>();
	for (const r of rows) if (r.status === 'accepted') counts.set(r.lineId, (counts.get(r.lineId) ?? 0) + 1);
	return counts;
}
