/**
 * Parameter sets and fit reports of a Shelf entry: editors write, viewers read (403 on writes),
 * stale versions get 409, a refused activity line rolls the whole change back, a saved fit holds
 * what the engine returned, and the exports read as the Shelf's other tables (product rules,
 * common practice, no source, except where a physics source is named beside a value).
 *
 * The invented 3d² ion and its sources: tests/fixtures/invented-3d2.ts.
 */
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { sqlite } from './db';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry } from './services/shelf';
import { saveAnnotation } from './services/annotations';
import { listActivity } from './services/activity';
import { createParameterSet, deleteParameterSet, getParameterSet, listParameterSets, updateParameterSet } from './services/parameter-sets';
import { fitAndSave, getFitReport, listFitReports, prepareEntryFit } from './services/fit-reports';
import { exportFitReport } from './services/exports';
import { fitParameters } from '../physics/fit';
import { refusal, statusOf } from './status-of';
import { INVENTED_3D2_OBSERVED, INVENTED_3D2_START } from '../../../tests/fixtures/invented-3d2';

let editor: Actor, reviewer: Actor, viewer: Actor, stranger: Actor, projectId: string, entryId: string;

/** Observed levels of the invented 3d² ion, with uncertainties 1 cm⁻¹. */
const OBSERVED = INVENTED_3D2_OBSERVED;
const START = INVENTED_3D2_START;
const VARY = ['Eav', 'F2(3d,3d)', 'F4(3d,3d)'];

beforeAll(async () => {
	editor = await signUp({ name: 'Ed Itor', email: 'ed@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vi Ewer', email: 'vi@example.org', password: 'long-enough-pw' });
	stranger = await signUp({ name: 'Stran Ger', email: 'st@example.org', password: 'long-enough-pw' });
	reviewer = await signUp({ name: 'Rita Reviewer', email: 'rita@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'P' }).id;
	addMember(editor, projectId, { email: 'rita@example.org', role: 'editor' });
	addMember(editor, projectId, { email: 'vi@example.org', role: 'viewer' });
});

beforeEach(() => {
	entryId = createEntry(editor, projectId, { title: 'Invented 3d2 ion', species: '', notation: '3d2' }).id;
});

function annotateAll() {
	for (const [levelKey, energy] of OBSERVED)
		saveAnnotation(editor, projectId, entryId, {
			levelKey,
			observedEnergy: String(energy),
			uncertainty: '1',
			status: 'proposed',
			comment: ''
		});
}

const log = () => listActivity(editor, projectId, { limit: 200 }).items;

describe('parameter sets', () => {
	it('an editor saves a set; viewers read it with who and when; strangers get 404', () => {
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START });
		expect(set).toMatchObject({ name: 'start', notation: '3d2', version: 1, createdBy: 'Ed Itor', updatedBy: 'Ed Itor' });
		expect(set.parameters).toEqual(START);
		expect(set.createdAt).toBeInstanceOf(Date);
		expect(listParameterSets(viewer, projectId, entryId).map((s) => s.id)).toEqual([set.id]);
		expect(getParameterSet(viewer, projectId, entryId, set.id).parameters).toEqual(START);
		expect(statusOf(() => listParameterSets(stranger, projectId, entryId))).toBe(404);
		expect(log()[0]).toMatchObject({ kind: 'parameters.saved', subject: `entry:${entryId}` });
	});

	it('a viewer may not save, change or delete a set (403), and nothing is written', () => {
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START });
		const lines = log().length;
		expect(statusOf(() => createParameterSet(viewer, projectId, entryId, { name: 'x', parameters: START }))).toBe(403);
		expect(statusOf(() => updateParameterSet(viewer, projectId, entryId, set.id, { name: 'x', version: 1 }))).toBe(403);
		expect(statusOf(() => deleteParameterSet(viewer, projectId, entryId, set.id, 1))).toBe(403);
		expect(listParameterSets(viewer, projectId, entryId)).toHaveLength(1);
		expect(log()).toHaveLength(lines);
	});

	it('a change sends the version it read: the next version wins, a stale one gets 409', () => {
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START });
		const changed = updateParameterSet(editor, projectId, entryId, set.id, { name: 'scaled 85 %', version: 1 });
		expect(changed).toMatchObject({ name: 'scaled 85 %', version: 2 });
		expect(statusOf(() => updateParameterSet(editor, projectId, entryId, set.id, { name: 'stale', version: 1 }))).toBe(409);
		expect(statusOf(() => deleteParameterSet(editor, projectId, entryId, set.id, 1))).toBe(409);
		expect(getParameterSet(viewer, projectId, entryId, set.id).name).toBe('scaled 85 %');
		deleteParameterSet(editor, projectId, entryId, set.id, 2);
		expect(listParameterSets(viewer, projectId, entryId)).toHaveLength(0);
	});

	it('refuses parameters that cannot occur in the configuration, naming them (400)', () => {
		// d electrons: F^k within 3d for k = 2, 4 only (Condon & Shortley 1935 §6⁸; triangle and parity of c^k).
		let message = '';
		try {
			createParameterSet(editor, projectId, entryId, { name: 'bad', parameters: { F: [{ k: 3, a: '3d', b: '3d', value: 1 }] } });
		} catch (e) {
			message = (e as Error).message;
		}
		expect(message).toMatch(/F\^3\(3d,3d\) cannot occur.*2, 4/);
		expect(statusOf(() => createParameterSet(editor, projectId, entryId, { name: '', parameters: START }))).toBe(400);
		expect(listParameterSets(viewer, projectId, entryId)).toHaveLength(0);
	});

	it('when the activity line cannot be written, the set is not saved either (one transaction)', () => {
		sqlite.exec(`create trigger refuse_params before insert on activity_log when new.kind = 'parameters.saved'
			begin select raise(abort, 'log refused'); end`);
		try {
			expect(() => createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START })).toThrow(/log refused/);
			expect(listParameterSets(viewer, projectId, entryId)).toHaveLength(0);
		} finally {
			sqlite.exec('drop trigger refuse_params');
		}
	});
});

