/**
 * Fuzzing (fast-check): hostile and careless notation, species and query strings into the engine
 * entry points and the compute API handlers. Properties (product rules, common practice, no
 * source): nothing crashes; bad input is refused with the engine's own errors (InputError,
 * RangeError — which includes the budget's BudgetError, checked before any work), never another
 * exception; every API answer is below 500 and every refusal has the `{ "error": { "message" } }`
 * shape. `npm test` runs a short version; `npm run fuzz` runs FUZZ_RUNS (10 000) cases per
 * target and prints the slowest case of each (timings are reported, never asserted).
 */
import { afterAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { RequestEvent } from '@sveltejs/kit';
import { jsonBodyText, notation, queryString, species } from './arbitraries';
import { InputError } from '../physics/input-error';
import { parseConfiguration } from '../physics/parse';
import { termSheet } from '../physics/report';
import { termsOf, levelCountsByJ } from '../physics/terms';
import { hundGround, hundOrder } from '../physics/hund';
import { microstateGrid } from '../physics/microstates';
import { jjLevelCountsByJ, jjLevels } from '../physics/jj';
import { couplingBridge } from '../physics/bridge';
import { listMicrostates } from '../physics/listing';
import { parentageOf } from '../physics/parentage';
import { groundConfiguration, parseSpecies } from '../physics/elements';
import { closeComputePool } from '../server/compute/pool';

const RUNS = Number(process.env.FUZZ_RUNS ?? 60);
const TIMEOUT = Math.max(60_000, RUNS * 100);

/** Slowest case of each target, for the report of `npm run fuzz`. */
const slowest = new Map<string, { ms: number; input: string; cases: number }>();
function timed<T>(target: string, input: string, run: () => T): T {
	const t0 = performance.now();
	try {
		return run();
	} finally {
		const ms = performance.now() - t0;
		const s = slowest.get(target) ?? { ms: -1, input: '', cases: 0 };
		s.cases++;
		if (ms > s.ms) Object.assign(s, { ms, input });
		slowest.set(target, s);
	}
}
async function timedAsync<T>(target: string, input: string, run: () => Promise<T>): Promise<T> {
	const t0 = performance.now();
	try {
		return await run();
	} finally {
		const ms = performance.now() - t0;
		const s = slowest.get(target) ?? { ms: -1, input: '', cases: 0 };
		s.cases++;
		if (ms > s.ms) Object.assign(s, { ms, input });
		slowest.set(target, s);
	}
}

afterAll(async () => {
	await closeComputePool();
	const rows = [...slowest].map(
		([target, s]) =>
			`${target.padEnd(34)} ${String(s.cases).padStart(6)} cases, slowest ${s.ms.toFixed(1).padStart(7)} ms: ${JSON.stringify(s.input).slice(0, 60)}`
	);
	console.log(`fuzz (${RUNS} runs per target)\n` + rows.join('\n'));
});

/** The engine's refusals: a clear message of its own, nothing else. */
function expectRefusal(e: unknown) {
	expect(e instanceof InputError || e instanceof RangeError, `unexpected ${String(e)}`).toBe(true);
	expect((e as Error).message.length).toBeGreaterThan(10);
}

const ENGINE: [string, (text: string) => unknown][] = [
	['parseConfiguration', (t) => parseConfiguration(t)],
	['termSheet', (t) => termSheet(parseConfiguration(t))],
	['termSheet gs=free', (t) => termSheet(parseConfiguration(t), { gs: 'free' })],
	['termsOf', (t) => termsOf(parseConfiguration(t))],
	['levelCountsByJ', (t) => levelCountsByJ(parseConfiguration(t))],
	['microstateGrid', (t) => microstateGrid(parseConfiguration(t))],
	['hundGround', (t) => hundGround(parseConfiguration(t))],
	['hundOrder', (t) => hundOrder(parseConfiguration(t))],
	['jjLevelCountsByJ', (t) => jjLevelCountsByJ(parseConfiguration(t))],
	['jjLevels', (t) => jjLevels(parseConfiguration(t))],
	['couplingBridge', (t) => couplingBridge(parseConfiguration(t))],
	['parentageOf', (t) => parentageOf(parseConfiguration(t))],
	['listMicrostates', (t) => listMicrostates(parseConfiguration(t), { offset: 10n ** 20n, limit: 20 })]
];

describe('fuzz: notation into the engine entry points', () => {
	for (const [name, run] of ENGINE) {
		it(`${name}: answers, or refuses with the engine's own error`, { timeout: TIMEOUT }, () => {
			fc.assert(
				fc.property(notation, (text) => {
					try {
						timed(name, text, () => run(text));
					} catch (e) {
						expectRefusal(e);
					}
				}),
				{ numRuns: RUNS }
			);
		});
	}
});

describe('fuzz: species into the element table', () => {
	it('parseSpecies and groundConfiguration answer, or refuse with a SpeciesError', { timeout: TIMEOUT }, () => {
		fc.assert(
			fc.property(species, (text) => {
				try {
					timed('groundConfiguration', text, () => groundConfiguration(parseSpecies(text)));
				} catch (e) {
					expectRefusal(e);
				}
			}),
			{ numRuns: RUNS }
		);
	});
});

// Every compute route of the API, found on disk so that a new route cannot be missed.
type Handler = (event: RequestEvent) => Promise<Response>;
const modules = import.meta.glob<{ GET?: Handler; POST?: Handler }>('/src/routes/api/v1/*/+server.ts', { eager: true });
const routes = Object.entries(modules)
	.map(([file, mod]) => ({ path: file.replace('/src/routes', '').replace('/+server.ts', ''), mod }))
	.filter((r) => r.path !== '/api/v1/projects');

function fakeEvent(path: string, query: string, init?: RequestInit): RequestEvent {
	const url = new URL(`http://localhost${path}${query ? `?${query}` : ''}`);
	return {
		url,
		request: new Request(url, init),
		params: {},
		locals: { user: null, session: null },
		route: { id: path },
		cookies: { get: () => undefined, getAll: () => [], set() {}, delete() {}, serialize: () => '' },
		setHeaders() {},
		getClientAddress: () => '127.0.0.1',
		platform: undefined,
		isDataRequest: false,
		isSubRequest: false,
		fetch
	} as unknown as RequestEvent;
}

async function expectApiAnswer(res: Response) {
	expect(res.status, `status ${res.status}`).toBeLessThan(500);
	if (res.status >= 400) {
		const body = await res.json();
		expect(typeof body?.error?.message).toBe('string');
		expect(body.error.message.length).toBeGreaterThan(5);
		expect(JSON.stringify(body)).not.toMatch(/\bat .*\.(ts|js):\d+/); // no stack traces
	} else if ((res.headers.get('content-type') ?? '').includes('json')) await res.json();
}

describe('fuzz: query strings and bodies of every compute route', () => {
	it('finds the compute routes on disk', () => {
		expect(routes.map((r) => r.path)).toEqual(expect.arrayContaining(['/api/v1/terms', '/api/v1/jj', '/api/v1/bridge', '/api/v1/wigner']));
	});
	for (const { path, mod } of routes) {
		if (mod.GET) {
			const GET = mod.GET;
			it(`GET ${path}: never a 500, every refusal in the error shape`, { timeout: TIMEOUT }, async () => {
				await fc.assert(
					fc.asyncProperty(queryString, async (query) => {
						await expectApiAnswer(await timedAsync(`GET ${path}`, query, () => GET(fakeEvent(path, query))));
					}),
					{ numRuns: RUNS }
				);
			});
		}
		if (mod.POST) {
			const POST = mod.POST;
			it(`POST ${path}: never a 500, every refusal in the error shape`, { timeout: TIMEOUT }, async () => {
				await fc.assert(
					fc.asyncProperty(jsonBodyText, async (body) => {
						const init = { method: 'POST', body, headers: { 'content-type': 'application/json' } };
						await expectApiAnswer(await timedAsync(`POST ${path}`, body, () => POST(fakeEvent(path, '', init))));
					}),
					{ numRuns: RUNS }
				);
			});
		}
	}
});
