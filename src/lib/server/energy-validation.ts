/**
 * Input schemas (zod) of the Energy solver API, with messages that say what is allowed.
 * The engine checks the physics (which integrals exist in the configuration); these check shape and size.
 */
import { z } from 'zod';
import { MAX_CONFIGURATION_LENGTH } from '../physics/parse';
import { SWEEP_POINTS } from '../physics/sweep';

/**
 * Largest M_J block and whole configuration a request for levels may ask for: 4f⁷ 5d (34 320
 * determinants, 3 106 in its central block) fits, and takes several seconds in a compute worker
 * (see `npm run bench`).
 */
export const API_MAX_BLOCK_DETERMINANTS = 3200;
export const API_MAX_TOTAL_DETERMINANTS = 40000;
/**
 * A sweep solves the levels at every point (61 by default) and a fit at every iteration, so they
 * take smaller configurations: 4f⁴ 5d (10 010 determinants, block 977) solves warm in under 0.1 s.
 */
export const API_MAX_BLOCK_REPEATED = 1200;
export const API_MAX_TOTAL_REPEATED = 12000;
/** Largest number of entries in each parameter list, and of observed levels in a fit. */
export const API_MAX_LIST = 100;
export const API_MAX_OBSERVED = 500;

const finite = (what: string) =>
	z.number({ error: `${what} must be a number (cm⁻¹)` }).refine(Number.isFinite, `${what} must be a finite number (cm⁻¹)`);
const shell = (what: string) =>
	z
		.string({ error: `${what} must be a subshell name such as "3d"` })
		.trim()
		.min(1, `${what} must not be empty`)
		.max(8, `${what} must be a subshell name such as "3d"`);

const integral = (kind: 'F' | 'G') =>
	z.object({
		k: z
			.number({ error: `${kind}: k must be an integer` })
			.int(`${kind}: k must be an integer`)
			.min(0, `${kind}: k must be 0 or more`)
			.max(40, `${kind}: k must be at most 40`),
		a: shell(`${kind}: a`),
		b: shell(`${kind}: b`),
		value: finite(`${kind}: value`)
	});

export const energyParametersSchema = z.object(
	{
		Eav: finite('Eav').optional(),
		F: z
			.array(integral('F'), { error: 'F must be a list of { k, a, b, value }' })
			.max(API_MAX_LIST, `F holds at most ${API_MAX_LIST} integrals`)
			.optional(),
		G: z
			.array(integral('G'), { error: 'G must be a list of { k, a, b, value }' })
			.max(API_MAX_LIST, `G holds at most ${API_MAX_LIST} integrals`)
			.optional(),
		zeta: z
			.array(z.object({ shell: shell('zeta: shell'), value: finite('zeta: value') }), { error: 'zeta must be a list of { shell, value }' })
			.max(API_MAX_LIST, `zeta holds at most ${API_MAX_LIST} entries`)
			.optional()
	},
	{ error: 'parameters must be an object { Eav, F, G, zeta }' }
);

const configSchema = z
	.string({ error: 'config must be a configuration such as "3d2"' })
	.trim()
	.min(1, 'config must not be empty')
	.max(MAX_CONFIGURATION_LENGTH, `config must be at most ${MAX_CONFIGURATION_LENGTH} characters`);

const gsSchema = z.enum(['exact', 'free'], { error: 'gs must be "exact" (g_s = 2) or "free" (g_s = 2.00231930436)' }).default('exact');

export const energiesRequestSchema = z.object({
	config: configSchema,
	parameters: energyParametersSchema.default({}),
	gs: gsSchema
});

export const sweepRequestSchema = z.object({
	config: configSchema,
	parameters: energyParametersSchema.default({}),
	points: z
		.number({ error: 'points must be an integer' })
		.int('points must be an integer')
		.min(SWEEP_POINTS.min, `points must be from ${SWEEP_POINTS.min} to ${SWEEP_POINTS.max}`)
		.max(SWEEP_POINTS.max, `points must be from ${SWEEP_POINTS.min} to ${SWEEP_POINTS.max}`)
		.default(SWEEP_POINTS.default)
});

const idSchema = (what: string) =>
	z
		.string({ error: `${what} must be a parameter name such as "F2(3d,3d)"` })
		.trim()
		.min(1, `${what} must not be empty`)
		.max(40, `${what} is too long`);

export const fitRequestSchema = z.object({
	config: configSchema,
	parameters: energyParametersSchema.default({}),
	vary: z
		.array(idSchema('vary'), { error: 'vary must be a list of parameter names such as ["Eav", "F2(3d,3d)"]' })
		.min(1, 'vary must name at least one parameter')
		.max(API_MAX_LIST, `vary holds at most ${API_MAX_LIST} names`),
	links: z
		.array(z.object({ id: idSchema('links: id'), to: idSchema('links: to'), ratio: finite('links: ratio').optional() }), {
			error: 'links must be a list of { id, to, ratio? }'
		})
		.max(API_MAX_LIST, `links holds at most ${API_MAX_LIST} entries`)
		.optional(),
	bounds: z
		.array(z.object({ id: idSchema('bounds: id'), min: finite('bounds: min').optional(), max: finite('bounds: max').optional() }), {
			error: 'bounds must be a list of { id, min?, max? }'
		})
		.max(API_MAX_LIST, `bounds holds at most ${API_MAX_LIST} entries`)
		.optional(),
	observed: z
		.array(
			z.object({
				J: z.union([z.string().max(10), z.number()], { error: 'observed: J must be like 2 or "5/2"' }).transform(String),
				energy: finite('observed: energy'),
				uncertainty: z
					.number({ error: 'observed: uncertainty must be a number (cm⁻¹)' })
					.positive('observed: uncertainty must be positive')
					.optional(),
				assign: z
					.union([z.string().max(20), z.number().int()], {
						error: 'observed: assign must be a term label such as "3F" or a rank such as 2'
					})
					.optional()
			}),
			{ error: 'observed must be a list of { J, energy, uncertainty?, assign? }' }
		)
		.max(API_MAX_OBSERVED, `observed holds at most ${API_MAX_OBSERVED} levels`)
});

// ---------------------------------------------------------------- parameter sets and fit reports of a Shelf entry

const setName = z
	.string({ error: 'name must be text' })
	.trim()
	.min(1, 'name must not be empty: give the set a name such as "fit of 12 levels"')
	.max(120, 'name must be at most 120 characters');
const setComment = z.string({ error: 'comment must be text' }).trim().max(2000, 'comment must be at most 2000 characters');

export const parameterSetInputSchema = z.object({
	name: setName,
	parameters: energyParametersSchema,
	comment: setComment.default('')
});

export const parameterSetPatchSchema = z
	.object({
		name: setName.optional(),
		parameters: energyParametersSchema.optional(),
		comment: setComment.optional(),
		version: z.number({ error: 'version must be the number you last read' }).int('version must be an integer')
	})
	.refine(
		(p) => p.name !== undefined || p.parameters !== undefined || p.comment !== undefined,
		'send name, parameters or comment to change'
	);

/**
 * A fit of a Shelf entry (POST …/fits): as POST /api/v1/fit without `config` (the entry's), and
 * `observed` optional: without it, the entry's annotated observed energies are used.
 */
export const entryFitInputSchema = fitRequestSchema.omit({ config: true, observed: true }).extend({
	observed: fitRequestSchema.shape.observed.optional(),
	parameterSetId: z.string({ error: 'parameterSetId must be the id of a parameter set of this entry' }).max(40).optional()
});
