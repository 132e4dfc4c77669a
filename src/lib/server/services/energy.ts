/**
 * Energy solver use-cases for the API: validate the body (zod), call the pure engine with the
 * request budgets, and trim what goes over the wire. No sign-in and no database: pure computation.
 */
import { intermediateLevels, type IcResult } from '../../physics/levels-ic';
import { couplingSweep } from '../../physics/sweep';
import { fitParameters } from '../../physics/fit';
import { GS_FREE_ELECTRON } from '../../physics/lande';
import {
	API_MAX_BLOCK_DETERMINANTS,
	API_MAX_BLOCK_REPEATED,
	API_MAX_TOTAL_DETERMINANTS,
	API_MAX_TOTAL_REPEATED,
	energiesRequestSchema,
	fitRequestSchema,
	sweepRequestSchema
} from '../energy-validation';

/** The determinant budgets of one request for levels (the engine states them in its RangeError). */
export const API_LIMITS = { maxBlock: API_MAX_BLOCK_DETERMINANTS, maxTotal: API_MAX_TOTAL_DETERMINANTS } as const;
/** The budgets of a sweep or a fit, which solve the levels many times. */
export const REPEATED_LIMITS = { maxBlock: API_MAX_BLOCK_REPEATED, maxTotal: API_MAX_TOTAL_REPEATED } as const;

/** Components below this percentage are left out of API answers (they are tiny; the full sums are 100 %). */
export const REPORTED_COMPONENT_FLOOR = 0.01;

function trim(result: IcResult): IcResult {
	return {
		...result,
		levels: result.levels.map((l) => ({
			...l,
			components: l.components.filter((c) => c.percent >= REPORTED_COMPONENT_FLOOR),
			jj: l.jj.filter((c) => c.percent >= REPORTED_COMPONENT_FLOOR)
		}))
	};
}

/** POST /api/v1/energies. Throws ZodError, ConfigurationError or RangeError (all 400 through `api()`). */
export function computeEnergies(body: unknown): IcResult & { limits: typeof API_LIMITS } {
	const input = energiesRequestSchema.parse(body);
	const result = intermediateLevels(input.config, input.parameters, { gs: input.gs === 'free' ? GS_FREE_ELECTRON : 2, limits: API_LIMITS });
	return { ...trim(result), limits: API_LIMITS };
}

/** POST /api/v1/energies/sweep. */
export function computeSweep(body: unknown) {
	const input = sweepRequestSchema.parse(body);
	return { ...couplingSweep(input.config, input.parameters, { points: input.points, limits: REPEATED_LIMITS }), limits: REPEATED_LIMITS };
}

/** POST /api/v1/fit. */
export function computeFit(body: unknown) {
	const input = fitRequestSchema.parse(body);
	return {
		...fitParameters(
			input.config,
			{ parameters: input.parameters, vary: input.vary, links: input.links, bounds: input.bounds, observed: input.observed },
			{ limits: REPEATED_LIMITS }
		),
		limits: REPEATED_LIMITS
	};
}
