/**
 * The Energy solver's compute tasks in the pool: a worker's answer equals the inline one, a
 * cancelled request ends its task (and the pool keeps working), and the request thread answers
 * light requests while a heavy one runs (product rules, common practice, no source; the level
 * count of d² — 9 levels: ³F₂,₃,₄ ³P₀,₁,₂ ¹D₂ ¹G₄ ¹S₀ — from Condon & Shortley 1935, ch. VII).
 */
import { afterAll, describe, expect, it } from 'vitest';
import { CANCELLED_STATUS, closeComputePool, compute, COMPUTE_TIMEOUT_MS } from './pool';
import { isLight, runTask, taskTimeoutMs } from './tasks';
import { ENERGY_TIMEOUT_MS } from './energy-tasks';

afterAll(() => closeComputePool());

const D2 = { config: '3d2', parameters: { F: [{ k: 2, a: '3d', b: '3d', value: 61600 }], zeta: [{ shell: '3d', value: 80 }] } };
// f⁷: 3 432 determinants, the largest M_J block 327 (within the API's limits): about a second of work.
const F7 = { config: '4f7', parameters: { F: [{ k: 2, a: '4f', b: '4f', value: 90000 }], zeta: [{ shell: '4f', value: 1200 }] } };

describe('Energy solver tasks in the compute pool', () => {
	it('the Energy solver tasks carry their own time limit, longer than the pool default (4f⁷ 5d needs several seconds; product rule)', () => {
		for (const name of ['energies', 'sweep', 'fit'] as const) expect(taskTimeoutMs(name)).toBe(ENERGY_TIMEOUT_MS);
		expect(ENERGY_TIMEOUT_MS).toBeGreaterThan(COMPUTE_TIMEOUT_MS);
		expect(taskTimeoutMs('terms')).toBeUndefined();
	});

	it('d² stays on the request thread, f⁷ goes to the pool', () => {
		expect(isLight('energies', D2)).toBe(true);
		expect(isLight('energies', F7)).toBe(false);
		expect(isLight('fit', F7)).toBe(false);
	});

	it('the levels of 3d2 from a worker thread equal the inline ones (9 levels)', async () => {
		const pooled = await compute('energies', D2, { pooled: true });
		expect(pooled).toMatchObject({ status: 200, where: 'worker' });
		expect(pooled.body).toBe(runTask('energies', D2).body);
		expect(JSON.parse(pooled.body).levels).toHaveLength(9);
	});

	it('a cancelled request ends its task with the cancelled status, and the pool works afterwards', async () => {
		const controller = new AbortController();
		const running = compute('energies', F7, { signal: controller.signal });
		setTimeout(() => controller.abort(), 50);
		const r = await running;
		expect(r.status).toBe(CANCELLED_STATUS);
		expect(JSON.parse(r.body).error.message).toMatch(/cancelled/);
		expect((await compute('energies', D2, { pooled: true })).status).toBe(200);
	});

	it('a request already cancelled is not run at all', async () => {
		const r = await compute('energies', F7, { signal: AbortSignal.abort() });
		expect(r.status).toBe(CANCELLED_STATUS);
	});

	it('while f⁷ runs in a worker, a light request is answered first (the request thread stays free)', async () => {
		const order: string[] = [];
		const heavy = compute('energies', F7).then((r) => order.push(`heavy ${r.status}`));
		await new Promise((resolve) => setTimeout(resolve, 20));
		const light = compute('energies', D2).then((r) => order.push(`light ${r.status} ${r.where}`));
		await Promise.all([heavy, light]);
		expect(order).toEqual(['light 200 inline', 'heavy 200']);
	});
});
