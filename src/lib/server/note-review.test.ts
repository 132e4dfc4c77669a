/**
 * Review of level notes on the server: the rule of src/lib/review.ts enforced by saveAnnotation,
 * a history row for every kind of change (who, when, the note's fields after it), an activity row
 * for each, both in the transaction of the change (a refused or failed change leaves neither), the
 * history route's access, and the awaiting-review list. Product rules of issue #13 (common
 * practice for shared records, no source). Levels of 2p²: ³P₀,₁,₂ ¹D₂ ¹S₀ and of 2p3p (a
 * changed configuration): Condon & Shortley (1935) ch. VII. Energies are invented.
 */
import { afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { sqlite } from './db';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry, deleteEntry, updateEntry } from './services/shelf';
import { annotatedLevels, deleteAnnotation, deleteAnnotationById, reattachAnnotation, saveAnnotation } from './services/annotations';
import { noteHistory } from './services/note-history';
import { awaitingReview } from './services/review';
import { listActivity } from './services/activity';
import { statusOf, refusal } from './status-of';

let owner: Actor, ed: Actor, rita: Actor, viewer: Actor, outsider: Actor, projectId: string, otherProjectId: string, entryId: string;

beforeAll(async () => {
	owner = await signUp({ name: 'Olga Owner', email: 'olga@example.org', password: 'long-enough-pw' });
	ed = await signUp({ name: 'Ed Itor', email: 'ed@example.org', password: 'long-enough-pw' });
	rita = await signUp({ name: 'Rita Reviewer', email: 'rita@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vi Ewer', email: 'vi@example.org', password: 'long-enough-pw' });
	outsider = await signUp({ name: 'Out Sider', email: 'out@example.org', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Review' }).id;
	addMember(owner, projectId, { email: 'ed@example.org', role: 'editor' });
	addMember(owner, projectId, { email: 'rita@example.org', role: 'editor' });
	addMember(owner, projectId, { email: 'vi@example.org', role: 'viewer' });
	otherProjectId = createProject(outsider, { name: 'Elsewhere' }).id;
});

beforeEach(() => {
	entryId = createEntry(ed, projectId, { title: 'O III ground', species: 'O III', notation: '1s2 2s2 2p2' }).id;
});

const note = (key: string) => annotatedLevels(viewer, projectId, entryId).levels.find((l) => l.key === key)!.annotation;
const history = (id: string) => noteHistory(viewer, projectId, entryId, id);
const count = (table: string, where = '1') =>
	(sqlite.prepare(`select count(*) as n from ${table} where ${where}`).get() as { n: number }).n;
/** Everything a change could write: the note rows, their history and the log. */
const footprint = () => ({
	notes: sqlite.prepare('select * from level_annotations where entry_id = ? order by id').all(entryId),
	history: count('level_annotation_history'),
	activity: count('activity_log')
});
/** The newest log rows about this entry, newest first. */
const entryLog = (n: number) =>
	listActivity(viewer, projectId, { limit: 200 })
		.items.filter((a) => a.subject === `entry:${entryId}`)
		.slice(0, n);

const propose = (who: Actor, key = '3P#1|1', energy = '113.2') =>
	saveAnnotation(who, projectId, entryId, { levelKey: key, observedEnergy: energy, uncertainty: '0.1', comment: 'invented' });

describe('the rule, enforced on save', () => {
	it('no note is created confirmed, not even by the owner (400), and nothing is written', () => {
		const before = footprint();
		const e = refusal(() =>
			saveAnnotation(owner, projectId, entryId, { levelKey: '3P#1|1', observedEnergy: '113.2', status: 'confirmed' })
		);
		expect(e.status).toBe(400);
		expect(e.message).toMatch(/A new note cannot be saved as confirmed/);
		expect(e.details).toMatchObject({ field: 'status' });
		expect(footprint()).toEqual(before);
	});

	it('the proposer cannot confirm their own proposal (403); another editor can; so can the owner', () => {
		const a = propose(ed);
		expect(a).toMatchObject({ status: 'proposed', proposedBy: 'Ed Itor', proposedById: ed.id });
		const e = refusal(() =>
			saveAnnotation(ed, projectId, entryId, {
				levelKey: '3P#1|1',
				observedEnergy: '113.2',
				uncertainty: '0.1',
				status: 'confirmed',
				version: 1
			})
		);
		expect(e.status).toBe(403);
		expect(e.message).toMatch(/You proposed this note, so you cannot confirm it yourself/);
		expect(note('3P#1|1')).toMatchObject({ status: 'proposed', version: 1 });
		const c = saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'confirmed',
			comment: 'invented',
			version: 1
		});
		expect(c).toMatchObject({ status: 'confirmed', proposedBy: 'Ed Itor', updatedBy: 'Rita Reviewer', reopened: false });
		propose(ed, '1D#1|2', '20273.3');
		expect(
			saveAnnotation(owner, projectId, entryId, {
				levelKey: '1D#1|2',
				observedEnergy: '20273.3',
				uncertainty: '0.1',
				status: 'confirmed',
				version: 1
			})
		).toMatchObject({
			status: 'confirmed',
			proposedBy: 'Ed Itor'
		});
	});

	it('new values on a confirmed note make it proposed again, proposed by whoever typed them', () => {
		propose(ed);
		saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'confirmed',
			version: 1
		});
		const r = saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.18',
			uncertainty: '0.1',
			status: 'confirmed',
			version: 2
		});
		expect(r).toMatchObject({ status: 'proposed', proposedBy: 'Rita Reviewer', reopened: true, version: 3 });
		// Now Ed may confirm Rita's value, and Rita may not.
		expect(
			statusOf(() =>
				saveAnnotation(rita, projectId, entryId, {
					levelKey: '3P#1|1',
					observedEnergy: '113.18',
					uncertainty: '0.1',
					status: 'confirmed',
					version: 3
				})
			)
		).toBe(403);
		expect(
			saveAnnotation(ed, projectId, entryId, {
				levelKey: '3P#1|1',
				observedEnergy: '113.18',
				uncertainty: '0.1',
				status: 'confirmed',
				version: 3
			}).status
		).toBe('confirmed');
	});

	it('a comment edit of a confirmed note keeps it confirmed, even by its proposer', () => {
		propose(ed);
		saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'confirmed',
			version: 1
		});
		const r = saveAnnotation(ed, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'confirmed',
			comment: 'plate 7',
			version: 2
		});
		expect(r).toMatchObject({ status: 'confirmed', proposedBy: 'Ed Itor', comment: 'plate 7' });
	});

	it('viewers are refused (403) before the rule is looked at', () => {
		expect(statusOf(() => saveAnnotation(viewer, projectId, entryId, { levelKey: '3P#1|1', status: 'confirmed' }))).toBe(403);
	});
});

