/**
 * Project backup and restore: export → import gives a project equal to the original in every
 * column of every table (apart from its ids), damaged files and newer versions are refused with
 * nothing written, and only owners export. Expected outcomes are the product's rules (common
 * practice, no source); the data is invented.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { sqlite } from './db';
import { signUp } from './services/users';
import { addMember, createProject, listMembers, listProjects } from './services/projects';
import { createEntry, deleteEntry, updateEntry } from './services/shelf';
import { deleteAnnotation, saveAnnotation } from './services/annotations';
import { BACKUP_VERSION, exportProject, importProject, parseBackup } from './services/backup';
import { statusOf } from './status-of';

let owner: Actor, editor: Actor, viewer: Actor, stranger: Actor, projectId: string;

type Row = Record<string, unknown>;
const rows = (query: string, ...params: unknown[]) => sqlite.prepare(query).all(...params) as Row[];
const without = (row: Row, ...keys: string[]) => Object.fromEntries(Object.entries(row).filter(([k]) => !keys.includes(k)));

/**
 * Every column of the project's rows in every project table, with the project's own ids replaced
 * by stable names (entries by title), so two projects can be compared field by field.
 */
function snapshot(pid: string) {
	const entries = rows('select * from shelf_entries where project_id = ? order by created_at, title', pid);
	const titleOf = new Map(entries.map((e) => [e.id as string, e.title as string]));
	const subject = (s: unknown) => (typeof s === 'string' && s.startsWith('entry:') ? `entry:${titleOf.get(s.slice(6)) ?? '(gone)'}` : s);
	return {
		project: without(rows('select * from projects where id = ?', pid)[0], 'id'),
		members: rows('select * from memberships where project_id = ? order by user_id', pid).map((m) => without(m, 'project_id')),
		entries: entries.map((e) => without(e, 'id', 'project_id')),
		notes: rows(
			'select a.*, e.title as entry from level_annotations a join shelf_entries e on e.id = a.entry_id where e.project_id = ? order by e.title, a.level_key',
			pid
		).map((n) => without(n, 'id', 'entry_id')),
		// Every column of every history row; a note's id becomes the order in which its history starts.
		noteHistory: historyRows(pid),
		activity: rows('select * from activity_log where project_id = ? order by id', pid).map((l) => ({
			...without(l, 'id', 'project_id'),
			subject: subject(l.subject)
		}))
	};
}

function historyRows(pid: string) {
	const noteNames = new Map<unknown, string>();
	return rows(
		'select h.*, e.title as entry from level_annotation_history h join shelf_entries e on e.id = h.entry_id where e.project_id = ? order by h.id',
		pid
	).map((h) => {
		if (!noteNames.has(h.annotation_id)) noteNames.set(h.annotation_id, `note ${noteNames.size + 1}`);
		return { ...without(h, 'id', 'annotation_id', 'project_id', 'entry_id'), note: noteNames.get(h.annotation_id) } as Row;
	});
}

const projectCount = () => (sqlite.prepare('select count(*) as n from projects').get() as { n: number }).n;

