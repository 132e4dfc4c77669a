/**
 * The role rules written in DEVELOPERS.md and at the top of src/lib/server/access.ts ("owners manage
 * members; editors change content; viewers read; non-members get 404") checked through the service
 * layer on a private in-memory database. Expected outcomes are the product's own rules (common
 * practice for team tools, no outside source).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { ServiceError } from './errors';
import { roleAtLeast, type Actor } from './access';
import { signUp } from './services/users';
import {
	addMember,
	changeMemberRole,
	createProject,
	deleteProject,
	getProject,
	listMembers,
	removeMember,
	updateProject
} from './services/projects';
import { createEntry, getEntry, listEntries, updateEntry, deleteEntry } from './services/shelf';
import { statusOf } from './status-of';

let owner: Actor, editor: Actor, viewer: Actor, stranger: Actor;
let projectId: string;
let entryId: string;

beforeAll(async () => {
	owner = await signUp({ name: 'Owner Person', email: 'owner@example.org', password: 'long-enough-pw' });
	editor = await signUp({ name: 'Editor Person', email: 'editor@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Viewer Person', email: 'viewer@example.org', password: 'long-enough-pw' });
	stranger = await signUp({ name: 'Stranger', email: 'stranger@example.org', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Test project' }).id;
	addMember(owner, projectId, { email: 'editor@example.org', role: 'editor' });
	addMember(owner, projectId, { email: 'viewer@example.org', role: 'viewer' });
	entryId = createEntry(owner, projectId, { title: 'Carbon ground', notation: '1s2 2s2 2p2' }).id;
});

describe('role ranks', () => {
	it('owner ⊃ editor ⊃ viewer', () => {
		expect(roleAtLeast('owner', 'editor')).toBe(true);
		expect(roleAtLeast('editor', 'viewer')).toBe(true);
		expect(roleAtLeast('viewer', 'editor')).toBe(false);
		expect(roleAtLeast('editor', 'owner')).toBe(false);
	});
});

describe('who may do what in a project', () => {
	it('the first account on the site is its admin, later ones are members', () => {
		expect(owner.siteRole).toBe('admin');
		expect(editor.siteRole).toBe('member');
	});

	it('a non-member gets 404 for the project, its Shelf and its entries', () => {
		expect(statusOf(() => getProject(stranger, projectId))).toBe(404);
		expect(statusOf(() => listEntries(stranger, projectId))).toBe(404);
		expect(statusOf(() => getEntry(stranger, projectId, entryId))).toBe(404);
		expect(statusOf(() => createEntry(stranger, projectId, { title: 'x', notation: '1s' }))).toBe(404);
	});

	it('a viewer reads but cannot write', () => {
		expect(statusOf(() => listEntries(viewer, projectId))).toBe('ok');
		expect(statusOf(() => createEntry(viewer, projectId, { title: 'x', notation: '1s' }))).toBe(403);
		expect(statusOf(() => updateEntry(viewer, projectId, entryId, { title: 'y', version: 1 }))).toBe(403);
		expect(statusOf(() => deleteEntry(viewer, projectId, entryId))).toBe(403);
	});

	it('an editor changes content but not members or settings', () => {
		expect(statusOf(() => createEntry(editor, projectId, { title: 'Neon excited', notation: '2p5 3p' }))).toBe('ok');
		expect(statusOf(() => addMember(editor, projectId, { email: 'stranger@example.org', role: 'viewer' }))).toBe(403);
		expect(statusOf(() => updateProject(editor, projectId, { name: 'Renamed' }))).toBe(403);
		expect(statusOf(() => deleteProject(editor, projectId))).toBe(403);
	});

	it('the last owner cannot be demoted or removed', () => {
		expect(statusOf(() => changeMemberRole(owner, projectId, owner.id, 'editor'))).toBe(409);
		expect(statusOf(() => removeMember(owner, projectId, owner.id))).toBe(409);
		expect(listMembers(owner, projectId).filter((m) => m.role === 'owner')).toHaveLength(1);
	});

	it('an unknown project id is 404, not 500', () => {
		expect(statusOf(() => getProject(owner, 'no-such-project'))).toBe(404);
		expect(statusOf(() => getEntry(owner, projectId, 'no-such-entry'))).toBe(404);
	});
});

describe('stale edits', () => {
	it('an edit based on an old version is refused with 409 and the current version', () => {
		const e = createEntry(editor, projectId, { title: 'Version test', notation: '3d2' });
		const first = updateEntry(editor, projectId, e.id, { title: 'First change', version: e.version });
		expect(first.version).toBe(e.version + 1);
		try {
			updateEntry(owner, projectId, e.id, { title: 'Second change', version: e.version });
			expect.unreachable('stale edit was accepted');
		} catch (err) {
			expect(err).toBeInstanceOf(ServiceError);
			expect((err as ServiceError).status).toBe(409);
			expect((err as ServiceError).details.currentVersion).toBe(first.version);
		}
		expect(getEntry(owner, projectId, e.id).title).toBe('First change');
	});
});

describe('input checks', () => {
	it('a bad notation is refused with the parser’s message and token', () => {
		try {
			createEntry(editor, projectId, { title: 'Bad', notation: '1s2 2p7' });
			expect.unreachable('bad notation was accepted');
		} catch (err) {
			expect((err as ServiceError).status).toBe(400);
			expect((err as ServiceError).details).toMatchObject({ field: 'notation', token: '2p7' });
			expect((err as ServiceError).message).toMatch(/6/);
		}
	});

	it('empty and over-long titles get messages that say the limit', () => {
		expect(() => createEntry(editor, projectId, { title: '  ', notation: '1s' })).toThrow(/Title must not be empty/);
		expect(() => createEntry(editor, projectId, { title: 'x'.repeat(161), notation: '1s' })).toThrow(/at most 160/);
	});

	it('a wrong type is a 400 naming the field', () => {
		expect(statusOf(() => createEntry(editor, projectId, { title: 42, notation: '1s' }))).toBe(400);
		expect(statusOf(() => createEntry(editor, projectId, { title: 'ok', notation: '1s', tags: 'not-a-list' }))).toBe(400);
	});

	it('an unknown role is refused and lists the allowed ones', () => {
		expect(() => addMember(owner, projectId, { email: 'stranger@example.org', role: 'superuser' })).toThrow(/viewer, editor, owner/);
	});
});

describe('adding members does not tell who has an account (no account discovery)', () => {
	it('answers the same for an e-mail with and without an account, and adds the existing one', async () => {
		const { memberAddedMessage } = await import('./services/projects');
		const p = createProject(owner, { name: 'Discovery test' }).id;
		const withAccount = addMember(owner, p, { email: 'stranger@example.org', role: 'viewer' });
		const without = addMember(owner, p, { email: 'nobody-at-all@example.org', role: 'viewer' });
		const strip = (r: { email: string; message: string }) => ({ ...r, email: '', message: r.message.replace(r.email, '') });
		expect(strip(withAccount)).toEqual(strip(without));
		expect(without.message).toBe(memberAddedMessage('nobody-at-all@example.org', 'viewer'));
		expect(listMembers(owner, p).map((m) => m.email)).toEqual(expect.arrayContaining(['stranger@example.org']));
		expect(listMembers(owner, p)).toHaveLength(2);
		expect(statusOf(() => addMember(owner, p, { email: 'stranger@example.org', role: 'editor' }))).toBe(409);
	});
});

describe('leaving a project', () => {
	it('a member leaves and then gets 404; the last owner cannot leave', async () => {
		const { leaveProject } = await import('./services/projects');
		const p = createProject(owner, { name: 'Leaving test' }).id;
		addMember(owner, p, { email: 'viewer@example.org', role: 'viewer' });
		expect(statusOf(() => leaveProject(viewer, p))).toBe('ok');
		expect(statusOf(() => getProject(viewer, p))).toBe(404);
		expect(statusOf(() => leaveProject(viewer, p))).toBe(404);
		expect(statusOf(() => leaveProject(owner, p))).toBe(409);
		addMember(owner, p, { email: 'editor@example.org', role: 'owner' });
		expect(statusOf(() => leaveProject(owner, p))).toBe('ok');
		expect(listMembers(editor, p).map((m) => m.role)).toEqual(['owner']);
	});
});