describe('renaming, re-commenting and deleting a set (product rules, common practice, no source)', () => {
	it('a rename logs both names; a comment-only change says so; each bumps the version by one', () => {
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START });
		const renamed = updateParameterSet(editor, projectId, entryId, set.id, {
			name: 'start, ζ = 0',
			comment: 'from Racah B, C',
			version: 1
		});
		expect(renamed).toMatchObject({ name: 'start, ζ = 0', comment: 'from Racah B, C', version: 2, parameters: START });
		expect(log()[0]).toMatchObject({ kind: 'parameters.saved', subject: `entry:${entryId}` });
		expect(log()[0].summary).toBe('renamed the parameters “start” to “start, ζ = 0” and changed their comment of “Invented 3d2 ion”');
		updateParameterSet(reviewer, projectId, entryId, set.id, { comment: 'checked', version: 2 });
		expect(log()[0].summary).toBe('changed the comment of the parameters “start, ζ = 0” of “Invented 3d2 ion”');
		expect(getParameterSet(viewer, projectId, entryId, set.id)).toMatchObject({
			comment: 'checked',
			version: 3,
			updatedBy: 'Rita Reviewer'
		});
	});

	it('a stale rename is refused with who changed the set and its present name and comment; nothing is overwritten', () => {
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START, comment: 'first' });
		updateParameterSet(reviewer, projectId, entryId, set.id, { name: 'Rita’s start', comment: 'hers', version: 1 });
		const lines = log().length;
		const e = refusal(() => updateParameterSet(editor, projectId, entryId, set.id, { name: 'mine', comment: 'mine', version: 1 }));
		expect(e.status).toBe(409);
		expect(e.message).toMatch(
			/changed by someone else \(Rita Reviewer\).*you had version 1, it is now version 2, named “Rita’s start”.*Nothing was changed/
		);
		expect(e.details).toMatchObject({
			currentVersion: 2,
			current: { name: 'Rita’s start', comment: 'hers', version: 2, updatedBy: 'Rita Reviewer' }
		});
		expect(getParameterSet(viewer, projectId, entryId, set.id)).toMatchObject({ name: 'Rita’s start', comment: 'hers', version: 2 });
		expect(log()).toHaveLength(lines);
		// A stale delete is refused the same way, and the set stays.
		expect(refusal(() => deleteParameterSet(editor, projectId, entryId, set.id, 1)).details).toMatchObject({
			current: { name: 'Rita’s start' }
		});
		expect(listParameterSets(viewer, projectId, entryId)).toHaveLength(1);
	});

	it('says what a name or comment may be: not empty, at most 120 and 2000 characters (400, nothing written)', () => {
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START });
		const empty = refusal(() => updateParameterSet(editor, projectId, entryId, set.id, { name: '   ', version: 1 }));
		expect([empty.status, empty.message]).toEqual([400, 'name must not be empty: give the set a name such as "fit of 12 levels"']);
		expect(empty.details).toMatchObject({ field: 'name' });
		expect(refusal(() => updateParameterSet(editor, projectId, entryId, set.id, { name: 'x'.repeat(121), version: 1 })).message).toBe(
			'name must be at most 120 characters'
		);
		const long = refusal(() => updateParameterSet(editor, projectId, entryId, set.id, { comment: 'x'.repeat(2001), version: 1 }));
		expect([long.message, long.details.field]).toEqual(['comment must be at most 2000 characters', 'comment']);
		expect(getParameterSet(viewer, projectId, entryId, set.id)).toMatchObject({ name: 'start', version: 1 });
	});

	it('deleting a set keeps the fit reports made from it, with the starting values they used, unlinked', () => {
		annotateAll();
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START });
		const report = fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY, parameterSetId: set.id });
		expect(report.parameterSetId).toBe(set.id);
		deleteParameterSet(editor, projectId, entryId, set.id, 1);
		expect(log()[0]).toMatchObject({ kind: 'parameters.deleted', summary: 'deleted the parameters “start” of “Invented 3d2 ion”' });
		expect(statusOf(() => getParameterSet(viewer, projectId, entryId, set.id))).toBe(404);
		const kept = getFitReport(viewer, projectId, entryId, report.id).report;
		expect(kept.parameterSetId).toBeNull();
		expect(kept.request.parameters).toEqual(START);
		expect(kept.result).toEqual(report.result);
	});

	it('when the activity line cannot be written, neither the rename nor the deletion happens (one transaction)', () => {
		const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START });
		sqlite.exec(`create trigger refuse_params before insert on activity_log when new.kind like 'parameters.%'
			begin select raise(abort, 'log refused'); end`);
		try {
			expect(() => updateParameterSet(editor, projectId, entryId, set.id, { name: 'renamed', version: 1 })).toThrow(/log refused/);
			expect(() => deleteParameterSet(editor, projectId, entryId, set.id, 1)).toThrow(/log refused/);
			expect(getParameterSet(viewer, projectId, entryId, set.id)).toMatchObject({ name: 'start', version: 1 });
		} finally {
			sqlite.exec('drop trigger refuse_params');
		}
	});
});