beforeAll(async () => {
	owner = await signUp({ name: 'Ruth Owner', email: 'ruth@example.org', password: 'long-enough-pw' });
	editor = await signUp({ name: 'Karl Editor', email: 'karl@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Ines Viewer', email: 'ines@example.org', password: 'long-enough-pw' });
	stranger = await signUp({ name: 'Nils Stranger', email: 'nils@example.org', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Nebular lines', description: 'Invented data for the backup test' }).id;
	addMember(owner, projectId, { email: 'karl@example.org', role: 'editor' });
	addMember(owner, projectId, { email: 'ines@example.org', role: 'viewer' });
	const o3 = createEntry(editor, projectId, {
		title: 'O III ground',
		species: 'O III',
		notation: '1s2 2s2 2p2',
		tags: ['nebular', 'forbidden']
	});
	updateEntry(owner, projectId, o3.id, { notes: 'Invented notes, with “quotes” and ünïcode.', version: 1 });
	saveAnnotation(editor, projectId, o3.id, {
		levelKey: '3P#1|1',
		observedEnergy: 113.2,
		uncertainty: 0.1,
		status: 'proposed',
		comment: 'invented'
	});
	// The note's history: proposed by the editor, confirmed by the owner (the review rule).
	saveAnnotation(owner, projectId, o3.id, {
		levelKey: '3P#1|1',
		observedEnergy: 113.2,
		uncertainty: 0.1,
		status: 'confirmed',
		comment: 'invented',
		version: 1
	});
	saveAnnotation(owner, projectId, o3.id, { levelKey: '1D#1|2', observedEnergy: 20273.27, status: 'disputed' });
	// A deleted note: its history travels too.
	saveAnnotation(editor, projectId, o3.id, { levelKey: '3P#1|2', observedEnergy: '306.17', comment: 'blend' });
	deleteAnnotation(owner, projectId, o3.id, '3P#1|2');
	const fe = createEntry(owner, projectId, { title: 'Fe II', species: 'Fe II', notation: '[Ar] 3d6 4s' });
	saveAnnotation(owner, projectId, fe.id, { levelKey: '6D#1|9/2', observedEnergy: 0, comment: 'ground' });
	// A detached note (the configuration changed after it was written).
	updateEntry(editor, projectId, fe.id, { notation: '[Ar] 3d7', version: 1 });
	const gone = createEntry(owner, projectId, { title: 'Scratch', notation: '3d2' });
	deleteEntry(owner, projectId, gone.id);
});

describe('export → import loses nothing', () => {
	it('the restored project equals the original in every column of every table (ids apart)', () => {
		const file = JSON.stringify(exportProject(owner, projectId));
		const report = importProject(owner, file);
		expect(report).toMatchObject({ name: 'Nebular lines', entries: 2, levelNotes: 3, notRestored: [] });
		const before = snapshot(projectId);
		const after = snapshot(report.projectId);
		expect(after.project).toEqual(before.project);
		expect(after.members).toEqual(before.members);
		expect(after.entries).toEqual(before.entries);
		expect(after.notes).toEqual(before.notes);
		expect(after.noteHistory).toEqual(before.noteHistory);
		expect(before.noteHistory.map((h) => [h.note, h.change, h.actor_name])).toEqual([
			['note 1', 'created', 'Karl Editor'],
			['note 1', 'confirmed', 'Ruth Owner'],
			['note 2', 'created', 'Ruth Owner'],
			['note 3', 'created', 'Karl Editor'],
			['note 3', 'deleted', 'Ruth Owner'],
			['note 4', 'created', 'Ruth Owner'],
			['note 4', 'detached', 'Karl Editor']
		]);
		// The restored log is the original plus one line saying it was restored.
		expect(after.activity.slice(0, -1)).toEqual(before.activity);
		expect(after.activity.at(-1)).toMatchObject({ kind: 'project.restored', actor_name: 'Ruth Owner' });
		expect(before.activity.length).toBeGreaterThan(8);
	});

	it('exporting the restored project gives the same file again (apart from the date and ids)', () => {
		const first = exportProject(owner, projectId);
		const restored = importProject(owner, JSON.stringify(first));
		const second = exportProject(owner, restored.projectId);
		const plain = (f: typeof first) => ({
			...f,
			exportedAt: null,
			entries: f.entries.map((e) => ({ ...e, ref: null, levelNotes: e.levelNotes.map((n) => ({ ...n, ref: null })) })),
			sections: { noteHistory: (f.sections.noteHistory as object[]).map((h) => ({ ...h, note: null, entry: null })) },
			activity: f.activity
				.filter((l) => l.kind !== 'project.restored')
				.map((l) => ({ ...l, subject: l.subject?.startsWith('entry:') ? 'entry' : l.subject }))
		});
		expect(plain(second)).toEqual(plain(first));
	});

	it('importing as another person makes them owner and keeps everyone else’s role', () => {
		const report = importProject(editor, JSON.stringify(exportProject(owner, projectId)));
		const roles = Object.fromEntries(listMembers(editor, report.projectId).map((m) => [m.email, m.role]));
		expect(roles).toEqual({ 'karl@example.org': 'owner', 'ruth@example.org': 'owner', 'ines@example.org': 'viewer' });
	});

	it('members without an account here are listed as not restored', () => {
		const file = exportProject(owner, projectId);
		file.members.push({ email: 'far.away@example.net', name: 'Far Away', role: 'editor', since: new Date().toISOString() });
		const report = importProject(owner, JSON.stringify(file));
		expect(report.notRestored).toEqual([{ email: 'far.away@example.net', name: 'Far Away', role: 'editor' }]);
		expect(listMembers(owner, report.projectId).map((m) => m.email)).not.toContain('far.away@example.net');
	});
});

describe('a file of format version 1 (written before note history and proposers were kept)', () => {
	/** Written by hand in the shape version 1 had: notes without `ref` or `proposedBy`, no noteHistory section. */
	const versionOne = {
		format: 'termwright-project',
		version: 1,
		exportedAt: '2026-11-20T09:00:00.000Z',
		exportedBy: 'ruth@example.org',
		project: {
			name: 'Old file',
			description: '',
			createdBy: 'ruth@example.org',
			createdAt: '2026-11-01T08:00:00.000Z',
			updatedAt: '2026-11-01T08:00:00.000Z'
		},
		members: [{ email: 'karl@example.org', name: 'Karl Editor', role: 'editor', since: '2026-11-02T08:00:00.000Z' }],
		entries: [
			{
				ref: 'e-old',
				title: 'C I ground',
				species: 'C I',
				notation: '1s2 2s2 2p2',
				notes: '',
				tags: [],
				version: 1,
				createdBy: 'karl@example.org',
				createdAt: '2026-11-03T08:00:00.000Z',
				updatedBy: 'karl@example.org',
				updatedAt: '2026-11-03T08:00:00.000Z',
				levelNotes: [
					{
						levelKey: '3P#1|1',
						observedEnergy: 16.4,
						observedEnergyText: '16.40',
						uncertainty: null,
						uncertaintyText: null,
						detached: false,
						detachedFrom: null,
						status: 'confirmed',
						comment: 'invented',
						version: 2,
						updatedBy: 'karl@example.org',
						updatedAt: '2026-11-04T10:30:00.000Z'
					},
					{
						levelKey: '1D#1|2',
						observedEnergy: 10192.6,
						uncertainty: 0.2,
						status: 'proposed',
						comment: '',
						version: 1,
						updatedBy: 'someone.gone@example.net',
						updatedAt: '2026-11-05T10:30:00.000Z'
					}
				]
			}
		],
		activity: [],
		sections: {}
	};

	it('is read: the last person to change a note becomes its proposer, and its history starts with a "recorded" row', () => {
		const report = importProject(owner, JSON.stringify(versionOne));
		expect(report).toMatchObject({ name: 'Old file', entries: 1, levelNotes: 2 });
		const notes = rows(
			'select a.* from level_annotations a join shelf_entries e on e.id = a.entry_id where e.project_id = ? order by a.level_key',
			report.projectId
		);
		expect(notes.map((n) => [n.level_key, n.status, n.proposed_by, n.updated_by])).toEqual([
			['1D#1|2', 'proposed', null, null],
			['3P#1|1', 'confirmed', editor.id, editor.id]
		]);
		expect(historyRows(report.projectId).map((h) => without(h, 'note', 'created_at'))).toEqual([
			{
				entry: 'C I ground',
				level_key: '3P#1|1',
				observed_energy: 16.4,
				observed_energy_text: '16.40',
				uncertainty: null,
				uncertainty_text: null,
				status: 'confirmed',
				comment: 'invented',
				detached: 0,
				detached_from: null,
				version: 2,
				proposed_by: editor.id,
				change: 'recorded',
				actor_id: editor.id,
				actor_name: 'Karl Editor'
			},
			{
				entry: 'C I ground',
				level_key: '1D#1|2',
				observed_energy: 10192.6,
				observed_energy_text: null,
				uncertainty: 0.2,
				uncertainty_text: null,
				status: 'proposed',
				comment: '',
				detached: 0,
				detached_from: null,
				version: 1,
				proposed_by: null,
				change: 'recorded',
				actor_id: null,
				actor_name: 'someone'
			}
		]);
		expect(historyRows(report.projectId).map((h) => h.created_at)).toEqual([
			Date.parse('2026-11-04T10:30:00.000Z'),
			Date.parse('2026-11-05T10:30:00.000Z')
		]);
	});

	it('is written again as the newest version, with the recorded history', () => {
		const report = importProject(owner, JSON.stringify(versionOne));
		const again = exportProject(owner, report.projectId);
		expect(again.version).toBe(BACKUP_VERSION);
		expect((again.sections.noteHistory as { change: string }[]).map((h) => h.change)).toEqual(['recorded', 'recorded']);
		expect(again.entries[0].levelNotes.map((n) => n.proposedBy)).toEqual([null, 'karl@example.org']);
	});
});

describe('a file that cannot be restored is refused, and nothing is written', () => {
	const good = () => exportProject(owner, projectId);
	const refused = (text: string, message: RegExp) => {
		const n = projectCount();
		expect(() => importProject(owner, text)).toThrow(message);
		expect(statusOf(() => importProject(owner, text))).toBe(400);
		expect(projectCount()).toBe(n);
	};

	it('a newer format version', () => {
		refused(
			JSON.stringify({ ...good(), version: BACKUP_VERSION + 1 }),
			new RegExp(`format version ${BACKUP_VERSION + 1} by a newer Termwright; this server reads versions up to ${BACKUP_VERSION}`)
		);
	});

	it('a file cut short, another kind of file, a missing version', () => {
		const text = JSON.stringify(good());
		refused(text.slice(0, text.length / 2), /not valid JSON .* damaged or cut short/);
		refused(JSON.stringify({ name: 'x' }), /not a Termwright project backup/);
		refused(JSON.stringify({ ...good(), version: 'one' }), /no valid format "version"/);
	});

	it('a damaged field says where', () => {
		const file = good();
		(file.entries[0].levelNotes[0] as { status: string }).status = 'approved';
		refused(JSON.stringify(file), /damaged at entries\.0\.levelNotes\.0\.status/);
		const file2 = good();
		(file2.entries[1] as { createdAt: string }).createdAt = 'yesterday';
		refused(JSON.stringify(file2), /damaged at entries\.1\.createdAt: must be a date/);
	});

	it('a damaged note history says so', () => {
		const file = good();
		(file.sections.noteHistory as { change: string }[])[0].change = 'approved';
		refused(JSON.stringify(file), /The backup's level note histories are damaged: .*Nothing was imported/);
	});

	it('records of a feature this server does not have', () => {
		refused(JSON.stringify({ ...good(), sections: { fits: [] } }), /holds records \("fits"\) that this server cannot restore/);
	});

	it('a failure half-way through the import rolls everything back', () => {
		// Two notes on the same level of one entry pass the file check but break the database's
		// one-note-per-level rule when the second is written: the whole import must vanish.
		const file = good();
		const notes = file.entries[0].levelNotes;
		notes.push({ ...notes[0] });
		const n = projectCount();
		const entries = rows('select count(*) as n from shelf_entries')[0].n;
		expect(() => importProject(owner, JSON.stringify(file))).toThrow();
		expect(projectCount()).toBe(n);
		expect(rows('select count(*) as n from shelf_entries')[0].n).toBe(entries);
	});
});

describe('who may back up', () => {
	it('only owners export; non-members get 404; anyone signed in may import into a new project of their own', () => {
		expect(statusOf(() => exportProject(editor, projectId))).toBe(403);
		expect(statusOf(() => exportProject(viewer, projectId))).toBe(403);
		expect(statusOf(() => exportProject(stranger, projectId))).toBe(404);
		const mine = importProject(stranger, JSON.stringify(exportProject(owner, projectId)));
		expect(listProjects(stranger).map((p) => [p.id, p.role])).toContainEqual([mine.projectId, 'owner']);
	});

	it('parseBackup reads what exportProject writes', () => {
		const parsed = parseBackup(JSON.stringify(exportProject(owner, projectId)));
		expect(parsed.entries.map((e) => e.title)).toEqual(['O III ground', 'Fe II']);
		expect(parsed.entries[0].createdAt).toBeInstanceOf(Date);
	});
});
