/**
 * The compute pool answers like the inline path, in the API's error shape, and stops a task
 * that runs over its time limit (product rules, common practice, no source).
 */
import { afterAll, describe, expect, it } from 'vitest';
import { closeComputePool, compute } from './pool';
import { isLight, runTask } from './tasks';

afterAll(() => closeComputePool());

describe('compute pool', () => {
	it('a Term sheet from a worker thread equals the inline one (3d3: 2P 2D(2) 2F 2G 2H 4P 4F)', async () => {
		const pooled = await compute('terms', { config: '3d3', gs: 'exact' }, { pooled: true });
		expect(pooled.status).toBe(200);
		expect(pooled.body).toBe(runTask('terms', { config: '3d3', gs: 'exact' }).body);
		// Condon & Shortley (1935) ch. VII: d³ has 8 terms.
		expect(JSON.parse(pooled.body).termCount).toBe('8');
	});

	it('bad notation from a worker is a 400 naming the token', async () => {
		const r = await compute('terms', { config: '1s2 2p7', gs: 'exact' }, { pooled: true });
		expect(r.status).toBe(400);
		expect(JSON.parse(r.body).error).toMatchObject({ token: '2p7' });
	});

	it('over the budget (12o23) is a 400 stating the limit, from the worker too', async () => {
		const r = await compute('terms', { config: '12o23', gs: 'exact' });
		expect(r.status).toBe(400);
		expect(JSON.parse(r.body).error.message).toMatch(/over the limit of 15000/);
	});

	it('a task over its time limit is stopped and answered 503 in the error shape', async () => {
		// The bridge of 4f7 5d 6p lists 18 131 levels on each side: far more than 1 ms of work.
		const r = await compute('bridge', { config: '4f7 5d 6p' }, { pooled: true, timeoutMs: 1 });
		expect(r.status).toBe(503);
		expect(JSON.parse(r.body).error.message).toMatch(/longer than 0.001 s/);
		// The pool still works afterwards.
		expect((await compute('jj', { config: '2p2', countsOnly: true }, { pooled: true })).status).toBe(200);
	});

	it('small requests stay on the request thread, large ones go to the pool', () => {
		expect(isLight('terms', { config: '3d5 4s', gs: 'exact' })).toBe(true);
		expect(isLight('terms', { config: '10m19', gs: 'exact' })).toBe(false);
		expect(isLight('bridge', { config: '4f7 5d 6p' })).toBe(false);
		expect(isLight('wigner', { symbol: '9j', args: Array(9).fill('50') })).toBe(false);
		expect(isLight('basis', { tj1: 20, tj2: 20 })).toBe(false);
	});
});
