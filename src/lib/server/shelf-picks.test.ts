/** Shelf picks for the public tools: only the Shelves of one's own projects (product rule, no source). */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry } from './services/shelf';
import { shelfPicks } from './services/shelf-picks';

let owner: Actor, viewer: Actor, stranger: Actor;

beforeAll(async () => {
	owner = await signUp({ name: 'Pick Owner', email: 'pick-owner@example.org', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Pick Viewer', email: 'pick-viewer@example.org', password: 'long-enough-pw' });
	stranger = await signUp({ name: 'Pick Stranger', email: 'pick-stranger@example.org', password: 'long-enough-pw' });
	const shared = createProject(owner, { name: 'Picks shared' }).id;
	const own = createProject(owner, { name: 'Picks private' }).id;
	addMember(owner, shared, { email: 'pick-viewer@example.org', role: 'viewer' });
	createEntry(owner, shared, { title: 'O III ground', species: 'O III', notation: '2p2' });
	createEntry(owner, shared, { title: 'O III excited', species: 'O III', notation: '2p 3s' });
	createEntry(owner, own, { title: 'Private', species: 'Fe II', notation: '[Ar] 3d6 4s' });
});

describe('shelfPicks', () => {
	it('a viewer gets the configurations of the projects they belong to, as typed, newest first', () => {
		const picks = shelfPicks(viewer);
		expect(picks.map((p) => p.notation)).toEqual(['2p 3s', '2p2']);
		expect(picks[0]).toMatchObject({ title: 'O III excited', projectName: 'Picks shared', parity: 'odd' });
	});

	it('the owner of both projects sees all three; a stranger sees none', () => {
		expect(shelfPicks(owner).map((p) => p.notation)).toEqual(['[Ar] 3d6 4s', '2p 3s', '2p2']);
		expect(shelfPicks(stranger)).toEqual([]);
	});

	it('the limit is kept', () => {
		expect(shelfPicks(owner, 1)).toHaveLength(1);
	});
});
