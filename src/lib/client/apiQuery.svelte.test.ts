/**
 * The client data layer against a stubbed fetch: compute POSTs are read like GETs with the JSON body
 * as part of the cache key, typing is debounced once, server refusals keep their words, and paged
 * lists follow the cursor. Behaviour of TanStack Query's cache as documented (tanstack.com/query,
 * "Query Keys", "Infinite Queries"); the rest is common practice, no source.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushSync } from 'svelte';
import { apiPages, apiQuery, createAppQueryClient, DEBOUNCE_MS } from './apiQuery.svelte';
import type { ApiRequests } from '$lib/api/types';

type Call = { url: string; method: string; contentType: string | null; body: unknown };
let calls: Call[];
let answer: (call: Call) => Response;

const json = (body: unknown, status = 200) =>
	new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });

beforeEach(() => {
	calls = [];
	answer = () => json({});
	vi.stubGlobal('fetch', async (url: string, init: RequestInit = {}) => {
		const call = {
			url,
			method: init.method ?? 'GET',
			contentType: new Headers(init.headers).get('content-type'),
			body: typeof init.body === 'string' ? JSON.parse(init.body) : null
		};
		calls.push(call);
		return answer(call);
	});
});
afterEach(() => vi.unstubAllGlobals());

/** Runs `make` inside an effect root (as a component's set-up would) and returns its value and the cleanup. */
function setUp<T>(make: () => T): { value: T; stop: () => void } {
	let value!: T;
	const stop = $effect.root(() => {
		value = make();
	});
	flushSync();
	return { value, stop };
}

const sweepBody = (points: number): ApiRequests['POST /api/v1/energies/sweep'] => ({ config: '2p2', parameters: { Eav: 0 }, points });

describe('apiQuery with a JSON body (compute POST)', () => {
	it('posts the body as JSON and keeps the answer with the body it answers', async () => {
		answer = (c) => json({ config: '2p2', echo: c.body });
		const client = createAppQueryClient();
		const q = setUp(() => apiQuery(() => ({ route: 'POST /api/v1/energies/sweep', body: sweepBody(11), debounce: false }), client));
		await vi.waitFor(() => expect(q.value.data).toBeDefined());
		expect(calls).toEqual([{ url: '/api/v1/energies/sweep', method: 'POST', contentType: 'application/json', body: sweepBody(11) }]);
		expect(q.value.dataBody).toEqual(sweepBody(11));
		expect(q.value.error).toBeNull();
		q.stop();
	});

	it('asks again for a new body, and answers a body seen before from the cache', async () => {
		let points = $state(11);
		answer = (c) => json({ points: (c.body as { points: number }).points });
		const client = createAppQueryClient();
		const q = setUp(() => apiQuery(() => ({ route: 'POST /api/v1/energies/sweep', body: sweepBody(points), debounce: false }), client));
		await vi.waitFor(() => expect(q.value.data).toEqual({ points: 11 }));
		points = 21;
		flushSync();
		await vi.waitFor(() => expect(q.value.data).toEqual({ points: 21 }));
		points = 11;
		flushSync();
		await vi.waitFor(() => expect(q.value.data).toEqual({ points: 11 }));
		expect(calls.map((c) => (c.body as { points: number }).points)).toEqual([11, 21]);
		q.stop();
	});

	it('sends only the last of quick changes, once they have been still for DEBOUNCE_MS', async () => {
		let points = $state(5);
		const client = createAppQueryClient();
		const q = setUp(() => apiQuery(() => ({ route: 'POST /api/v1/energies/sweep', body: sweepBody(points) }), client));
		await vi.waitFor(() => expect(calls).toHaveLength(1)); // the first input goes at once
		for (const p of [6, 7, 8]) {
			points = p;
			flushSync();
		}
		expect(q.value.busy).toBe(true);
		await new Promise((r) => setTimeout(r, DEBOUNCE_MS * 3));
		expect(calls.map((c) => (c.body as { points: number }).points)).toEqual([5, 8]);
		q.stop();
	});

	it('gives the server’s refusal as an ApiError with its message and field', async () => {
		answer = () => json({ error: { message: 'points must be from 3 to 201', field: 'points' } }, 400);
		const client = createAppQueryClient();
		const q = setUp(() => apiQuery(() => ({ route: 'POST /api/v1/energies/sweep', body: sweepBody(1), debounce: false }), client));
		await vi.waitFor(() => expect(q.value.error).not.toBeNull());
		expect([q.value.error?.status, q.value.error?.message, q.value.error?.field]).toEqual([400, 'points must be from 3 to 201', 'points']);
		expect(q.value.data).toBeUndefined();
		q.stop();
	});
});

describe('apiPages', () => {
	it('reads the first page, then the next with the cursor it was given, until there is none', async () => {
		answer = (c) => {
			const cursor = new URL(c.url, 'http://x').searchParams.get('cursor');
			return json(cursor === 'c2' ? { entries: [{ id: 'b' }], nextCursor: null } : { entries: [{ id: 'a' }], nextCursor: 'c2' });
		};
		const client = createAppQueryClient();
		const list = setUp(() =>
			apiPages(() => ({ route: 'GET /api/v1/projects/:projectId/shelf', params: { projectId: 'p1', limit: 1 }, debounce: false }), client)
		);
		await vi.waitFor(() => expect(list.value.pages).toHaveLength(1));
		expect(list.value.hasMore).toBe(true);
		list.value.more();
		await vi.waitFor(() => expect(list.value.pages).toHaveLength(2));
		expect(list.value.pages!.flatMap((p) => p.entries.map((e) => e.id))).toEqual(['a', 'b']);
		expect(list.value.hasMore).toBe(false);
		expect(calls.map((c) => c.url)).toEqual(['/api/v1/projects/p1/shelf?limit=1', '/api/v1/projects/p1/shelf?limit=1&cursor=c2']);
		list.stop();
	});
});
