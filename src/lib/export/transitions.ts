/**
 * Rows and columns of the Transition finder export: one row per line, with its multiplet.
 */
import type { FinderResult } from '../physics/finder';
import { latexEscape, latexTerm, type Column } from './table';

export interface TransitionRow {
	multiplet: string;
	type: string;
	lowerTerm: string;
	lowerMultiplicity: number;
	lowerLetter: string;
	lowerOdd: boolean;
	JLower: string;
	upperTerm: string;
	upperMultiplicity: number;
	upperLetter: string;
	upperOdd: boolean;
	JUpper: string;
	/** Exact strength, multiplet total (2S+1)(2L+1)(2L′+1); null when not LS-allowed. */
	strength: string | null;
	strengthDecimal: number | null;
	share: string | null;
	lsAllowed: boolean;
	intercombination: boolean;
}

/** Multiplicity and letter of "³P°" (the ascii twin "3Po" is what the finder also sends). */
function parts(ascii: string): { multiplicity: number; letter: string; odd: boolean } {
	const m = /^(\d+)([A-Z])(o?)$/.exec(ascii);
	return m ? { multiplicity: Number(m[1]), letter: m[2], odd: m[3] === 'o' } : { multiplicity: 0, letter: ascii, odd: false };
}

export function transitionRows(result: FinderResult): TransitionRow[] {
	return result.multiplets.flatMap((m) => {
		const lo = result.lower.terms[m.lower];
		const up = result.upper.terms[m.upper];
		const a = parts(lo.ascii);
		const b = parts(up.ascii);
		return m.lines.map((l) => ({
			multiplet: m.label,
			type: m.type,
			lowerTerm: lo.label,
			lowerMultiplicity: a.multiplicity,
			lowerLetter: a.letter,
			lowerOdd: a.odd,
			JLower: l.JLower,
			upperTerm: up.label,
			upperMultiplicity: b.multiplicity,
			upperLetter: b.letter,
			upperOdd: b.odd,
			JUpper: l.JUpper,
			strength: l.strength?.exact ?? null,
			strengthDecimal: l.strength ? Number(l.strength.value.toFixed(6)) : null,
			share: l.strength?.share ?? null,
			lsAllowed: m.lsAllowed,
			intercombination: m.intercombination
		}));
	});
}

const fractionLatex = (f: string | null) =>
	f === null ? '' : f.includes('/') ? `$${f.replace(/^(-?\d+)\/(\d+)$/, '\\tfrac{$1}{$2}')}$` : f;

export const transitionColumns: Column<TransitionRow>[] = [
	{ key: 'multiplet', value: (r) => r.multiplet, inLatex: false },
	{ key: 'type', value: (r) => r.type },
	{
		key: 'lower',
		latex: 'Lower',
		value: (r) => r.lowerTerm + r.JLower,
		latexValue: (r) => latexTerm(r.lowerMultiplicity, r.lowerLetter, r.JLower, r.lowerOdd)
	},
	{ key: 'J_lower', value: (r) => r.JLower, inLatex: false },
	{
		key: 'upper',
		latex: 'Upper',
		value: (r) => r.upperTerm + r.JUpper,
		latexValue: (r) => latexTerm(r.upperMultiplicity, r.upperLetter, r.JUpper, r.upperOdd)
	},
	{ key: 'J_upper', value: (r) => r.JUpper, inLatex: false },
	{ key: 'strength', latex: '$S$ (exact)', align: 'r', value: (r) => r.strength, latexValue: (r) => fractionLatex(r.strength) },
	{ key: 'strength_decimal', latex: '$S$', align: 'r', value: (r) => r.strengthDecimal },
	{ key: 'share', latex: 'Share', align: 'r', value: (r) => r.share, latexValue: (r) => fractionLatex(r.share) },
	{
		key: 'ls_allowed',
		latex: 'LS',
		value: (r) => (r.lsAllowed ? 'yes' : 'no'),
		latexValue: (r) => latexEscape(r.lsAllowed ? 'allowed' : 'forbidden')
	},
	{ key: 'intercombination', value: (r) => (r.intercombination ? 'yes' : 'no'), inLatex: false }
];
