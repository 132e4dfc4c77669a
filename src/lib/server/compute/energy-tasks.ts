/**
 * The Energy solver's compute tasks (POST /api/v1/energies, /energies/sweep, /fit and a Shelf
 * entry's fit): the validated body in, the route's answer out (services/energy.ts), so a worker
 * thread can run them. Relative imports only: bundled for the worker.
 */
import type { ComputeTask } from './tasks';
import { computeEnergies, computeFit, computeSweep } from '../services/energy';
import { determinantCounts } from '../../physics/determinants';
import { parseConfiguration } from '../../physics/parse';
import { numberFromEnv } from './env-number';

/**
 * At most this many determinants in the whole configuration run on the request thread (3d⁴ has
 * 210, f³ 364: a few ms; f⁷ with 3 432 takes about a second — see `npm run bench`).
 */
export const LIGHT_ENERGY_DETERMINANTS = 400;

/** Bad notation counts as light: it fails fast, and the task says what is wrong. */
function lightConfig(config: string, factor = 1): boolean {
	try {
		return determinantCounts(parseConfiguration(config)).total * factor <= LIGHT_ENERGY_DETERMINANTS;
	} catch {
		return true;
	}
}

/**
 * The Energy solver's time limit in a worker (COMPUTE_ENERGY_TIMEOUT_MS, default 60 s): the largest
 * configurations the API takes (4f⁷ 5d) need several seconds cold, more on a busy machine.
 */
export const ENERGY_TIMEOUT_MS = numberFromEnv('COMPUTE_ENERGY_TIMEOUT_MS', 60_000);

type Body = { config: string; points?: number };

export const energies: ComputeTask<Body> = {
	light: (b) => lightConfig(b.config),
	run: (b) => computeEnergies(b),
	timeoutMs: ENERGY_TIMEOUT_MS
};
// A sweep solves the matrix at every point, a fit at every iteration: each counts as several solutions.
export const sweep: ComputeTask<Body> = {
	light: (b) => lightConfig(b.config, (b.points ?? 61) / 4),
	run: (b) => computeSweep(b),
	timeoutMs: ENERGY_TIMEOUT_MS
};
export const fit: ComputeTask<Body> = { light: (b) => lightConfig(b.config, 10), run: (b) => computeFit(b), timeoutMs: ENERGY_TIMEOUT_MS };
