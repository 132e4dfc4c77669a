/**
 * Fit reports of a Shelf entry: a least-squares fit of the entry's configuration to observed
 * levels — by default the entry's annotated observed energies (proposed and confirmed notes;
 * disputed ones are left out) — saved as the engine returned it, with who ran it and when.
 * Editors fit and save; viewers read. Reports are records: never edited. The save and its
 * activity line share one transaction.
 *
 * The work is split so a route can run the fit off the request thread: `prepareEntryFit` checks
 * the role and builds the request, the caller runs it (inline `runFit`, or the compute pool), and
 * `saveFitReport` stores the answer.
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { fitReports, parameterSets, users, type StoredFitRequest } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, notFound } from '../errors';
import { annotatedLevels } from './annotations';
import { readEntry } from './shelf';
import { logActivity, type Tx } from './activity';
import { newId } from '../ids';
import { parseInput } from '../validation';
import { entryFitInputSchema } from '../energy-validation';
import type { FitResult } from '../../physics/fit';
import { InputError } from '../../physics/input-error';
import { computeFit } from './energy';

const reportColumns = {
	id: fitReports.id,
	entryId: fitReports.entryId,
	parameterSetId: fitReports.parameterSetId,
	notation: fitReports.notation,
	request: fitReports.request,
	result: fitReports.result,
	rms: fitReports.rms,
	degreesOfFreedom: fitReports.degreesOfFreedom,
	createdAt: fitReports.createdAt,
	createdBy: sql<string | null>`(select name from ${users} where ${users.id} = ${fitReports.createdBy})`
};

/** One observed level per annotated level with an energy, assigned to its LS term (the user may correct it). */
export function observedFromNotes(levels: ReturnType<typeof annotatedLevels>['levels']): StoredFitRequest['observed'] {
	return levels.flatMap((l) => {
		const a = l.annotation;
		if (!a || a.observedEnergy === null || a.status === 'disputed') return [];
		return [
			{
				J: l.J,
				energy: a.observedEnergy,
				...(a.uncertainty !== null && a.uncertainty > 0 ? { uncertainty: a.uncertainty } : {}),
				assign: l.term,
				levelKey: l.key
			}
		];
	});
}

export interface PreparedFit {
	entry: { id: string; title: string; notation: string };
	request: StoredFitRequest;
	parameterSetId: string | null;
}

/**
 * Checks the role (editor) and the input, and builds the fit request for the entry. Without
 * `observed`, the entry's annotated energies are used; none there is a 400 that says what to do.
 */
export function prepareEntryFit(actor: Actor, projectId: string, entryId: string, input: unknown): PreparedFit {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(entryFitInputSchema, input);
	const { entry, levels } = annotatedLevels(actor, projectId, entryId);
	if (data.parameterSetId) {
		const set = db
			.select({ id: parameterSets.id })
			.from(parameterSets)
			.where(and(eq(parameterSets.id, data.parameterSetId), eq(parameterSets.entryId, entryId)))
			.get();
		if (!set) throw badRequest('parameterSetId names no parameter set of this entry', { field: 'parameterSetId' });
	}
	const observed = data.observed ?? observedFromNotes(levels);
	if (observed.length === 0)
		throw badRequest(
			'This entry has no observed energies to fit: annotate levels with their observed energies first, or send the observed levels',
			{ field: 'observed' }
		);
	const request: StoredFitRequest = {
		parameters: data.parameters,
		vary: data.vary,
		...(data.links ? { links: data.links } : {}),
		...(data.bounds ? { bounds: data.bounds } : {}),
		observed,
		observedFrom: data.observed ? 'typed' : 'notes'
	};
	return { entry, request, parameterSetId: data.parameterSetId ?? null };
}

/** The body of POST /api/v1/fit (the compute task `fit`) for a prepared fit. */
export function fitRequestOf(prepared: PreparedFit) {
	const { request } = prepared;
	return {
		config: prepared.entry.notation,
		parameters: request.parameters,
		vary: request.vary,
		...(request.links ? { links: request.links } : {}),
		...(request.bounds ? { bounds: request.bounds } : {}),
		observed: request.observed.map(({ levelKey: _, ...o }) => o)
	};
}

/** Runs a prepared fit on this thread; the engine's refusals (too few levels, unknown parameter…) become 400. */
export function runFit(prepared: PreparedFit): FitResult {
	try {
		const { limits: _, ...result } = computeFit(fitRequestOf(prepared));
		return result;
	} catch (e) {
		if (e instanceof RangeError || e instanceof InputError) throw badRequest(e.message, { field: 'observed' });
		throw e;
	}
}

function readReport(tx: Tx, entryId: string, fitId: string) {
	const row = tx
		.select(reportColumns)
		.from(fitReports)
		.where(and(eq(fitReports.id, fitId), eq(fitReports.entryId, entryId)))
		.get();
	if (!row) throw notFound('No such fit report on this Shelf entry');
	return row;
}

/** Saves the engine's answer to a prepared fit, with its activity line, in one transaction. */
export function saveFitReport(actor: Actor, projectId: string, prepared: PreparedFit, result: FitResult) {
	projectAccess(actor, projectId, 'editor');
	const { entry } = prepared;
	const id = newId();
	return db.transaction((tx) => {
		tx.insert(fitReports)
			.values({
				id,
				entryId: entry.id,
				parameterSetId: prepared.parameterSetId,
				notation: entry.notation,
				request: prepared.request,
				result,
				rms: result.rms,
				degreesOfFreedom: result.degreesOfFreedom,
				createdBy: actor.id
			})
			.run();
		const n = result.residuals.length;
		logActivity(tx, {
			projectId,
			actor,
			kind: 'fit.saved',
			summary: `fitted ${result.parameters.filter((p) => p.status === 'varied').length} parameters of “${entry.title}” to ${n} level${n === 1 ? '' : 's'}: rms ${result.rms.toFixed(2)} cm⁻¹`,
			subject: `entry:${entry.id}`
		});
		return readReport(tx, entry.id, id);
	});
}

/** Fits on this thread and saves the report (form actions, tests). */
export function fitAndSave(actor: Actor, projectId: string, entryId: string, input: unknown) {
	const prepared = prepareEntryFit(actor, projectId, entryId, input);
	return saveFitReport(actor, projectId, prepared, runFit(prepared));
}

/** The entry's fit reports, newest first. */
export function listFitReports(actor: Actor, projectId: string, entryId: string) {
	projectAccess(actor, projectId, 'viewer');
	readEntry(projectId, entryId);
	return db
		.select(reportColumns)
		.from(fitReports)
		.where(eq(fitReports.entryId, entryId))
		.orderBy(desc(fitReports.createdAt), desc(fitReports.id))
		.all();
}

export function getFitReport(actor: Actor, projectId: string, entryId: string, fitId: string) {
	projectAccess(actor, projectId, 'viewer');
	const entry = readEntry(projectId, entryId);
	return { entry, report: readReport(db, entryId, fitId) };
}
