/**
 * The activity log: each change writes exactly one log line in its own transaction, a refused or
 * failed change writes none, viewers read the log and non-members get 404. Expected outcomes are
 * the product's rules (common practice, no source).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { sqlite } from './db';
import { signUp } from './services/users';
import { addMember, changeMemberRole, createProject, leaveProject, removeMember, updateProject } from './services/projects';
import { createEntry, deleteEntry, listEntries, updateEntry } from './services/shelf';
import { deleteAnnotation, saveAnnotation } from './services/annotations';
import { activityActors, changedFields, listActivity } from './services/activity';
import { statusOf } from './status-of';

let owner: Actor, editor: Actor, viewer: Actor, stranger: Actor, projectId: string;

/** All log lines of the project, newest first. */
const log = () => listActivity(owner, projectId, { limit: 200 }).items;

/** Runs `change` and returns the log lines it added (newest first). */
function added(change: () => unknown) {
	const before = log().length;
	change();
	return log().slice(0, log().length - before);
}

beforeAll(async () => {
	owner = await signUp({ name: 'Olga Owner', email: 'olga@example.org', password: 'long-enough-pw' });
	editor = await signUp({ name: 'Emil Editor', email: 'emil@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vera Viewer', email: 'vera@example.org', password: 'long-enough-pw' });
	stranger = await signUp({ name: 'Sam Stranger', email: 'sam@example.org', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Log test' }).id;
});

describe('each change writes exactly one log line', () => {
	it('creating the project is the first line', () => {
		expect(log()).toHaveLength(1);
		expect(log()[0]).toMatchObject({ kind: 'project.created', actorName: 'Olga Owner', summary: 'created the project “Log test”' });
	});

	it('project settings and members', () => {
		expect(added(() => updateProject(owner, projectId, { description: 'Invented test data' })).map((l) => l.kind)).toEqual([
			'project.updated'
		]);
		expect(added(() => addMember(owner, projectId, { email: 'emil@example.org', role: 'viewer' }))).toMatchObject([
			{ kind: 'member.added', summary: 'added Emil Editor as viewer', subject: `member:${editor.id}` }
		]);
		addMember(owner, projectId, { email: 'vera@example.org', role: 'viewer' });
		expect(added(() => changeMemberRole(owner, projectId, editor.id, 'editor'))).toMatchObject([
			{ kind: 'member.role_changed', summary: 'changed Emil Editor’s role from viewer to editor' }
		]);
		addMember(owner, projectId, { email: 'sam@example.org', role: 'viewer' });
		expect(added(() => removeMember(owner, projectId, stranger.id))).toMatchObject([
			{ kind: 'member.removed', summary: 'removed Sam Stranger (viewer)' }
		]);
		addMember(owner, projectId, { email: 'sam@example.org', role: 'viewer' });
		expect(added(() => leaveProject(stranger, projectId))).toMatchObject([
			{ kind: 'member.left', actorName: 'Sam Stranger', summary: 'left the project (was viewer)' }
		]);
		// An address without an account answers the same and changes nothing, so it logs nothing.
		expect(added(() => addMember(owner, projectId, { email: 'nobody@example.org', role: 'viewer' }))).toEqual([]);
	});

	it('Shelf entries and level notes', () => {
		let entryId = '';
		const create = added(() => {
			entryId = createEntry(editor, projectId, { title: 'C I ground', notation: '1s2 2s2 2p2' }).id;
		});
		expect(create).toMatchObject([{ kind: 'entry.created', actorName: 'Emil Editor', subject: `entry:${entryId}` }]);
		expect(added(() => updateEntry(editor, projectId, entryId, { title: 'C I ground terms', tags: ['test'], version: 1 }))).toMatchObject([
			{ kind: 'entry.updated', summary: 'changed the title and tags of “C I ground terms”' }
		]);
		expect(added(() => saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|1', status: 'proposed' }))).toMatchObject([
			{ kind: 'note.saved', subject: `entry:${entryId}` }
		]);
		expect(added(() => deleteAnnotation(editor, projectId, entryId, '3P#1|1'))).toMatchObject([{ kind: 'note.deleted' }]);
		expect(added(() => deleteEntry(editor, projectId, entryId))).toMatchObject([
			{ kind: 'entry.deleted', summary: 'deleted “C I ground terms” (1s2 2s2 2p2)' }
		]);
	});
});

describe('a refused or failed change writes nothing', () => {
	it('refusals (stale version, last owner, viewer, bad input) leave the log as it was', () => {
		const e = createEntry(editor, projectId, { title: 'N II', notation: '2p2' });
		updateEntry(editor, projectId, e.id, { notes: 'first', version: 1 });
		const before = log().length;
		expect(statusOf(() => updateEntry(editor, projectId, e.id, { notes: 'stale', version: 1 }))).toBe(409);
		expect(statusOf(() => changeMemberRole(owner, projectId, owner.id, 'viewer'))).toBe(409);
		expect(statusOf(() => createEntry(viewer, projectId, { title: 'x', notation: '1s' }))).toBe(403);
		expect(statusOf(() => createEntry(editor, projectId, { title: 'x', notation: '2p7' }))).toBe(400);
		expect(statusOf(() => deleteAnnotation(editor, projectId, e.id, '3P#1|0'))).toBe(404);
		expect(log()).toHaveLength(before);
	});

	it('when the log line cannot be written, the change itself is rolled back (one transaction)', () => {
		// A trigger makes SQLite refuse this one log line; the entry written before it must vanish too.
		sqlite.exec(`create trigger refuse_log before insert on activity_log when new.summary like '%Refused title%'
			begin select raise(abort, 'log refused'); end`);
		try {
			const entries = listEntries(owner, projectId, { limit: 200 }).entries.length;
			const lines = log().length;
			expect(() => createEntry(editor, projectId, { title: 'Refused title', notation: '3d2' })).toThrow(/log refused/);
			expect(listEntries(owner, projectId, { limit: 200 }).entries).toHaveLength(entries);
			expect(log()).toHaveLength(lines);
		} finally {
			sqlite.exec('drop trigger refuse_log');
		}
	});
});

describe('who reads the log', () => {
	it('viewers read it; non-members get 404 as if the project did not exist', () => {
		expect(statusOf(() => listActivity(viewer, projectId))).toBe('ok');
		expect(statusOf(() => listActivity(stranger, projectId))).toBe(404);
		expect(statusOf(() => activityActors(stranger, projectId))).toBe(404);
	});
});

describe('filters and pages', () => {
	it('filters by person and by kind', () => {
		const emil = listActivity(viewer, projectId, { actor: editor.id, limit: 200 }).items;
		expect(emil.length).toBeGreaterThan(3);
		expect(emil.every((l) => l.actorName === 'Emil Editor')).toBe(true);
		const roles = listActivity(viewer, projectId, { kind: 'member.role_changed' }).items;
		expect(roles).toHaveLength(1);
		expect(activityActors(viewer, projectId).map((a) => a.name)).toEqual(['Emil Editor', 'Olga Owner', 'Sam Stranger']);
	});

	it('pages newest first without gaps or repeats', () => {
		const all = log();
		const seen: number[] = [];
		let cursor: string | undefined;
		do {
			const page = listActivity(viewer, projectId, { limit: 3, cursor });
			expect(page.items.length).toBeLessThanOrEqual(3);
			seen.push(...page.items.map((l) => l.id));
			cursor = page.nextCursor ?? undefined;
		} while (cursor);
		expect(seen).toEqual(all.map((l) => l.id));
		expect([...seen].sort((a, b) => b - a)).toEqual(seen);
	});

	it('a bad cursor, limit or kind gets a message saying what is allowed', () => {
		expect(() => listActivity(viewer, projectId, { cursor: 'xyz' })).toThrow(/nextCursor of the previous page/);
		expect(() => listActivity(viewer, projectId, { limit: '0' })).toThrow(/at least 1/);
		expect(() => listActivity(viewer, projectId, { limit: '500' })).toThrow(/at most 200/);
		expect(() => listActivity(viewer, projectId, { kind: 'party' })).toThrow(/kind must be one of project.created/);
	});
});

describe('summaries', () => {
	it('name only the fields that really changed', () => {
		expect(changedFields({ title: 'a', tags: ['x'] }, { title: 'a', tags: ['y'] })).toBe('the tags');
		expect(changedFields({ title: 'a' }, { title: 'a' })).toBe('nothing');
		expect(changedFields({ title: 'a', notation: '2p', notes: '' }, { title: 'b', notation: '2p2', notes: 'n' })).toBe(
			'the title, configuration and notes'
		);
	});
});
