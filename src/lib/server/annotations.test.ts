/**
 * Level annotations: editors write, viewers read, stale versions and unknown levels are refused
 * (product rules, common practice, no source). Each test works on a Shelf entry of its own, so any
 * one of them runs alone (`-t "<name>"`) and in any order.
 */
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry } from './services/shelf';
import { annotatedLevels, saveAnnotation } from './services/annotations';
import { exportAnnotatedLevels } from './services/exports';
import { statusOf } from './status-of';

let editor: Actor, reviewer: Actor, viewer: Actor, projectId: string, entryId: string;

beforeAll(async () => {
	editor = await signUp({ name: 'Ed Itor', email: 'ed@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vi Ewer', email: 'vi@example.org', password: 'long-enough-pw' });
	reviewer = await signUp({ name: 'Rita Reviewer', email: 'rita@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'P' }).id;
	addMember(editor, projectId, { email: 'rita@example.org', role: 'editor' });
	addMember(editor, projectId, { email: 'vi@example.org', role: 'viewer' });
});

beforeEach(() => {
	entryId = createEntry(editor, projectId, { title: 'O III ground', species: 'O III', notation: '1s2 2s2 2p2' }).id;
});

/** Another editor confirms the first note unchanged (its proposer may not: review rule, src/lib/review.ts). */
const confirmFirst = () =>
	saveAnnotation(reviewer, projectId, entryId, {
		levelKey: '3P#1|1',
		observedEnergy: 111.1,
		uncertainty: 0.2,
		status: 'confirmed',
		comment: 'invented value',
		version: 1
	});

/** An editor's first note on ³P₁ (version 1). */
const firstNote = () =>
	saveAnnotation(editor, projectId, entryId, {
		levelKey: '3P#1|1',
		observedEnergy: 111.1,
		uncertainty: 0.2,
		status: 'proposed',
		comment: 'invented value'
	});

describe('level annotations', () => {
	it('lists the 5 levels of 2p² (³P₀,₁,₂ ¹D₂ ¹S₀) with no notes yet', () => {
		// Levels of p²: Condon & Shortley (1935) ch. VII.
		const { levels } = annotatedLevels(viewer, projectId, entryId);
		expect(levels.map((l) => l.key).sort()).toEqual(['1D#1|2', '1S#1|0', '3P#1|0', '3P#1|1', '3P#1|2']);
		expect(levels.every((l) => l.annotation === null)).toBe(true);
	});

	it('an editor records an observed energy; who and when are kept', () => {
		const a = firstNote();
		expect(a).toMatchObject({ observedEnergy: 111.1, uncertainty: 0.2, version: 1, updatedBy: 'Ed Itor' });
		const kept = annotatedLevels(viewer, projectId, entryId).levels.find((l) => l.key === '3P#1|1')!.annotation!;
		expect(kept).toMatchObject({ observedEnergy: 111.1, comment: 'invented value', version: 1, updatedBy: 'Ed Itor' });
		expect(kept.updatedAt).toBeTruthy();
	});

	it('a stale version is refused and nothing changes', () => {
		firstNote();
		confirmFirst();
		expect(statusOf(() => saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|1', observedEnergy: 999, version: 1 }))).toBe(409);
		const note = annotatedLevels(viewer, projectId, entryId).levels.find((l) => l.key === '3P#1|1')!.annotation!;
		expect(note).toMatchObject({ observedEnergy: 111.1, status: 'confirmed', version: 2 });
	});

	it('a viewer cannot annotate; an unknown level or a bad number is a 400', () => {
		expect(statusOf(() => saveAnnotation(viewer, projectId, entryId, { levelKey: '3P#1|0', observedEnergy: 0 }))).toBe(403);
		expect(() => saveAnnotation(editor, projectId, entryId, { levelKey: '2D#1|5/2' })).toThrow(/is not a level of/);
		expect(() => saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|0', observedEnergy: Number.NaN })).toThrow(/number in cm⁻¹/);
		expect(() => saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|0', uncertainty: -1 })).toThrow(/must not be negative/);
	});

	it('exports the annotated levels as CSV and LaTeX', () => {
		firstNote();
		confirmFirst();
		const csv = exportAnnotatedLevels(viewer, projectId, entryId, 'csv').body;
		// g(³P₁) = 3/2 (Landé formula, g_s = 2: 1 + (2 + 2 − 2)/(2·2)).
		expect(csv).toContain('3P J=1,3P,1,1,3/2,111.1,0.2,confirmed,invented value,Rita Reviewer,');
		const tex = exportAnnotatedLevels(viewer, projectId, entryId, 'tex');
		expect(tex.filename).toBe('O_III_1s2_2s2_2p2.tex');
		expect(tex.body).toContain('$^{3}\\mathrm{P}_{1}$ & $3/2$ & $111.1$ & $0.2$ & confirmed');
		expect(tex.body).not.toContain('Rita Reviewer');
	});
});
