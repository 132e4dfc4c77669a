/**
 * The saved-list API answers in the API's error shape: a refused upload is a 422 whose body lists every problem
 * with row, column and reason (nothing saved); a preview is a 200 that saves nothing; a good file is a 201.
 * Product rules (common practice, no source).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import type { Actor } from './access';
import { signUp } from './services/users';
import { createProject } from './services/projects';
import { listLists } from './services/lists';
import { POST as postLevels } from '../../routes/api/v1/projects/[projectId]/level-lists/+server';
import { DEMO_LEVEL_UPLOAD } from '../lines/demo';

let editor: Actor, projectId: string;
beforeAll(async () => {
	editor = await signUp({ name: 'Api Editor', email: 'api@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'API lists' }).id;
});

const post = (body: unknown) => {
	const url = new URL(`http://localhost/api/v1/projects/${projectId}/level-lists`);
	const event = {
		url,
		params: { projectId },
		request: new Request(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }),
		locals: { user: editor, session: null }
	} as unknown as Parameters<typeof postLevels>[0];
	return postLevels(event as RequestEvent & Parameters<typeof postLevels>[0]);
};

describe('POST /api/v1/projects/:projectId/level-lists', () => {
	it('a file with problems: 422, every problem in the body, nothing saved', async () => {
		const res = await post({ name: 'bad', csv: 'energy,J,parity\n0,0,even\nx,1,odd\n5,7/3,even' });
		expect(res.status).toBe(422);
		const body = await res.json();
		expect(body.error.message).toMatch(/Nothing was saved: the level file has 2 problems/);
		expect(body.error.problems.map((p: { row: number; column: string }) => `${p.row}:${p.column}`)).toEqual(['2:energy', '3:J']);
		expect(body.error.problemCount).toBe(2);
		expect(listLists(editor, projectId).levelLists).toEqual([]);
	});
	it('a preview is 200 and saves nothing; the same file saved is 201', async () => {
		const preview = await post({ name: 'demo', csv: DEMO_LEVEL_UPLOAD, preview: true });
		expect(preview.status).toBe(200);
		expect((await preview.json()).preview.rowCount).toBe(12);
		expect(listLists(editor, projectId).levelLists).toEqual([]);
		const saved = await post({ name: 'demo', csv: DEMO_LEVEL_UPLOAD });
		expect(saved.status).toBe(201);
		expect((await saved.json()).list).toMatchObject({ name: 'demo', rowCount: 12, source: 'upload' });
	});
	it('a body that is not a file is a 400 naming what is wrong, not a server error', async () => {
		const res = await post({ name: 'x', csv: 42 });
		expect(res.status).toBe(400);
		expect((await res.json()).error.message).toMatch(/csv must be the text of the file/);
	});
});
