/**
 * Saving a pasted column of energies: one transaction for all lines (a refused line or a stale note
 * saves nothing), editors only, one activity row and one history row per note in the same
 * transaction, notes saved under the review rule of src/lib/review.ts (new values are proposed by
 * the person who pastes; repeating a note's values keeps its status). Product rules (common practice for shared records, no source). Levels of 2p²:
 * ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII). Energies are invented.
 */
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry } from './services/shelf';
import { annotatedLevels, saveAnnotation } from './services/annotations';
import { listActivity } from './services/activity';
import { noteHistory } from './services/note-history';
import { pasteNotes, previewPaste } from './services/paste-notes';
import { sqlite } from './db';
import { statusOf, refusal } from './status-of';

let editor: Actor, reviewer: Actor, viewer: Actor, outsider: Actor, projectId: string, entryId: string;

beforeAll(async () => {
	editor = await signUp({ name: 'Ed Itor', email: 'ed@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vi Ewer', email: 'vi@example.org', password: 'long-enough-pw' });
	outsider = await signUp({ name: 'Out Sider', email: 'out@example.org', password: 'long-enough-pw' });
	reviewer = await signUp({ name: 'Rita Reviewer', email: 'rita@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'P' }).id;
	addMember(editor, projectId, { email: 'rita@example.org', role: 'editor' });
	addMember(editor, projectId, { email: 'vi@example.org', role: 'viewer' });
});

beforeEach(() => {
	entryId = createEntry(editor, projectId, { title: 'O III ground', species: 'O III', notation: '1s2 2s2 2p2' }).id;
});

const notes = () => new Map(annotatedLevels(viewer, projectId, entryId).levels.map((l) => [l.key, l.annotation]));
const noteRows = () =>
	listActivity(viewer, projectId, { kind: 'note.saved', limit: 200 }).items.filter((a) => a.subject === `entry:${entryId}`);
const historyOf = (key: string) => noteHistory(viewer, projectId, entryId, notes().get(key)!.id);
/** History rows of this entry's notes, deleted ones included. */
const historyCount = () =>
	(sqlite.prepare('select count(*) as n from level_annotation_history where entry_id = ?').get(entryId) as { n: number }).n;

const BRIEF = '0  3P0\n16.4 3P1 ±0.2\n43.5  J=2 3P2';
const seenNone = { '3P#1|0': 0, '3P#1|1': 0, '3P#1|2': 0 };

describe('pasting energies', () => {
	it('an editor saves three lines at once: digits as typed, status proposed, one note.saved row per note', () => {
		expect(pasteNotes(editor, projectId, entryId, { text: BRIEF, seen: seenNone })).toEqual({ saved: 3, replaced: 0 });
		const n = notes();
		expect(n.get('3P#1|0')).toMatchObject({ observedEnergyText: '0', uncertaintyText: null, status: 'proposed', version: 1 });
		expect(n.get('3P#1|1')).toMatchObject({
			observedEnergy: 16.4,
			observedEnergyText: '16.4',
			uncertaintyText: '0.2',
			updatedBy: 'Ed Itor'
		});
		expect(n.get('3P#1|2')).toMatchObject({ observedEnergyText: '43.5' });
		expect(n.get('1D#1|2')).toBeNull();
		const rows = noteRows();
		expect(rows).toHaveLength(3);
		expect(rows.map((r) => r.summary)).toContain('pasted the note on 3P J=1 of “O III ground”: 16.4 ± 0.2 cm⁻¹ (proposed)');
	});

	it('one refused line saves nothing, and the message says so and names the line', () => {
		const e = refusal(() => pasteNotes(editor, projectId, entryId, { text: `${BRIEF}\n17,300 1D2`, seen: seenNone }));
		expect(e.status).toBe(400);
		expect(e.message).toMatch(/^Nothing was saved: 1 of 4 lines cannot be placed \(line 4: Observed energy "17,300" has a comma/);
		expect(e.details.lines).toHaveLength(1);
		expect([...notes().values()].every((a) => a === null)).toBe(true);
		expect(noteRows()).toHaveLength(0);
	});

	it('an empty paste is refused with an example of a line', () => {
		expect(() => pasteNotes(editor, projectId, entryId, { text: '\n# heading only\n', seen: {} })).toThrow(/Nothing to save: .*16\.4 3P1/);
	});

	it('viewers are refused (403) before anything is read; non-members get 404', () => {
		expect(statusOf(() => pasteNotes(viewer, projectId, entryId, { text: BRIEF, seen: seenNone }))).toBe(403);
		expect(statusOf(() => previewPaste(viewer, projectId, entryId, BRIEF))).toBe(403);
		expect(statusOf(() => pasteNotes(outsider, projectId, entryId, { text: BRIEF, seen: seenNone }))).toBe(404);
		// A viewer is refused even with input that would be a 400 for an editor: the role is checked first.
		expect(statusOf(() => pasteNotes(viewer, projectId, entryId, { text: 42 }))).toBe(403);
		expect([...notes().values()].every((a) => a === null)).toBe(true);
	});

	it('an existing note is replaced with the version the preview saw: proposed again, the comment kept, the old ± cleared', () => {
		saveAnnotation(editor, projectId, entryId, { levelKey: '1D#1|2', observedEnergy: '1880', uncertainty: '0.5', comment: 'old plate' });
		const row = previewPaste(editor, projectId, entryId, '15867.9 1D2').rows[0];
		expect(row).toMatchObject({ ok: true, replaces: { observedEnergyText: '1880', uncertaintyText: '0.5', version: 1 } });
		expect(pasteNotes(editor, projectId, entryId, { text: '15867.9 1D2', seen: { '1D#1|2': 1 } })).toEqual({ saved: 1, replaced: 1 });
		expect(notes().get('1D#1|2')).toMatchObject({
			observedEnergyText: '15867.9',
			uncertaintyText: null,
			status: 'proposed',
			comment: 'old plate',
			version: 2
		});
		expect(noteRows()[0].summary).toMatch(/^pasted over the note on 1D J=2/);
	});

	it('a note changed since the preview refuses the whole paste (409); the other lines are not saved either', () => {
		saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|1', observedEnergy: '16' });
		// The preview saw version 1; someone saves again (version 2) before the paste is saved.
		saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|1', observedEnergy: '16.2', version: 1 });
		const e = refusal(() => pasteNotes(editor, projectId, entryId, { text: BRIEF, seen: { ...seenNone, '3P#1|1': 1 } }));
		expect(e.status).toBe(409);
		expect(e.message).toMatch(/Nothing was saved: the note on 3P J=1 was changed by someone else since the preview/);
		const n = notes();
		expect(n.get('3P#1|0')).toBeNull();
		expect(n.get('3P#1|1')).toMatchObject({ observedEnergyText: '16.2', version: 2 });
	});

	it('a note written since a preview that showed none, and a level missing from `seen`, are refused', () => {
		saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|0', observedEnergy: '0' });
		expect(() => pasteNotes(editor, projectId, entryId, { text: BRIEF, seen: seenNone })).toThrow(
			/3P J=0 was written by someone since the preview/
		);
		expect(() => pasteNotes(editor, projectId, entryId, { text: '16.4 3P1', seen: {} })).toThrow(/3P J=1 was not in the preview/);
	});

	it('a pasted note is proposed by the person who pastes, with a "created" history row by them', () => {
		pasteNotes(editor, projectId, entryId, { text: '16.4 3P1 ±0.2', seen: { '3P#1|1': 0 } });
		expect(notes().get('3P#1|1')).toMatchObject({ status: 'proposed', proposedBy: 'Ed Itor', proposedById: editor.id });
		const history = historyOf('3P#1|1');
		expect(history).toHaveLength(1);
		expect(history[0]).toMatchObject({
			change: 'created',
			actorName: 'Ed Itor',
			proposedBy: 'Ed Itor',
			observedEnergyText: '16.4',
			uncertaintyText: '0.2',
			status: 'proposed',
			version: 1
		});
		expect(history[0].createdAt).toBeInstanceOf(Date);
		// The paster may not confirm their own pasted value; another editor may.
		expect(
			statusOf(() =>
				saveAnnotation(editor, projectId, entryId, {
					levelKey: '3P#1|1',
					observedEnergy: '16.4',
					uncertainty: '0.2',
					status: 'confirmed',
					version: 1
				})
			)
		).toBe(403);
		saveAnnotation(reviewer, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '16.4',
			uncertainty: '0.2',
			status: 'confirmed',
			version: 1
		});
		expect(notes().get('3P#1|1')).toMatchObject({ status: 'confirmed', proposedBy: 'Ed Itor' });
	});

	it('a new value pasted over a confirmed note makes it proposed again, by the paster, and says so', () => {
		saveAnnotation(editor, projectId, entryId, { levelKey: '1D#1|2', observedEnergy: '15867.9', comment: 'plate 4' });
		saveAnnotation(reviewer, projectId, entryId, {
			levelKey: '1D#1|2',
			observedEnergy: '15867.9',
			status: 'confirmed',
			comment: 'plate 4',
			version: 1
		});
		pasteNotes(reviewer, projectId, entryId, { text: '15867.86 1D2 ±0.05', seen: { '1D#1|2': 2 } });
		expect(notes().get('1D#1|2')).toMatchObject({ status: 'proposed', proposedBy: 'Rita Reviewer', version: 3, comment: 'plate 4' });
		expect(historyOf('1D#1|2').map((h) => [h.change, h.actorName, h.status, h.proposedBy])).toEqual([
			['created', 'Ed Itor', 'proposed', 'Ed Itor'],
			['confirmed', 'Rita Reviewer', 'confirmed', 'Ed Itor'],
			['reopened', 'Rita Reviewer', 'proposed', 'Rita Reviewer']
		]);
		expect(noteRows()[0].summary).toBe(
			'pasted over the note on 1D J=2 of “O III ground”: 15867.86 ± 0.05 cm⁻¹ (proposed again: its values changed)'
		);
		// Now the paster is the proposer: the first editor may confirm the new value, the paster may not.
		expect(
			statusOf(() =>
				saveAnnotation(reviewer, projectId, entryId, {
					levelKey: '1D#1|2',
					observedEnergy: '15867.86',
					uncertainty: '0.05',
					status: 'confirmed',
					version: 3
				})
			)
		).toBe(403);
	});

	it('a line that repeats a confirmed note’s values keeps it confirmed and its proposer', () => {
		saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|2', observedEnergy: '43.5' });
		saveAnnotation(reviewer, projectId, entryId, { levelKey: '3P#1|2', observedEnergy: '43.5', status: 'confirmed', version: 1 });
		pasteNotes(reviewer, projectId, entryId, { text: '43.5 3P2 "same plate"', seen: { '3P#1|2': 2 } });
		expect(notes().get('3P#1|2')).toMatchObject({ status: 'confirmed', proposedBy: 'Ed Itor', comment: 'same plate', version: 3 });
		expect(historyOf('3P#1|2').at(-1)).toMatchObject({ change: 'changed', status: 'confirmed', actorName: 'Rita Reviewer' });
	});

	it('a refused paste leaves no note, no history row and no activity row', () => {
		saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|1', observedEnergy: '16' });
		const history = historyCount();
		const activity = noteRows().length;
		// 3P J=0 and J=2 would be written first; the stale 3P J=1 refuses the whole paste.
		expect(statusOf(() => pasteNotes(editor, projectId, entryId, { text: BRIEF, seen: seenNone }))).toBe(409);
		expect(historyCount()).toBe(history);
		expect(noteRows()).toHaveLength(activity);
		expect(notes().get('3P#1|0')).toBeNull();
	});
});
