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
import { saveAnnotation } from './services/annotations';
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
		activity: rows('select * from activity_log where project_id = ? order by id', pid).map((l) => ({
			...without(l, 'id', 'project_id'),
			subject: subject(l.subject)
		}))
	};
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
	saveAnnotation(owner, projectId, o3.id, { levelKey: '1D#1|2', observedEnergy: 20273.27, status: 'disputed' });
	const fe = createEntry(owner, projectId, { title: 'Fe II', species: 'Fe II', notation: '[Ar] 3d6 4s' });
	saveAnnotation(owner, projectId, fe.id, { levelKey: '6D#1|9/2', observedEnergy: 0, comment: 'ground' });
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