describe('fit reports', () => {
	it('fits the entry’s annotated energies by default and saves what the engine returned, with who and when', () => {
		annotateAll();
		const report = fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY });
		// The same fit run directly on the engine, from the same observed levels.
		const direct = fitParameters('3d2', {
			parameters: START,
			vary: VARY,
			observed: report.request.observed.map(({ levelKey: _, ...o }) => o)
		});
		expect(report.result).toEqual(direct);
		expect(report.request.observedFrom).toBe('notes');
		expect(report.request.observed.map((o) => o.levelKey).sort()).toEqual(OBSERVED.map(([k]) => k).sort());
		expect(report).toMatchObject({ createdBy: 'Ed Itor', notation: '3d2', degreesOfFreedom: 2, rms: direct.rms });
		// Recovers the invented Racah B = 800, C = 3200 (file comment): F² = 61600, F⁴ = 40320 cm⁻¹.
		const value = (id: string) => report.result.parameters.find((p) => p.id === id)!.value;
		expect(value('F2(3d,3d)')).toBeCloseTo(61600, 3);
		expect(value('F4(3d,3d)')).toBeCloseTo(40320, 3);
		expect(report.rms).toBeLessThan(1e-6);
		expect(report.result.parameters.find((p) => p.id === 'zeta(3d)')).toMatchObject({ status: 'fixed', sigma: null });
		const residual = new Map(report.result.residuals.map((r) => [`${r.label}|${r.J}`, r.residual]));
		expect(residual.get('1S|0')).toBeCloseTo(0, 6);
		expect(listFitReports(viewer, projectId, entryId).map((f) => f.id)).toEqual([report.id]);
		expect(log()[0]).toMatchObject({ kind: 'fit.saved', subject: `entry:${entryId}` });
		expect(log()[0].summary).toMatch(/fitted 3 parameters of “Invented 3d2 ion” to 5 levels: rms 0\.00 cm⁻¹/);
	});

	it('leaves disputed notes out of the default observed levels; a typed list overrides them', () => {
		annotateAll();
		saveAnnotation(reviewer, projectId, entryId, {
			levelKey: '1S#1|0',
			observedEnergy: '40000',
			uncertainty: '1',
			status: 'disputed',
			comment: 'blend?',
			version: 1
		});
		const prepared = prepareEntryFit(editor, projectId, entryId, { parameters: START, vary: VARY });
		expect(prepared.request.observed.map((o) => o.levelKey)).not.toContain('1S#1|0');
		expect(prepared.request.observed).toHaveLength(4);
		const typed = prepareEntryFit(editor, projectId, entryId, {
			parameters: START,
			vary: VARY,
			observed: [
				{ J: '2', energy: 0, assign: '3F' },
				{ J: '0', energy: 12000, assign: '3P' },
				{ J: '4', energy: 16000, assign: '1G' }
			]
		});
		expect(typed.request.observedFrom).toBe('typed');
		expect(typed.request.observed).toHaveLength(3);
	});

	it('viewers read reports but may not fit (403); strangers get 404', () => {
		annotateAll();
		const report = fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY });
		expect(statusOf(() => fitAndSave(viewer, projectId, entryId, { parameters: START, vary: VARY }))).toBe(403);
		expect(getFitReport(viewer, projectId, entryId, report.id).report.id).toBe(report.id);
		expect(statusOf(() => getFitReport(stranger, projectId, entryId, report.id))).toBe(404);
		expect(listFitReports(viewer, projectId, entryId)).toHaveLength(1);
	});

	it('says what is missing: no observed energies, or fewer levels than free parameters (400, nothing saved)', () => {
		expect(() => fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY })).toThrow(/no observed energies to fit/);
		saveAnnotation(editor, projectId, entryId, {
			levelKey: '3F#1|2',
			observedEnergy: '0',
			uncertainty: '1',
			status: 'proposed',
			comment: ''
		});
		saveAnnotation(editor, projectId, entryId, {
			levelKey: '3P#1|0',
			observedEnergy: '12000',
			uncertainty: '1',
			status: 'proposed',
			comment: ''
		});
		expect(() => fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY })).toThrow(
			/2 observed levels and 3 free parameters: it needs at least as many observed levels as free parameters/
		);
		expect(statusOf(() => fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY }))).toBe(400);
		expect(listFitReports(viewer, projectId, entryId)).toHaveLength(0);
	});

	it('when the activity line cannot be written, the report is not saved either (one transaction)', () => {
		annotateAll();
		sqlite.exec(`create trigger refuse_fit before insert on activity_log when new.kind = 'fit.saved'
			begin select raise(abort, 'log refused'); end`);
		try {
			expect(() => fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY })).toThrow(/log refused/);
			expect(listFitReports(viewer, projectId, entryId)).toHaveLength(0);
		} finally {
			sqlite.exec('drop trigger refuse_fit');
		}
	});
});

