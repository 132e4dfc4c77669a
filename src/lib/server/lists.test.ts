/**
 * Saved level and line lists and identifications: CSV uploads checked row by row (each refusal names row,
 * column and reason), the stated limits, nothing saved from a file with a problem, roles (editors write, viewers
 * read, others see nothing), blends, lists from Shelf notes, exports and deletion. Product rules: common practice,
 * no source, unless a value says otherwise. The demo lists are invented (src/lib/lines/demo.ts).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import type { Actor } from './access';
import { db } from './db';
import { activityLog, identifications, levelListRows, lineListRows } from './db/schema';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry } from './services/shelf';
import { saveAnnotation } from './services/annotations';
import { deleteList, getLevelList, getLineList, levelListFromShelf, listLists, uploadLevelList, uploadLineList } from './services/lists';
import { judgeCandidate, listIdentifications } from './services/identifications';
import { matchSavedLists } from './services/saved-match';
import { exportIdentifiedLines, exportUnobservedLines } from './services/list-exports';
import { statusOf, refusal } from './status-of';
import { ServiceError } from './errors';
import { DEMO_LEVEL_UPLOAD, DEMO_LINE_UPLOAD } from '../lines/demo';
import { MAX_UPLOAD_ROWS, parseLevelUpload, parseLineUpload } from '../lines/uploads';

let editor: Actor, viewer: Actor, outsider: Actor, projectId: string;

beforeAll(async () => {
	editor = await signUp({ name: 'Ed Itor', email: 'ed@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vi Ewer', email: 'vi@example.org', password: 'long-enough-pw' });
	outsider = await signUp({ name: 'Out Sider', email: 'out@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'Lists' }).id;
	addMember(editor, projectId, { email: 'vi@example.org', role: 'viewer' });
});

const rowsSaved = () => ({
	levels: db.select({ n: count() }).from(levelListRows).get()!.n,
	lines: db.select({ n: count() }).from(lineListRows).get()!.n,
	log: db.select({ n: count() }).from(activityLog).where(eq(activityLog.projectId, projectId)).get()!.n
});

const problemsOf = (e: ServiceError) => e.details.problems as { row: number; column: string; message: string }[];

describe('level files', () => {
	it('reads the invented demo list field by field: energy digits as typed, J as text, ° kept', () => {
		const r = parseLevelUpload(DEMO_LEVEL_UPLOAD);
		expect(r.problems).toEqual([]);
		expect(r.rows).toHaveLength(12);
		expect(r.rows[6]).toEqual({
			energy: 44310.35,
			energyText: '44310.35',
			uncertainty: 0.02,
			J: '1',
			parity: 'odd',
			configuration: '2p3s',
			term: '3P°',
			g: null
		});
		// 1.5 is read as the half-integer 3/2; "1.20" keeps its digits.
		expect(parseLevelUpload('energy,J,parity,g\n1.20,1.5,o,1.334').rows[0]).toMatchObject({ energyText: '1.20', J: '3/2', g: 1.334 });
	});

	it.each([
		['energy', 'abc,1,even', /energy "abc" must be a number of cm⁻¹/],
		['energy', '0x10,1,even', /must be a number/],
		['J', '0,5/3,even', /J "5\/3" must be 0, 1, 2, … or a half-integer/],
		['parity', '0,1,up', /parity "up" must be even or odd/],
		['uncertainty', '0,1,even,-1', /uncertainty "-1" must be a number ≥ 0/],
		['term', '0,1,even,,2X', /./],
		['term', '0,1,even,,3P°', /marked odd \(°\) but the parity is even/],
		['g', '0,1,even,,3P,one', /g "one" must be a number/]
	])('refuses a bad %s cell, naming row 2 and the column', (column, row, reason) => {
		const r = parseLevelUpload(`energy,J,parity,uncertainty,term,g\n0,0,even\n${row}`);
		expect(r.rows).toEqual([]);
		expect(r.problems).toHaveLength(1);
		expect(r.problems[0]).toMatchObject({ row: 2, column });
		expect(r.problems[0].message).toMatch(reason);
	});

	it('refuses a missing or unknown column in the header (row 0)', () => {
		expect(parseLevelUpload('energy,J\n0,0').problems[0]).toMatchObject({ row: 0, column: 'parity' });
		expect(parseLevelUpload('energy,J,parity,colour\n0,0,e').problems[0]).toMatchObject({ row: 0, column: 'colour' });
		expect(parseLevelUpload('energy,J,parity,colour\n0,0,e').problems[0].message).toMatch(/allowed: energy, uncertainty, J/);
	});
});

describe('line files', () => {
	it('reads the invented demo list: 21 lines, the digits as typed, a comment', () => {
		const r = parseLineUpload(DEMO_LINE_UPLOAD);
		expect(r.problems).toEqual([]);
		expect(r.rows).toHaveLength(21);
		expect(r.rows[20]).toEqual({
			wavelength: 5012.345,
			wavelengthText: '5012.345',
			unit: 'A',
			medium: 'air',
			uncertainty: 0.005,
			intensity: 40,
			comment: 'unidentified in the invented model'
		});
		expect(parseLineUpload('wavelength,unit,medium\n500.10,nm,vacuum\n20000,cm-1,vacuum\n5000,Å,Air').rows.map((l) => l.unit)).toEqual([
			'nm',
			'cm-1',
			'A'
		]);
	});

	it.each([
		['wavelength', '-3,A,air', /wavelength "-3" must be a positive number/],
		['unit', '5000,furlong,air', /unit "furlong" must be A \(or Å\), nm or cm-1/],
		['medium', '5000,A,water', /medium "water" must be air or vacuum/],
		// Morton (2000): air wavelengths start at the air image of 2000 Å vacuum, ≈ 1999.35 Å.
		['medium', '1500,A,air', /given in vacuum by convention/],
		['uncertainty', '5000,A,air,x', /uncertainty "x" must be a number ≥ 0/],
		['intensity', '5000,A,air,,-4', /intensity "-4" must be a number ≥ 0/],
		['comment', `5000,A,air,,,${'x'.repeat(201)}`, /at most 200 are allowed/]
	])('refuses a bad %s cell, naming row 2 and the column', (column, row, reason) => {
		const r = parseLineUpload(`wavelength,unit,medium,uncertainty,intensity,comment\n5000,A,air\n${row}`);
		expect(r.rows).toEqual([]);
		expect(r.problems[0]).toMatchObject({ row: 2, column });
		expect(r.problems[0].message).toMatch(reason);
	});

	it('counts every problem and lists each with its row', () => {
		const bad = Array.from({ length: 30 }, (_, i) => `${i % 2 ? '-1' : '5000'},${i % 2 ? 'A' : 'pc'},air`).join('\n');
		const r = parseLineUpload(`wavelength,unit,medium\n${bad}`);
		expect(r.problemCount).toBe(30);
		expect(r.problems.map((p) => p.row)).toEqual(Array.from({ length: 30 }, (_, i) => i + 1));
	});
});

describe('uploads', () => {
	it('saves a checked level file in one piece with its activity row, and lists it', () => {
		const before = rowsSaved();
		const { list, preview } = uploadLevelList(editor, projectId, { name: 'Demo levels', csv: DEMO_LEVEL_UPLOAD }, { save: true });
		expect(list).toMatchObject({ name: 'Demo levels', source: 'upload', rowCount: 12, createdBy: 'Ed Itor', version: 1 });
		expect(preview.first).toHaveLength(12);
		const after = rowsSaved();
		expect(after.levels - before.levels).toBe(12);
		expect(after.log - before.log).toBe(1);
		const { rows } = getLevelList(viewer, projectId, list!.id);
		expect(rows.map((r) => r.position)).toEqual(Array.from({ length: 12 }, (_, i) => i + 1));
		expect(rows[4]).toMatchObject({ energy: 33702.2, energyText: '33702.2', J: '0', parity: 'even', term: '1S', uncertainty: 0.05 });
		expect(listLists(viewer, projectId).levelLists.map((l) => l.id)).toContain(list!.id);
	});

	it('a preview saves nothing and returns the first rows and every problem', () => {
		const before = rowsSaved();
		const r = uploadLevelList(editor, projectId, { name: 'x', csv: 'energy,J,parity\n0,0,even\nzero,1,odd\n1,2/3,even' }, { save: false });
		expect(r.list).toBeNull();
		expect(r.preview.problemCount).toBe(2);
		expect(r.preview.problems.map((p) => `${p.row}:${p.column}`)).toEqual(['2:energy', '3:J']);
		expect(rowsSaved()).toEqual(before);
	});

	it('a file with one bad row among good ones saves nothing: 422 with every problem', () => {
		const before = rowsSaved();
		const csv = DEMO_LINE_UPLOAD + '\n5000,A,plasma,,,';
		const e = refusal(() => uploadLineList(editor, projectId, { name: 'bad', csv }, { save: true }));
		expect(e.status).toBe(422);
		expect(e.message).toMatch(/Nothing was saved: the line file has 1 problem/);
		expect(problemsOf(e)).toEqual([{ row: 22, column: 'medium', message: 'medium "plasma" must be air or vacuum' }]);
		expect(rowsSaved()).toEqual(before);
	});

	it('states the limits: over 5 MB is 413, over 200 000 rows is refused, an empty file is 400', () => {
		const big = 'energy,J,parity\n' + '0,0,even\n'.repeat(Math.ceil((5 * 1024 * 1024) / 9) + 1);
		const e = refusal(() => uploadLevelList(editor, projectId, { name: 'big', csv: big }, { save: true }));
		expect(e.status).toBe(413);
		expect(e.message).toMatch(/at most 5 MB and 200,000 rows/);
		const many = 'energy,J,parity\n' + '1,0,e\n'.repeat(MAX_UPLOAD_ROWS + 1);
		const before = rowsSaved();
		const r = refusal(() => uploadLevelList(editor, projectId, { name: 'many', csv: many }, { save: true }));
		expect(r.status).toBe(422);
		expect(problemsOf(r)[0].message).toMatch(/more than 200000 rows/);
		expect(rowsSaved()).toEqual(before);
		// Exactly at the limit is accepted by the reader.
		expect(parseLevelUpload('energy,J,parity\n' + '1,0,e\n'.repeat(MAX_UPLOAD_ROWS)).rows).toHaveLength(MAX_UPLOAD_ROWS);
		expect(statusOf(() => uploadLevelList(editor, projectId, { name: 'e', csv: '  ' }, { save: true }))).toBe(400);
		expect(statusOf(() => uploadLevelList(editor, projectId, { name: ' ', csv: DEMO_LEVEL_UPLOAD }, { save: true }))).toBe(400);
	});

	it('roles: a viewer may read but not upload or delete; a non-member sees no project', () => {
		const before = rowsSaved();
		expect(statusOf(() => uploadLevelList(viewer, projectId, { name: 'v', csv: DEMO_LEVEL_UPLOAD }, { save: true }))).toBe(403);
		expect(statusOf(() => uploadLineList(viewer, projectId, { name: 'v', csv: DEMO_LINE_UPLOAD }, { save: false }))).toBe(403);
		expect(rowsSaved()).toEqual(before);
		const id = listLists(viewer, projectId).levelLists[0].id;
		expect(statusOf(() => deleteList(viewer, projectId, 'levels', id))).toBe(403);
		expect(statusOf(() => listLists(outsider, projectId))).toBe(404);
		expect(statusOf(() => getLevelList(outsider, projectId, id))).toBe(404);
		expect(statusOf(() => uploadLevelList(outsider, projectId, { name: 'o', csv: DEMO_LEVEL_UPLOAD }, { save: false }))).toBe(404);
	});
});

describe('identifications', () => {
	/** Two even levels and three odd ones, invented; a line in cm⁻¹ (vacuum), so σ_obs is the value itself. */
	const LEVELS = 'energy,J,parity,term\n0,0,even,3P\n100,1,even,3P\n30000.10,1,odd,3D°\n30000.20,2,odd,3D°\n30100,1,odd,1P°';
	const LINES = 'wavelength,unit,medium,uncertainty,intensity\n30000.15,cm-1,vacuum,0.1,50\n29900.05,cm-1,vacuum,0.01,20';
	let levelListId: string, lineListId: string;
	let level: (energyText: string) => number, line: (position: number) => number;

	beforeAll(() => {
		levelListId = uploadLevelList(editor, projectId, { name: 'blend levels', csv: LEVELS }, { save: true }).list!.id;
		lineListId = uploadLineList(editor, projectId, { name: 'blend lines', csv: LINES }, { save: true }).list!.id;
		const lv = getLevelList(editor, projectId, levelListId).rows;
		const ln = getLineList(editor, projectId, lineListId).rows;
		level = (t) => lv.find((r) => r.energyText === t)!.id;
		line = (p) => ln.find((r) => r.position === p)!.id;
	});

	it('the matcher on saved lists finds both pairs within the line (a blend candidate)', () => {
		const m = matchSavedLists(viewer, projectId, { levelListId, lineListId, toleranceUnit: 'cm-1', tolerance: 0.1 });
		const first = m.result.matches[0];
		// 30000.15 − 30000.10 = +0.05 and 30000.15 − 30000.20 = −0.05 cm⁻¹ (arithmetic); 0→J=2 is not E1 (ΔJ = 2).
		expect(first.candidates.map((c) => m.levels[c.upper].energyText).sort()).toEqual(['30000.10']);
		const m2 = matchSavedLists(viewer, projectId, { levelListId, lineListId, toleranceUnit: 'cm-1', tolerance: 0.2 });
		expect(m2.result.matches[1].candidates.map((c) => [m2.levels[c.lower].energyText, m2.levels[c.upper].energyText])).toEqual([
			['100', '30000.10'],
			['100', '30000.20']
		]);
	});

	it('accepts two candidates on one line (a blend), computes the residual itself, and logs each verdict', () => {
		const before = rowsSaved();
		const a = judgeCandidate(editor, projectId, {
			lineId: line(2),
			lowerLevelId: level('100'),
			upperLevelId: level('30000.10'),
			type: 'E1',
			status: 'accepted',
			note: 'main component'
		});
		const b = judgeCandidate(editor, projectId, {
			lineId: line(2),
			lowerLevelId: level('100'),
			upperLevelId: level('30000.20'),
			type: 'E1',
			status: 'accepted',
			note: 'blended'
		});
		// σ_obs − (E_u − E_l): 29900.05 − 29900.10 = −0.05 and 29900.05 − 29900.20 = −0.15 cm⁻¹ (arithmetic).
		expect(a.residual).toBeCloseTo(-0.05, 9);
		expect(b.residual).toBeCloseTo(-0.15, 9);
		expect(a).toMatchObject({ status: 'accepted', updatedBy: 'Ed Itor', note: 'main component', levelListId, lineListId });
		const accepted = listIdentifications(viewer, projectId, { lineListId, status: 'accepted' });
		expect(accepted.filter((x) => x.lineId === line(2))).toHaveLength(2);
		const csv = exportIdentifiedLines(viewer, projectId, lineListId, 'csv').body;
		expect(csv.split('\r\n')[0]).toMatch(/^line,wavelength,unit,medium,uncertainty,intensity,lower,lower_energy_cm-1,upper/);
		expect(csv.split('\r\n').filter((r) => r.startsWith('2,29900.05,cm-1'))).toHaveLength(2);
		expect(csv).toMatch(/,2,main component,/);
		expect(rowsSaved().log - before.log).toBe(2);
	});

	it('a new verdict on the same pair changes the row (rejected, with its note); the blend drops to one', () => {
		const v = judgeCandidate(editor, projectId, {
			lineId: line(2),
			lowerLevelId: level('100'),
			upperLevelId: level('30000.20'),
			type: 'E1',
			status: 'rejected',
			note: 'too far'
		});
		expect(v).toMatchObject({ status: 'rejected', note: 'too far', version: 2 });
		const json = JSON.parse(exportIdentifiedLines(viewer, projectId, lineListId, 'json').body);
		expect(json.rows).toHaveLength(1);
		expect(json.rows[0]).toMatchObject({ line: 2, wavelength: 29900.05, blend_of: 1, type: 'E1' });
	});

	it('refuses pairs the rules forbid, reversed pairs, viewers and ids from elsewhere', () => {
		const base = { lineId: line(1), type: 'E1', status: 'accepted' };
		// E1 needs a parity change (Condon & Shortley ch. IX): both even levels → refused.
		const e = refusal(() => judgeCandidate(editor, projectId, { ...base, lowerLevelId: level('0'), upperLevelId: level('100') }));
		expect(e.status).toBe(400);
		expect(e.message).toMatch(/E1 does not connect J=0 \(even\) with J=1 \(even\)/);
		expect(statusOf(() => judgeCandidate(editor, projectId, { ...base, lowerLevelId: level('30000.10'), upperLevelId: level('0') }))).toBe(
			400
		);
		expect(statusOf(() => judgeCandidate(viewer, projectId, { ...base, lowerLevelId: level('0'), upperLevelId: level('30000.10') }))).toBe(
			403
		);
		expect(
			statusOf(() =>
				judgeCandidate(editor, projectId, { ...base, lineId: 999999, lowerLevelId: level('0'), upperLevelId: level('30000.10') })
			)
		).toBe(404);
		expect(
			statusOf(() =>
				judgeCandidate(editor, projectId, { ...base, status: 'maybe', lowerLevelId: level('0'), upperLevelId: level('30000.10') })
			)
		).toBe(400);
	});

	it('exports the strong predicted lines nobody observed, with vacuum and air wavelengths', () => {
		const json = JSON.parse(
			exportUnobservedLines(viewer, projectId, { levelListId, lineListId, toleranceUnit: 'cm-1', tolerance: 0.01 }, 'json').body
		);
		// ³P₁ – ³D°₂ at 29900.20 cm⁻¹ lies 0.15 from the nearest line, outside 0.01, so it is predicted and not observed.
		// Its LS strength is 45 of the multiplet's strongest 84 (³P–³D table: 84, 45, 20, 15, 15, 1; from memory of
		// the standard multiplet tables, e.g. Allen's Astrophysical Quantities), so it counts as strong (≥ 0.5).
		const row = json.rows.find((r: { lower: string; upper: string }) => r.lower === '3P J=1' && r.upper === '3D° J=2');
		expect(row['ritz_wavenumber_cm-1']).toBeCloseTo(29900.2, 6);
		expect(row.strength_of_strongest_in_multiplet).toBeCloseTo(45 / 84, 3);
		expect(row.vacuum_wavelength_A).toBeCloseTo(1e8 / 29900.2, 3);
		expect(row.air_wavelength_A).toBeLessThan(row.vacuum_wavelength_A);
	});

	it('deleting the line list removes its rows and identifications in one logged change', () => {
		const before = rowsSaved();
		deleteList(editor, projectId, 'lines', lineListId);
		expect(db.select({ n: count() }).from(identifications).get()!.n).toBe(0);
		expect(before.lines - rowsSaved().lines).toBe(2);
		expect(rowsSaved().log - before.log).toBe(1);
		expect(statusOf(() => getLineList(editor, projectId, lineListId))).toBe(404);
	});
});