describe('history: one row per change, with who and when', () => {
	it('created, changed, confirmed, disputed, proposed again, detached, reattached and deleted', () => {
		const t0 = Date.now();
		const id = propose(ed).id;
		saveAnnotation(ed, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.25',
			uncertainty: '0.1',
			comment: 'remeasured',
			version: 1
		});
		saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.25',
			uncertainty: '0.1',
			status: 'confirmed',
			comment: 'remeasured',
			version: 2
		});
		saveAnnotation(owner, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.25',
			uncertainty: '0.1',
			status: 'disputed',
			comment: 'blend?',
			version: 3
		});
		saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.25',
			uncertainty: '0.1',
			status: 'proposed',
			comment: 'blend?',
			version: 4
		});
		// A new configuration detaches the note; Rita puts it on ³P₁ of 2p3p; Owner deletes it.
		updateEntry(ed, projectId, entryId, { notation: '2p 3p', version: 1 });
		reattachAnnotation(rita, projectId, entryId, id, { levelKey: '3P#1|1', version: 5 });
		deleteAnnotationById(owner, projectId, entryId, id);
		const t1 = Date.now();

		const rows = history(id);
		expect(rows.map((r) => [r.change, r.actorName, r.status, r.proposedBy, r.version])).toEqual([
			['created', 'Ed Itor', 'proposed', 'Ed Itor', 1],
			['changed', 'Ed Itor', 'proposed', 'Ed Itor', 2],
			['confirmed', 'Rita Reviewer', 'confirmed', 'Ed Itor', 3],
			['disputed', 'Olga Owner', 'disputed', 'Ed Itor', 4],
			['reopened', 'Rita Reviewer', 'proposed', 'Ed Itor', 5],
			['detached', 'Ed Itor', 'proposed', 'Ed Itor', 5],
			// Putting the note on a level is proposing it there: the one who reattaches proposes.
			['reattached', 'Rita Reviewer', 'proposed', 'Rita Reviewer', 6],
			['deleted', 'Olga Owner', 'proposed', 'Rita Reviewer', 6]
		]);
		expect(rows[0]).toMatchObject({ observedEnergyText: '113.2', uncertaintyText: '0.1', comment: 'invented', levelKey: '3P#1|1' });
		expect(rows[1]).toMatchObject({ observedEnergyText: '113.25', comment: 'remeasured' });
		expect(rows[5]).toMatchObject({ detached: true, detachedFrom: '1s2 2s2 2p2' });
		expect(rows[6]).toMatchObject({ detached: false, detachedFrom: null });
		for (const r of rows) {
			expect(r.createdAt).toBeInstanceOf(Date);
			expect(r.createdAt.getTime()).toBeGreaterThanOrEqual(t0 - 1);
			expect(r.createdAt.getTime()).toBeLessThanOrEqual(t1 + 1);
		}
		// Oldest first.
		expect(rows.map((r) => r.id)).toEqual([...rows.map((r) => r.id)].sort((a, b) => a - b));
	});

	it('a confirmed note proposed again by new values is recorded as such', () => {
		const id = propose(ed).id;
		saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'confirmed',
			version: 1
		});
		saveAnnotation(ed, projectId, entryId, { levelKey: '3P#1|1', observedEnergy: '113.3', status: 'confirmed', version: 2 });
		expect(history(id).at(-1)).toMatchObject({
			change: 'reopened',
			status: 'proposed',
			observedEnergyText: '113.3',
			uncertaintyText: null,
			actorName: 'Ed Itor'
		});
	});

	it('deleting by level key is recorded too, and the history outlives the note', () => {
		const id = propose(ed).id;
		deleteAnnotation(rita, projectId, entryId, '3P#1|1');
		expect(note('3P#1|1')).toBeNull();
		expect(history(id).map((r) => [r.change, r.actorName, r.observedEnergyText])).toEqual([
			['created', 'Ed Itor', '113.2'],
			['deleted', 'Rita Reviewer', '113.2']
		]);
	});

	it('viewers read a history; non-members, another project and an unknown id get 404', () => {
		const id = propose(ed).id;
		expect(history(id)).toHaveLength(1);
		expect(statusOf(() => noteHistory(outsider, projectId, entryId, id))).toBe(404);
		expect(statusOf(() => noteHistory(outsider, otherProjectId, entryId, id))).toBe(404);
		expect(statusOf(() => noteHistory(viewer, projectId, entryId, 'no-such-note'))).toBe(404);
	});

	it('deleting the entry takes its notes’ history with it', () => {
		const id = propose(ed).id;
		deleteEntry(owner, projectId, entryId);
		expect(count('level_annotation_history', `annotation_id = '${id}'`)).toBe(0);
	});
});