describe('fit report exports', () => {
	let fitId: string;
	beforeEach(() => {
		annotateAll();
		fitId = fitAndSave(editor, projectId, entryId, { parameters: START, vary: VARY }).id;
	});

	it('CSV: the parameter table, a blank line, then the residual table, cm⁻¹ to 0.01', () => {
		const { body, type, filename } = exportFitReport(viewer, projectId, entryId, fitId, 'csv');
		expect(type).toMatch(/^text\/csv/);
		expect(filename).toMatch(/^fit_levels_3d2_\d{4}_\d\d_\d\d\.csv$/);
		const [params, residuals] = body.split('\r\n\r\n');
		const prows = params.split('\r\n');
		expect(prows[0]).toBe('parameter,value_cm-1,sigma_cm-1,status,linked_to,ratio,at_bound');
		// A name holding a comma is quoted (RFC 4180).
		expect(prows.find((r) => r.startsWith('"F2(3d,3d)",'))).toMatch(/^"F2\(3d,3d\)",61600\.00,\d+\.\d\d,free,,,$/);
		expect(prows.find((r) => r.startsWith('zeta(3d),'))).toBe('zeta(3d),0.00,,fixed,,,');
		const rrows = residuals.split('\r\n');
		expect(rrows[0]).toBe('J,rank_in_J,label,observed_cm-1,calculated_cm-1,obs-calc_cm-1');
		expect(rrows).toHaveLength(6);
		expect(rrows).toContain('0,2,1S,40000.00,40000.00,0.00');
		// Residuals that round to zero are written 0.00, never -0.00.
		expect(residuals).not.toContain('-0.00');
	});

	it('JSON: the statistics, who and when, and the two tables with unrounded numbers', () => {
		const json = JSON.parse(exportFitReport(viewer, projectId, entryId, fitId, 'json').body);
		expect(Object.keys(json)).toEqual([
			'title',
			'species',
			'configuration',
			'fitted_by',
			'fitted_at',
			'observed_from',
			'rms_cm_1',
			'standard_deviation_cm_1',
			'degrees_of_freedom',
			'chi_square',
			'iterations',
			'converged',
			'method',
			'note',
			'parameters',
			'residuals'
		]);
		expect(json).toMatchObject({ configuration: '3d2', fitted_by: 'Ed Itor', observed_from: 'notes', degrees_of_freedom: 2 });
		expect(json.parameters[1]).toMatchObject({ parameter: 'F2(3d,3d)', status: 'free', at_bound: false });
		expect(json.parameters[1]['value_cm-1']).toBeCloseTo(61600, 3);
		expect(typeof json.residuals[0]['obs-calc_cm-1']).toBe('number');
		expect(json.residuals).toHaveLength(5);
	});

	it('LaTeX: two booktabs longtables with the parameters typeset as F^k, ζ and E_av', () => {
		const tex = exportFitReport(viewer, projectId, entryId, fitId, 'tex').body;
		expect(tex.match(/\\begin\{longtable\}/g)).toHaveLength(2);
		expect(tex).toContain('$F^{2}(3d,3d)$ & $61600.00$');
		expect(tex).toContain('$\\zeta_{3d}$ & $0.00$ & -- & fixed');
		expect(tex).toContain('$E_\\mathrm{av}$');
		expect(tex).toContain('$^{1}\\mathrm{S}$');
		expect(tex).toContain('Fitted parameters of 3d$^{2}$ (Invented 3d2 ion), fitted by Ed Itor on');
		expect(tex).toContain('rms 0.00 cm$^{-1}$, 2 degrees of freedom, 5 levels');
		// No raw Unicode superscripts or unescaped specials left in the typeset text.
		expect(tex).not.toMatch(/⁻¹|σ/);
	});
});
