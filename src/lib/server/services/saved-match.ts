/**
 * The Line matcher on a project's saved lists: a level list and a line list are read from the database,
 * turned into the engine's plain data and matched (src/lib/physics/matcher.ts). Answers carry the rows' ids,
 * so a candidate can be accepted or rejected by id. Viewers read.
 */
import { z } from 'zod';
import type { Actor } from '../access';
import { projectAccess } from '../access';
import { parseInput } from '../validation';
import { ServiceError } from '../errors';
import { getLevelList, getLineList } from './lists';
import { identificationsOfLineList } from './identifications';
import { matchLines, MATCH_CAUTION, type MatchLevel, type ObservedLine, type Tolerance } from '../../physics/matcher';
import { parseTermSymbol, TRANSITION_TYPES, type TransitionType } from '../../physics/transitions';
import { parseHalf } from '../../physics/half';

export const savedMatchSchema = z
	.object({
		levelListId: z.string({ error: 'Choose a level list' }).min(1, 'Choose a level list').max(64),
		lineListId: z.string({ error: 'Choose a line list' }).min(1, 'Choose a line list').max(64),
		types: z
			.array(z.enum(TRANSITION_TYPES as [TransitionType, ...TransitionType[]], { error: 'a type must be E1, M1 or E2' }))
			.min(1, 'Choose at least one of E1, M1, E2')
			.default(['E1']),
		toleranceUnit: z.enum(['combined', 'cm-1', 'mA'], { error: 'tolerance must be combined, cm-1 or mA' }).default('combined'),
		tolerance: z.coerce
			.number({ error: 'the tolerance must be a number' })
			.refine((v) => Number.isFinite(v) && v >= 0, 'the tolerance must be a number ≥ 0')
			.optional(),
		coverage: z.coerce
			.number({ error: 'k must be a number' })
			.refine((v) => v > 0 && v <= 10, 'k must be above 0 and at most 10')
			.default(2)
	})
	.transform((o) => {
		const tolerance: Tolerance =
			o.toleranceUnit === 'combined' || o.tolerance === undefined
				? { kind: 'combined', factor: o.coverage }
				: { kind: o.toleranceUnit, value: o.tolerance };
		return { levelListId: o.levelListId, lineListId: o.lineListId, types: o.types, tolerance };
	});

export type SavedMatchInput = z.input<typeof savedMatchSchema>;

type LevelRow = ReturnType<typeof getLevelList>['rows'][number];
type LineRow = ReturnType<typeof getLineList>['rows'][number];

/** "2p3s 3P° J=1": how a saved level is named in tables and exports. */
export const levelName = (l: Pick<LevelRow, 'configuration' | 'term' | 'J' | 'energyText'>) =>
	[l.configuration, l.term].filter(Boolean).join(' ') + ` J=${l.J}` + (l.configuration || l.term ? '' : ` at ${l.energyText} cm⁻¹`);

/** The engine's level from a saved row (the upload checked J and the term, so they parse). */
export function matchLevelOf(row: LevelRow): MatchLevel {
	let term = null;
	if (row.term) {
		const t = parseTermSymbol(row.term);
		term = { twoS: t.twoS, L: t.L };
	}
	return {
		energy: row.energy,
		twoJ: parseHalf(row.J),
		parity: row.parity,
		term,
		label: levelName(row),
		uncertainty: row.uncertainty,
		group: row.configuration || null
	};
}

export const observedLineOf = (row: LineRow): ObservedLine => ({
	wavelength: row.wavelength,
	unit: row.unit,
	medium: row.medium,
	uncertainty: row.uncertainty
});

/** Matches a saved line list against a saved level list of the project, with that line list's verdicts. */
export function matchSavedLists(actor: Actor, projectId: string, input: unknown) {
	const { role } = projectAccess(actor, projectId, 'viewer');
	const options = parseInput(savedMatchSchema, input);
	const levels = getLevelList(actor, projectId, options.levelListId);
	const lines = getLineList(actor, projectId, options.lineListId);
	const engineLevels = levels.rows.map(matchLevelOf);
	let result;
	try {
		result = matchLines(engineLevels, lines.rows.map(observedLineOf), {
			types: options.types,
			tolerance: options.tolerance
		});
	} catch (e) {
		// The engine's budgets (levels, lines, transitions) say what is too large and the limit.
		if (e instanceof RangeError) throw new ServiceError(422, `These lists cannot be matched as they are: ${e.message}`);
		throw e;
	}
	return {
		role,
		options,
		levelList: levels.list,
		lineList: lines.list,
		levels: levels.rows,
		/** The levels as the engine read them (2J, parsed term), for the Grotrian picture. */
		engineLevels,
		lines: lines.rows,
		result,
		identifications: identificationsOfLineList(projectId, options.lineListId),
		caution: MATCH_CAUTION
	};
}