describe('activity: one row per change, in words', () => {
	it('each step of a review is in the project log with its kind and who', () => {
		const id = propose(ed).id;
		saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'confirmed',
			version: 1
		});
		saveAnnotation(owner, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'disputed',
			version: 2
		});
		updateEntry(ed, projectId, entryId, { notation: '2p 3p', version: 1 });
		reattachAnnotation(rita, projectId, entryId, id, { levelKey: '3P#1|2', version: 3 });
		deleteAnnotationById(owner, projectId, entryId, id);
		expect(
			entryLog(6)
				.reverse()
				.map((a) => [a.kind, a.actorName, a.summary])
		).toEqual([
			['note.saved', 'Ed Itor', 'added the note on 3P J=1 of “O III ground”: 113.2 ± 0.1 cm⁻¹ (proposed)'],
			['note.confirmed', 'Rita Reviewer', 'confirmed the note on 3P J=1 of “O III ground”: 113.2 ± 0.1 cm⁻¹'],
			['note.disputed', 'Olga Owner', 'disputed the note on 3P J=1 of “O III ground”: 113.2 ± 0.1 cm⁻¹'],
			['entry.updated', 'Ed Itor', 'changed the configuration of “O III ground” (1 level note detached)'],
			['note.reattached', 'Rita Reviewer', 'reattached the note on 3P J=2 of “O III ground”: 113.2 ± 0.1 cm⁻¹ (disputed)'],
			['note.deleted', 'Olga Owner', 'deleted the note on 3P J=2 of “O III ground”']
		]);
	});
});

