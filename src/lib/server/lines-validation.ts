/**
 * Input schemas (zod) of the Transition finder and Line matcher routes, with messages that say what is allowed.
 * The engine re-checks everything it is given; these only shape JSON and query text into its plain data.
 */
import { z } from 'zod';
import { parseHalf } from '../physics/half';
import { parseTermSymbol, TRANSITION_TYPES, type TransitionType } from '../physics/transitions';
import {
	MAX_CANDIDATES_LIMIT,
	MAX_MATCH_LEVELS,
	MAX_MATCH_LINES,
	type MatchLevel,
	type ObservedLine,
	type Tolerance
} from '../physics/matcher';
import { SPECTRAL_UNITS } from '../physics/airvac';
import { badRequest } from './errors';

/** Largest JSON body of POST /api/v1/match (the app server's own request limit is 512 KB as well). */
export const MAX_MATCH_BODY_BYTES = 512 * 1024;

const typeSchema = z.enum(TRANSITION_TYPES as [TransitionType, ...TransitionType[]], {
	error: `a transition type must be one of ${TRANSITION_TYPES.join(', ')}`
});

/** "E1,M1" from a query parameter; E1 when absent. Throws a 400 naming the bad entry. */
export function parseTypesParam(text: string | null): TransitionType[] {
	if (text === null || text.trim() === '') return ['E1'];
	const parts = text.split(',').map((s) => s.trim().toUpperCase());
	for (const p of parts)
		if (!(TRANSITION_TYPES as readonly string[]).includes(p))
			throw badRequest(`types: "${p}" is not a transition type; use a comma-separated list of E1, M1, E2`);
	return [...new Set(parts)] as TransitionType[];
}

const finite = (label: string) =>
	z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a finite number`);
const nonNegative = (label: string) => finite(label).refine((v) => v >= 0, `${label} must be ≥ 0`);

const jSchema = z.union([z.number(), z.string()], { error: 'J must be a number or a fraction such as "3/2"' }).transform((v, ctx) => {
	try {
		const twoJ = typeof v === 'number' ? 2 * v : parseHalf(v);
		if (!Number.isInteger(twoJ) || twoJ < 0) throw new RangeError('bad');
		return twoJ;
	} catch {
		ctx.addIssue({ code: 'custom', message: `J = ${JSON.stringify(v)} is not allowed: J must be 0, 1/2, 1, 3/2, … (a number or "3/2")` });
		return z.NEVER;
	}
});

const levelSchema = z
	.object({
		energy: finite('energy (cm⁻¹)'),
		J: jSchema,
		parity: z.enum(['even', 'odd'], { error: 'parity must be "even" or "odd"' }),
		label: z.string({ error: 'label must be text' }).max(120, 'label must be at most 120 characters').optional(),
		term: z.string({ error: 'term must be text such as "3P" or "²D°"' }).max(12, 'term must be at most 12 characters').optional(),
		uncertainty: nonNegative('uncertainty (cm⁻¹)').optional()
	})
	.transform((l, ctx): MatchLevel => {
		let term = null;
		if (l.term !== undefined) {
			try {
				const parsed = parseTermSymbol(l.term);
				if (parsed.parity !== null && parsed.parity !== l.parity)
					throw new RangeError(`the term "${l.term}" is ${parsed.parity} but the level's parity is ${l.parity}`);
				term = { twoS: parsed.twoS, L: parsed.L };
			} catch (e) {
				ctx.addIssue({ code: 'custom', message: (e as Error).message });
				return z.NEVER;
			}
		}
		return {
			energy: l.energy,
			twoJ: l.J,
			parity: l.parity,
			label: l.label ?? null,
			term,
			uncertainty: l.uncertainty ?? null,
			group: l.label ?? null
		};
	});

const lineSchema = z.object({
	wavelength: finite('wavelength').refine((v) => v > 0, 'wavelength must be positive'),
	unit: z.enum(SPECTRAL_UNITS as ['A', 'nm', 'um', 'cm-1'], { error: 'unit must be one of "A", "nm", "um", "cm-1"' }),
	medium: z.enum(['air', 'vacuum'], { error: 'medium must be "air" or "vacuum"' }).default('vacuum'),
	uncertainty: nonNegative('uncertainty').optional()
});

const matchBodySchema = z
	.object({
		levels: z
			.array(levelSchema, { error: 'levels must be a list of { energy, J, parity, label?, term?, uncertainty? }' })
			.min(2, 'levels: give at least two levels')
			.max(MAX_MATCH_LEVELS, `levels: at most ${MAX_MATCH_LEVELS} levels`),
		lines: z
			.array(lineSchema, { error: 'lines must be a list of { wavelength, unit, medium, uncertainty? }' })
			.max(MAX_MATCH_LINES, `lines: at most ${MAX_MATCH_LINES} lines`),
		tolerance: nonNegative('tolerance').optional(),
		toleranceUnit: z.enum(['cm-1', 'mA'], { error: 'toleranceUnit must be "cm-1" or "mA"' }).default('cm-1'),
		coverage: finite('coverage')
			.refine((v) => v > 0 && v <= 10, 'coverage must be above 0 and at most 10')
			.optional(),
		types: z
			.array(typeSchema, { error: 'types must be a list such as ["E1", "M1"]' })
			.min(1, 'types: choose at least one of E1, M1, E2')
			.default(['E1']),
		maxCandidates: z
			.number({ error: 'maxCandidates must be a number' })
			.int('maxCandidates must be a whole number')
			.min(1, 'maxCandidates must be at least 1')
			.max(MAX_CANDIDATES_LIMIT, `maxCandidates must be at most ${MAX_CANDIDATES_LIMIT}`)
			.optional()
	})
	.transform((b) => {
		const tolerance: Tolerance =
			b.tolerance === undefined ? { kind: 'combined', factor: b.coverage } : { kind: b.toleranceUnit, value: b.tolerance };
		return { levels: b.levels, lines: b.lines as ObservedLine[], tolerance, types: b.types, maxCandidates: b.maxCandidates };
	});

/** The engine's input from a POST /api/v1/match body; a 400 naming the field (e.g. "lines[3].unit") otherwise. */
export function parseMatchBody(body: unknown) {
	const r = matchBodySchema.safeParse(body);
	if (r.success) return r.data;
	const issue = r.error.issues[0];
	const field = issue.path
		.map((p) => (typeof p === 'number' ? `[${p}]` : `.${String(p)}`))
		.join('')
		.replace(/^\./, '');
	throw badRequest(field ? `${field}: ${issue.message}` : issue.message, field ? { field } : {});
}
