/**
 * The Shelf never loses or bends a value: energies as typed, partial edits, notes that survive a
 * configuration change, species checks, paging. Level lists: p² and p⁴ both give ³P₀,₁,₂ ¹D₂ ¹S₀
 * (Condon & Shortley 1935, ch. VII); f³ has 17 terms and f² 7 (Cowan 1981, table 4-5 / 5-2,
 * from memory). Product rules otherwise: common practice, no source.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { refusal } from './status-of';
import type { Actor } from './access';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry, getEntry, listEntries, notesDetachedBy, updateEntry } from './services/shelf';
import { annotatedLevels, deleteAnnotationById, listAnnotations, reattachAnnotation, saveAnnotation } from './services/annotations';
import { exportAnnotatedLevels } from './services/exports';

let editor: Actor, viewer: Actor, projectId: string;

beforeAll(async () => {
	editor = await signUp({ name: 'Ed Itor', email: 'ed-values@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vi Ewer', email: 'vi-values@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'Values' }).id;
	addMember(editor, projectId, { email: 'vi-values@example.org', role: 'viewer' });
});

const entry = (notation: string, species = '', title = 'T') => createEntry(editor, projectId, { title, species, notation });

describe('energies as typed', () => {
	it('17,300 is refused as ambiguous instead of becoming 17.3', () => {
		const e = entry('1s2 2s2 2p2', 'O III');
		const err = refusal(() => saveAnnotation(editor, projectId, e.id, { levelKey: '3P#1|1', observedEnergy: '17,300' }));
		expect(err.status).toBe(400);
		expect(err.message).toMatch(/comma, which is ambiguous/);
		expect(listAnnotations(viewer, projectId, e.id)).toHaveLength(0);
	});

	it('19 000 (space), 19 000 (thin space) and −12400 (U+2212) are read; 1880 stays 1880, 19500.12345 is not rounded', () => {
		const e = entry('1s2 2s2 2p2', 'O III');
		expect(saveAnnotation(editor, projectId, e.id, { levelKey: '3P#1|1', observedEnergy: '19 000' })).toMatchObject({
			observedEnergy: 19000,
			observedEnergyText: '19000'
		});
		expect(saveAnnotation(editor, projectId, e.id, { levelKey: '3P#1|2', observedEnergy: '19\u2009000.5' }).observedEnergy).toBe(19000.5);
		expect(saveAnnotation(editor, projectId, e.id, { levelKey: '1D#1|2', observedEnergy: '−12400' }).observedEnergy).toBe(-12400);
		expect(saveAnnotation(editor, projectId, e.id, { levelKey: '1S#1|0', observedEnergy: 1880 }).observedEnergyText).toBe('1880');
		expect(
			saveAnnotation(editor, projectId, e.id, { levelKey: '3P#1|0', observedEnergy: '19500.12345', uncertainty: '0.00020' })
		).toMatchObject({ observedEnergyText: '19500.12345', uncertaintyText: '0.00020' });
		const csv = exportAnnotatedLevels(viewer, projectId, e.id, 'csv').body;
		expect(csv).toContain(',19500.12345,0.00020,');
		expect(csv).toContain(',1880,');
	});

	it('an uncertainty without an energy is refused with a message', () => {
		const e = entry('1s2 2s2 2p2', 'O III');
		const err = refusal(() => saveAnnotation(editor, projectId, e.id, { levelKey: '3P#1|1', uncertainty: 0.5 }));
		expect(err.message).toMatch(/uncertainty needs an observed energy/);
		expect(err.details.field).toBe('uncertainty');
	});
});

describe('partial edits', () => {
	it('PATCH with only title and version keeps species, notes and tags', () => {
		const e = createEntry(editor, projectId, { title: 'Old', species: 'Fe II', notation: '[Ar] 3d6 4s', notes: 'keep me', tags: ['iron'] });
		const after = updateEntry(editor, projectId, e.id, { title: 'New', version: e.version });
		expect(after).toMatchObject({ title: 'New', species: 'Fe II', notation: '[Ar] 3d6 4s', notes: 'keep me', tags: ['iron'] });
	});
});

describe('the three exports agree', () => {
	// Nd IV 4f³: odd parity (l = 3, three electrons) with ground level ⁴I₉/₂ by Hund's rules — a
	// general fact of the field (the Nd³⁺ ground level, e.g. Dieke 1968). The rest is product rule.
	it('an odd-parity [Xe] 4f3 entry: the same ° mark and the configuration as typed in CSV, JSON and LaTeX', () => {
		const e = entry('[Xe] 4f3', 'Nd IV', 'Nd IV ground term');
		saveAnnotation(editor, projectId, e.id, { levelKey: '4I#1|9/2', observedEnergy: '0', comment: 'ground' });
		const csv = exportAnnotatedLevels(viewer, projectId, e.id, 'csv').body.split('\r\n');
		expect(csv[0].split(',').slice(0, 2)).toEqual(['configuration', 'level']);
		const ground = csv.find((line) => line.includes(',ground,'))!;
		expect(ground.startsWith('[Xe] 4f3,4I° J=9/2,4I°,')).toBe(true);
		expect(csv.filter((l) => l.startsWith('[Xe] 4f3,')).length).toBe(csv.filter(Boolean).length - 1);

		const json = JSON.parse(exportAnnotatedLevels(viewer, projectId, e.id, 'json').body);
		expect(json).toMatchObject({ configuration: '[Xe] 4f3', parity: 'odd', species: 'Nd IV' });
		const row = json.rows.find((r: { comment: string | null }) => r.comment === 'ground');
		expect(row).toMatchObject({ level: '4I° J=9/2', term: '4I°', J: '9/2' });

		const tex = exportAnnotatedLevels(viewer, projectId, e.id, 'tex').body;
		expect(tex).toContain('$^{4}\\mathrm{I}^{\\circ}_{9/2}$');
		expect(tex).toContain('[Xe]~4f$^{3}$');
		expect(tex).not.toMatch(/1s\$\^\{2\}/);
		expect(tex).toContain('longtable');
	});
});

describe('a configuration change keeps every note, detached', () => {
	it('4f3 → 4f2 detaches all ten notes; they stay in the API, the page data and the exports', () => {
		const e = entry('[Xe] 4f3', 'Nd IV');
		const keys = annotatedLevels(viewer, projectId, e.id)
			.levels.slice(0, 10)
			.map((l) => l.key);
		keys.forEach((levelKey, i) => saveAnnotation(editor, projectId, e.id, { levelKey, observedEnergy: String(1000 * i) }));
		expect(notesDetachedBy(viewer, projectId, e.id, { notation: '[Xe] 4f2' })).toBe(10);
		const result = updateEntry(editor, projectId, e.id, { notation: '[Xe] 4f2', species: 'Nd V', version: e.version });
		expect(result.detachedNotes).toBe(10);
		const notes = listAnnotations(viewer, projectId, e.id);
		expect(notes).toHaveLength(10);
		expect(notes.every((n) => n.detached && n.detachedFrom === '[Xe] 4f3')).toBe(true);
		const page = annotatedLevels(viewer, projectId, e.id);
		expect(page.detached).toHaveLength(10);
		expect(page.levels.every((l) => l.annotation === null)).toBe(true);
		const json = JSON.parse(exportAnnotatedLevels(viewer, projectId, e.id, 'json').body);
		expect(json.detached_notes).toHaveLength(10);
		expect(exportAnnotatedLevels(viewer, projectId, e.id, 'csv').body).toContain('detached_from');
		expect(exportAnnotatedLevels(viewer, projectId, e.id, 'tex').body).toContain('Notes detached');
	});

	it('O III 2p2 → 2p4 does not move the ³P₁ note onto the new ³P₁; it is detached and can be reattached', () => {
		const e = entry('1s2 2s2 2p2', 'O III');
		const note = saveAnnotation(editor, projectId, e.id, { levelKey: '3P#1|1', observedEnergy: '113.178', comment: 'for 2p2' });
		updateEntry(editor, projectId, e.id, { notation: '1s2 2s2 2p4', species: 'O I', version: e.version });
		const page = annotatedLevels(viewer, projectId, e.id);
		expect(page.levels.find((l) => l.key === '3P#1|1')!.annotation).toBeNull();
		expect(page.detached.map((n) => n.comment)).toEqual(['for 2p2']);
		// The new ³P₁ can get its own note while the detached one waits.
		saveAnnotation(editor, projectId, e.id, { levelKey: '3P#1|1', observedEnergy: '158.265' });
		expect(refusal(() => reattachAnnotation(editor, projectId, e.id, note.id, { levelKey: '3P#1|1', version: 1 })).status).toBe(409);
		const moved = reattachAnnotation(editor, projectId, e.id, note.id, { levelKey: '3P#1|0', version: 1 });
		expect(moved).toMatchObject({ levelKey: '3P#1|0', detached: false, version: 2, observedEnergyText: '113.178' });
		expect(refusal(() => reattachAnnotation(viewer, projectId, e.id, note.id, { levelKey: '3P#1|2', version: 2 })).status).toBe(403);
		expect(refusal(() => reattachAnnotation(editor, projectId, e.id, note.id, { levelKey: '2D#1|3/2', version: 2 })).status).toBe(400);
	});

	it('the same configuration written differently keeps the notes attached: 2p2 → [He] 2s2 2p2', () => {
		const e = entry('2p2', 'O III');
		saveAnnotation(editor, projectId, e.id, { levelKey: '1D#1|2', observedEnergy: '20273.27' });
		expect(notesDetachedBy(viewer, projectId, e.id, { notation: '[He] 2s2.2p2' })).toBe(0);
		expect(updateEntry(editor, projectId, e.id, { notation: '[He] 2s2.2p2', version: e.version }).detachedNotes).toBe(0);
		expect(annotatedLevels(viewer, projectId, e.id).levels.find((l) => l.key === '1D#1|2')!.annotation).not.toBeNull();
	});

	it('a detached note can be deleted by id; viewers cannot', () => {
		const e = entry('2p2', 'O III');
		const note = saveAnnotation(editor, projectId, e.id, { levelKey: '1S#1|0', observedEnergy: '43185.74' });
		updateEntry(editor, projectId, e.id, { notation: '2p3', species: 'O II', version: e.version });
		expect(refusal(() => deleteAnnotationById(viewer, projectId, e.id, note.id)).status).toBe(403);
		deleteAnnotationById(editor, projectId, e.id, note.id);
		expect(listAnnotations(viewer, projectId, e.id)).toHaveLength(0);
	});
});

describe('species against configuration', () => {
	it('O III with 2p4 and Nd IV with 4f2 are saved with a warning that says what was assumed', () => {
		const o = entry('2p4', 'O III');
		expect(o.warnings[0]).toMatch(/O III has 6 electrons .* holds 8 .*1s2 2s2 assumed/);
		expect(entry('4f2', 'Nd IV').warnings[0]).toMatch(/Nd IV has 57 electrons/);
		expect(entry('2p2', 'O III').warnings).toEqual([]);
		expect(getEntry(viewer, projectId, o.id).warnings).toHaveLength(1);
	});
});

describe('paging the Shelf', () => {
	it('pages of `limit` entries, newest first, with a cursor; every entry exactly once', async () => {
		const p = createProject(editor, { name: 'Many' }).id;
		for (let i = 0; i < 7; i++) createEntry(editor, p, { title: `Entry ${i}`, notation: '2p2', tags: i % 2 ? ['odd'] : [] });
		const seen: string[] = [];
		let cursor: string | undefined;
		let pages = 0;
		do {
			const page = listEntries(viewer.id === editor.id ? viewer : editor, p, { limit: '3', ...(cursor ? { cursor } : {}) });
			expect(page.entries.length).toBeLessThanOrEqual(3);
			seen.push(...page.entries.map((e) => e.title));
			cursor = page.nextCursor ?? undefined;
			pages++;
		} while (cursor);
		expect(pages).toBe(3);
		expect(new Set(seen).size).toBe(7);
		expect(listEntries(editor, p, { q: 'odd' }).entries).toHaveLength(3);
		expect(listEntries(editor, p, { q: '100%' }).entries).toHaveLength(0);
		expect(refusal(() => listEntries(editor, p, { limit: '500' })).message).toMatch(/from 1 to 200/);
		expect(refusal(() => listEntries(editor, p, { cursor: 'nonsense' })).message).toMatch(/cursor/);
	});
});