describe('rollback: a refused or failed change leaves neither note nor history nor activity', () => {
	afterEach(() => {
		sqlite.exec('drop trigger if exists fail_history; drop trigger if exists fail_activity');
	});

	it('refused saves (own confirmation, stale version, new note confirmed) write nothing', () => {
		propose(ed);
		const before = footprint();
		const save = (who: Actor, input: object) => statusOf(() => saveAnnotation(who, projectId, entryId, { levelKey: '3P#1|1', ...input }));
		expect(save(ed, { observedEnergy: '113.2', uncertainty: '0.1', status: 'confirmed', version: 1 })).toBe(403);
		expect(save(rita, { observedEnergy: '113.2', uncertainty: '0.1', status: 'confirmed', version: 7 })).toBe(409);
		expect(save(rita, { observedEnergy: '113.9', status: 'confirmed', version: 1 })).toBe(400);
		expect(statusOf(() => saveAnnotation(rita, projectId, entryId, { levelKey: '1S#1|0', status: 'confirmed' }))).toBe(400);
		expect(footprint()).toEqual(before);
	});

	it('when writing the history row fails, the note and the log line roll back with it', () => {
		sqlite.exec(`create temp trigger fail_history before insert on level_annotation_history
			begin select raise(abort, 'history refused for the test'); end`);
		const before = footprint();
		expect(() => propose(ed)).toThrow(/history refused for the test/);
		expect(footprint()).toEqual(before);
	});

	it('when writing the log line fails, the note change and its history row roll back', () => {
		const id = propose(ed).id;
		sqlite.exec(`create temp trigger fail_activity before insert on activity_log
			begin select raise(abort, 'log refused for the test'); end`);
		const before = footprint();
		expect(() =>
			saveAnnotation(rita, projectId, entryId, {
				levelKey: '3P#1|1',
				observedEnergy: '113.2',
				uncertainty: '0.1',
				status: 'confirmed',
				version: 1
			})
		).toThrow(/log refused/);
		expect(() => deleteAnnotationById(owner, projectId, entryId, id)).toThrow(/log refused/);
		expect(footprint()).toEqual(before);
		expect(note('3P#1|1')).toMatchObject({ status: 'proposed', version: 1 });
	});

	it('a configuration change whose history row fails detaches nothing', () => {
		propose(ed);
		sqlite.exec(`create temp trigger fail_history before insert on level_annotation_history
			begin select raise(abort, 'history refused for the test'); end`);
		const before = footprint();
		expect(() => updateEntry(ed, projectId, entryId, { notation: '2p 3p', version: 1 })).toThrow(/history refused/);
		expect(footprint()).toEqual(before);
		expect(annotatedLevels(viewer, projectId, entryId).entry.notation).toBe('1s2 2s2 2p2');
	});
});

describe('awaiting review', () => {
	it('lists proposed and disputed notes, longest waiting first, says whose they are, and clears on confirm', () => {
		const list = (who: Actor) =>
			awaitingReview(who, projectId)
				.items.filter((i) => i.entryId === entryId)
				.map((i) => [i.levelKey, i.status, i.proposedBy, i.yours, i.observedEnergyText, i.entryTitle]);
		propose(ed, '3P#1|1', '113.2');
		propose(ed, '1D#1|2', '20273.3');
		propose(rita, '3P#1|2', '306.2');
		saveAnnotation(ed, projectId, entryId, { levelKey: '1S#1|0', observedEnergy: '43185.7', status: 'disputed' });
		saveAnnotation(ed, projectId, entryId, { levelKey: '3P#1|0', observedEnergy: '0' });
		saveAnnotation(rita, projectId, entryId, { levelKey: '3P#1|0', observedEnergy: '0', status: 'confirmed', version: 1 });
		expect(list(rita)).toEqual([
			['3P#1|1', 'proposed', 'Ed Itor', false, '113.2', 'O III ground'],
			['1D#1|2', 'proposed', 'Ed Itor', false, '20273.3', 'O III ground'],
			['3P#1|2', 'proposed', 'Rita Reviewer', true, '306.2', 'O III ground'],
			['1S#1|0', 'disputed', 'Ed Itor', false, '43185.7', 'O III ground']
		]);
		// Ed sees the same notes; his own are marked as his.
		expect(list(ed).map(([key, , , yours]) => [key, yours])).toEqual([
			['3P#1|1', true],
			['1D#1|2', true],
			['3P#1|2', false],
			['1S#1|0', true]
		]);
		saveAnnotation(rita, projectId, entryId, {
			levelKey: '3P#1|1',
			observedEnergy: '113.2',
			uncertainty: '0.1',
			status: 'confirmed',
			version: 1
		});
		expect(list(rita).map(([key]) => key)).toEqual(['1D#1|2', '3P#1|2', '1S#1|0']);
	});

	it('detached notes wait to be reattached, not reviewed', () => {
		propose(ed);
		updateEntry(ed, projectId, entryId, { notation: '2p 3p', version: 1 });
		expect(awaitingReview(rita, projectId).items.filter((i) => i.entryId === entryId)).toEqual([]);
	});

	it('editors and owners may ask; viewers get 403, non-members 404; a bad limit says what is allowed', () => {
		expect(statusOf(() => awaitingReview(owner, projectId))).toBe('ok');
		expect(statusOf(() => awaitingReview(viewer, projectId))).toBe(403);
		expect(statusOf(() => awaitingReview(outsider, projectId))).toBe(404);
		expect(() => awaitingReview(rita, projectId, { limit: '0' })).toThrow(/limit must be a whole number from 1 to 200/);
		expect(awaitingReview(rita, projectId, { limit: '1' }).items.length).toBeLessThanOrEqual(1);
	});
});