describe('level lists from Shelf notes', () => {
	it('takes the observed energies of notes of both parities (disputed ones left out)', () => {
		const even = createEntry(editor, projectId, { title: 'even', notation: '1s2 2s2 2p2' }).id;
		const odd = createEntry(editor, projectId, { title: 'odd', notation: '1s2 2s2 2p 3s' }).id;
		saveAnnotation(editor, projectId, even, { levelKey: '3P#1|0', observedEnergy: '0', status: 'proposed' });
		saveAnnotation(editor, projectId, even, {
			levelKey: '3P#1|1',
			observedEnergy: '113.20',
			status: 'proposed'
		});
		saveAnnotation(editor, projectId, odd, { levelKey: '3P#1|1', observedEnergy: 52000.5, uncertainty: 0.3, status: 'proposed' });
		const list = levelListFromShelf(editor, projectId, { name: 'from shelf', entryIds: [even, odd] });
		expect(list).toMatchObject({ source: 'shelf', rowCount: 3, sourceEntries: [even, odd] });
		const rows = getLevelList(viewer, projectId, list.id).rows;
		expect(rows.map((r) => [r.energyText, r.J, r.parity, r.term, r.configuration])).toEqual([
			['0', '0', 'even', '3P', '1s2 2s2 2p2'],
			['113.20', '1', 'even', '3P', '1s2 2s2 2p2'],
			['52000.5', '1', 'odd', '3P°', '1s2 2s2 2p 3s']
		]);
		expect(statusOf(() => levelListFromShelf(viewer, projectId, { name: 'v', entryIds: [even] }))).toBe(403);
		const empty = createEntry(editor, projectId, { title: 'none', notation: '2p' }).id;
		expect(statusOf(() => levelListFromShelf(editor, projectId, { name: 'n', entryIds: [empty] }))).toBe(400);
	});
});
