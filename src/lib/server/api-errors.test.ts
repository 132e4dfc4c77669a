/**
 * The API's one error shape `{ "error": { "message" } }` (our documented contract in the README)
 * for answers that do not come from a handler's own checks: SvelteKit's 404/405, a body over
 * BODY_SIZE_LIMIT (413), and an unexpected exception (500, logged with an id, no internals).
 */
import { describe, expect, it } from 'vitest';
import { json, text } from '@sveltejs/kit';
import { handleServerError, toApiErrorShape, withApiErrorShape } from './api-errors';
import { api } from './http';
import type { RequestEvent } from '@sveltejs/kit';

const fakeEvent = () =>
	({ url: new URL('http://localhost/api/v1/x'), request: new Request('http://localhost/api/v1/x') }) as unknown as RequestEvent;

describe('API error shape', () => {
	it('an HTML 404 page becomes { error: { message } } with the status kept', async () => {
		const page = new Response('<!doctype html><h1>Not Found</h1>', { status: 404, headers: { 'content-type': 'text/html' } });
		const out = await withApiErrorShape('/api/v1/no-such-route', page);
		expect(out.status).toBe(404);
		expect(out.headers.get('content-type')).toMatch(/application\/json/);
		expect(await out.json()).toEqual({ error: { message: 'No such API route; GET /api/v1 lists them' } });
	});

	it('a 405 keeps its Allow header', async () => {
		const out = await toApiErrorShape(text('Method Not Allowed', { status: 405, headers: { allow: 'GET' } }));
		expect(out.headers.get('allow')).toBe('GET');
		expect(await out.json()).toEqual({ error: { message: 'This method is not allowed here' } });
	});

	it('SvelteKit’s { message, id } becomes { error: { message, id } }', async () => {
		const out = await toApiErrorShape(
			json({ message: 'Content-length of 900000 exceeds limit of 524288 bytes.', id: 'ab12cd34' }, { status: 413 })
		);
		expect(await out.json()).toEqual({ error: { message: 'Content-length of 900000 exceeds limit of 524288 bytes.', id: 'ab12cd34' } });
	});

	it('a 500 says only "Internal error" and the id', async () => {
		const out = await toApiErrorShape(
			json({ message: 'SqliteError: no such table: secrets at db.ts:12', id: 'ab12cd34' }, { status: 500 })
		);
		expect(await out.json()).toEqual({ error: { message: 'Internal error; quote ab12cd34 when you report it', id: 'ab12cd34' } });
	});

	it('answers already in the shape, successes and non-API paths pass unchanged', async () => {
		const shaped = json({ error: { message: 'No such project' } }, { status: 404 });
		expect(await toApiErrorShape(shaped)).toBe(shaped);
		const ok = json({ fine: true });
		expect(await withApiErrorShape('/api/v1/terms', ok)).toBe(ok);
		const page = text('<h1>Not Found</h1>', { status: 404 });
		expect(await withApiErrorShape('/projects/x', page)).toBe(page);
		expect(await withApiErrorShape('/api/v10', page)).toBe(page);
	});

	it('handleError logs an unexpected error with an id and returns no stack or internals', () => {
		const logged: unknown[][] = [];
		const boom = new Error('SqliteError: disk I/O error in /srv/data/termwright.db');
		const answer = handleServerError({ error: boom, status: 500, message: 'Internal Error' }, (...args) => logged.push(args));
		expect(answer.id).toMatch(/^[0-9a-f]{8}$/);
		expect(answer.message).toBe(`Internal error; quote ${answer.id} when you report it`);
		expect(JSON.stringify(answer)).not.toMatch(/Sqlite|termwright\.db|at /);
		expect(logged).toHaveLength(1);
		expect(String(logged[0][0])).toContain(answer.id!);
		expect(logged[0][1]).toBe(boom);
	});

	it('a handler that throws unexpectedly is rethrown by api() for handleError, then shaped by the hook', async () => {
		const handler = api(() => {
			throw new TypeError("Cannot read properties of undefined (reading 'rows')");
		});
		await expect(handler(fakeEvent())).rejects.toThrow(TypeError);
	});

	it('api() answers SvelteKit’s 413 for a body over BODY_SIZE_LIMIT in the shape', async () => {
		class SvelteKitLikeError extends Error {
			constructor(
				readonly status: number,
				readonly text: string,
				message: string
			) {
				super(message);
			}
		}
		const handler = api(() => {
			throw new SvelteKitLikeError(413, 'Payload Too Large', 'Content-length of 900000 exceeds limit of 524288 bytes.');
		});
		const out = await handler(fakeEvent());
		expect(out.status).toBe(413);
		expect(await out.json()).toEqual({ error: { message: 'Content-length of 900000 exceeds limit of 524288 bytes.' } });
	});
});
