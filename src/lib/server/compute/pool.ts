/**
 * Heavy compute requests run in a pool of worker threads (piscina), so that one large Term
 * sheet or jj listing cannot hold up the request thread (and with it every other request).
 * Light requests — a closed-form estimate says they take a few ms (./tasks.ts `light`) — run
 * inline, which is faster than a round trip to a thread.
 *
 * - Threads: COMPUTE_THREADS, default one less than the machine's cores (at least 1), so a core
 *   stays free for the request thread. Each thread's heap is capped (COMPUTE_HEAP_MB, 512 MB):
 *   a runaway task ends its worker, not the server.
 * - Time: a task that runs longer than COMPUTE_TIMEOUT_MS (default 10 000), or its own limit
 *   (the Energy solver's tasks: COMPUTE_ENERGY_TIMEOUT_MS, default 60 000), is stopped (its
 *   thread is terminated) and answered 503. Queue: at most COMPUTE_QUEUE (default 64) waiting
 *   tasks, then 503 "busy".
 * - The worker file: build/compute-worker.js in the built app (scripts/build-worker.js), or
 *   ./worker.ts through tsx in development and tests. Without either (or with COMPUTE_POOL=off,
 *   for comparison), every task runs inline.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import { numberFromEnv } from './env-number';
import { errorBody, isLight, runTask, taskTimeoutMs, type TaskArgs, type TaskName, type TaskResult } from './tasks';

/** Longest a pooled task may run, in ms. */
export const COMPUTE_TIMEOUT_MS = numberFromEnv('COMPUTE_TIMEOUT_MS', 10_000);
const THREADS = numberFromEnv('COMPUTE_THREADS', Math.max(1, availableParallelism() - 1));
const QUEUE = numberFromEnv('COMPUTE_QUEUE', 64);
const HEAP_MB = numberFromEnv('COMPUTE_HEAP_MB', 512);
/**
 * A thread idle this long ends. Long enough (COMPUTE_IDLE_MS, default 10 min) that a worker keeps
 * the energy structures it built (energy-structure.ts caches them) while someone edits parameters.
 */
const IDLE_MS = numberFromEnv('COMPUTE_IDLE_MS', 600_000);

/** Where the worker entry is, and how to load it. */
function workerEntry(): { filename: string; execArgv: string[] } | null {
	if (process.env.COMPUTE_POOL === 'off') return null;
	const configured = process.env.COMPUTE_WORKER;
	if (configured) return { filename: configured, execArgv: [] };
	const here = dirname(fileURLToPath(import.meta.url));
	// Built app: this code is in build/server/chunks/…; the bundled worker is build/compute-worker.js.
	for (let dir = here, i = 0; i < 4; i++, dir = dirname(dir)) {
		const built = join(dir, 'compute-worker.js');
		if (existsSync(built)) return { filename: built, execArgv: [] };
	}
	const source = join(here, 'worker.ts');
	if (existsSync(source)) return { filename: source, execArgv: ['--import', 'tsx'] };
	return null;
}

let pool: Piscina | null | undefined;
let closing = false;

function getPool(): Piscina | null {
	if (pool !== undefined) return pool;
	closing = false;
	const entry = workerEntry();
	if (!entry) {
		if (process.env.COMPUTE_POOL !== 'off')
			console.warn('compute: no worker file found (build/compute-worker.js); heavy tasks run on the request thread');
		pool = null;
		return pool;
	}
	pool = new Piscina({
		filename: entry.filename,
		execArgv: entry.execArgv,
		minThreads: 0,
		maxThreads: THREADS,
		maxQueue: QUEUE,
		idleTimeout: IDLE_MS,
		resourceLimits: { maxOldGenerationSizeMb: HEAP_MB }
	});
	return pool;
}

/** Ends the pool's threads (tests; shutdown). */
export async function closeComputePool(): Promise<void> {
	closing = true;
	const p = pool;
	pool = undefined;
	if (p) await p.destroy();
}

process.once('sveltekit:shutdown' as 'exit', () => void closeComputePool());

/** Options of `compute`. */
export interface ComputeOptions {
	/** Run in the pool even when the estimate says the task is light (tests). */
	pooled?: boolean;
	timeoutMs?: number;
	/**
	 * The caller gave up (the browser's Cancel, or a closed connection: SvelteKit aborts
	 * `event.request.signal`): a waiting task leaves the queue, a running one has its thread ended.
	 */
	signal?: AbortSignal;
}

/** Status of a task its caller cancelled (nginx's "client closed request"; nobody reads the answer). */
export const CANCELLED_STATUS = 499;

/**
 * Runs a compute task — inline when light, otherwise in the worker pool — and returns its
 * status and JSON body. Never rejects for bad input (400 in the body), for a timeout or a full
 * queue (503); rejects only on a bug when run inline.
 * @example await compute('terms', { config: '3d5 4s', gs: 'exact' }) // { status: 200, body: '{"configuration":…' }
 */
export async function compute<N extends TaskName>(
	name: N,
	args: TaskArgs<N>,
	options: ComputeOptions = {}
): Promise<TaskResult & { where: 'inline' | 'worker' }> {
	const inline = () => ({ ...runTask(name, args), where: 'inline' as const });
	if (!options.pooled && isLight(name, args)) return inline();
	const p = getPool();
	if (!p) return inline();
	const where = 'worker' as const;
	const timeoutMs = options.timeoutMs ?? taskTimeoutMs(name) ?? COMPUTE_TIMEOUT_MS;
	if (options.signal?.aborted) return { where, status: CANCELLED_STATUS, body: errorBody('the computation was cancelled') };
	const timeout = AbortSignal.timeout(timeoutMs);
	const signal = options.signal ? AbortSignal.any([timeout, options.signal]) : timeout;
	try {
		return { ...((await p.run({ name, args }, { signal })) as TaskResult), where };
	} catch (e) {
		const err = e as Error;
		if (options.signal?.aborted) return { where, status: CANCELLED_STATUS, body: errorBody('the computation was cancelled') };
		if (err?.name === 'AbortError' || err?.name === 'TimeoutError')
			return {
				where,
				status: 503,
				body: errorBody(`the computation took longer than ${timeoutMs / 1000} s and was stopped; try a smaller configuration`, {
					limitMs: timeoutMs
				})
			};
		if (/queue is at limit/i.test(err?.message ?? ''))
			return { where, status: 503, body: errorBody('the server is busy with other computations; try again in a moment') };
		if (closing) return { where, status: 503, body: errorBody('the server is shutting down; try again in a moment') };
		console.error(`compute task ${name} failed`, e);
		return { where, status: 500, body: errorBody('the computation failed on the server (an internal error); it has been logged') };
	}
}

/** `compute` as a JSON Response for a +server.ts handler; the header x-termwright-compute says where it ran. */
export async function computeResponse<N extends TaskName>(name: N, args: TaskArgs<N>, signal?: AbortSignal): Promise<Response> {
	const r = await compute(name, args, { signal });
	return new Response(r.body, { status: r.status, headers: { 'content-type': 'application/json', 'x-termwright-compute': r.where } });
}
