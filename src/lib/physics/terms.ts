/**
 * LS (Russell–Saunders) terms of a configuration, their J levels and statistical weights.
 *
 * Terms come from the (M_L, M_S) grid of ./microstates.ts by the difference formula
 * N(L, S) = n(L, S) − n(L+1, S) − n(L, S+1) + n(L+1, S+1) (Condon & Shortley 1935, ch. 7;
 * Cowan 1981, the same counting). A term ^{2S+1}L splits into levels J = |L−S| … L+S, each with 2J+1 states
 * (vector model; Condon & Shortley 1935; Cowan 1981). Seniorities (Racah 1943) are attached
 * when at most one subshell is open.
 */
import { levelsFromProjections, toSafeNumber } from './counting';
import type { Configuration, Subshell, Term } from './types';
import { halfString } from './half';
import { termLetter } from './letters';
import { decomposeGrid, microstateGrid, mjCounts } from './microstates';
import { asSubshells, openSubshells } from './parse';
import { seniorityTable } from './seniority';

/** The (S, L) of a term: the part of `Term` that levels, weights and labels need. */
export type TermLike = Pick<Term, 'twoS' | 'L'>;

/** One J level of a term with its statistical weight 2J+1. */
export interface Level {
	twoJ: number;
	weight: number;
}

/**
 * The LS terms of a configuration with how often each occurs, sorted by 2S+1 then L
 * (ascending, the order of the published tables). Seniorities are given as counts per
 * seniority when at most one subshell is open (all closed: ¹S with seniority 0), otherwise null.
 * Source: difference formula on the microstate grid (Condon & Shortley 1935, ch. 7; Cowan 1981, the same counting).
 * Throws ConfigurationError for an invalid subshell, RangeError when a count exceeds 2^53, and
 * BudgetError (a RangeError, ./budget.ts) before any work when the grid or the seniority table
 * would exceed MAX_GRID_WORK or MAX_GRID_CELLS.
 * @example termSummary(termsOf(parseConfiguration('2p2'))) // '1S 1D 3P'
 */
export function termsOf(input: Configuration | readonly Subshell[]): Term[] {
	const subshells = asSubshells(input);
	const open = openSubshells(subshells);
	const counts = decomposeGrid(microstateGrid(subshells));
	const table = open.length === 1 ? seniorityTable(open[0].l, open[0].occupancy) : null;
	return counts.map((t) => {
		let seniorities: Term['seniorities'] = null;
		if (open.length === 0) seniorities = [{ seniority: 0, count: 1 }];
		else if (table) seniorities = table.find((e) => e.twoS === t.twoS && e.L === t.L)?.seniorities.map((s) => ({ ...s })) ?? null;
		return { twoS: t.twoS, L: t.L, count: toSafeNumber(t.count, `the number of ${t.twoS + 1}${termLetter(t.L)} terms`), seniorities };
	});
}

/**
 * The J levels of a term, J = |L−S| … L+S, each with weight 2J+1 (ascending J).
 * Throws RangeError when twoS or L is negative or not an integer.
 * @example levelsOf({ twoS: 3, L: 3 }) // 2J = 3, 5, 7, 9 (⁴F_{3/2 … 9/2})
 */
export function levelsOf(term: TermLike): Level[] {
	checkTerm(term);
	const out: Level[] = [];
	for (let twoJ = Math.abs(2 * term.L - term.twoS); twoJ <= 2 * term.L + term.twoS; twoJ += 2) out.push({ twoJ, weight: twoJ + 1 });
	return out;
}

function checkTerm(term: TermLike): void {
	if (!Number.isInteger(term.twoS) || term.twoS < 0)
		throw new RangeError(`twoS = ${term.twoS} is not allowed: 2S must be a non-negative integer`);
	if (!Number.isInteger(term.L) || term.L < 0) throw new RangeError(`L = ${term.L} is not allowed: L must be a non-negative integer`);
}

/**
 * Statistical weight of one occurrence of a term, (2S+1)(2L+1) = Σ_J (2J+1).
 * Throws RangeError like `levelsOf`.
 * @example statisticalWeight({ twoS: 2, L: 1 }) // 9 (³P)
 */
export function statisticalWeight(term: TermLike): number {
	checkTerm(term);
	return (term.twoS + 1) * (2 * term.L + 1);
}

/**
 * Number of J levels of each J in a configuration (term multiplicity included), as a map from
 * 2J to count in ascending 2J. Computed from the M_J distribution, N(J) = n(M_J = J) − n(M_J = J+1),
 * independently of the term list (Condon & Shortley 1935, ch. 7, the same diagonal-sum argument).
 * Throws ConfigurationError for an invalid subshell, RangeError like `termsOf`.
 * @example levelCountsByJ(parseConfiguration('2p2')) // Map { 0 => 2, 2 => 1, 4 => 2 }
 */
export function levelCountsByJ(input: Configuration | readonly Subshell[]): Map<number, number> {
	const out = new Map<number, number>();
	for (const [twoJ, n] of levelsFromProjections(mjCounts(microstateGrid(input))))
		out.set(twoJ, toSafeNumber(n, `the number of levels with 2J = ${twoJ}`));
	return out;
}

/**
 * Number of single J levels of a configuration, every occurrence of every term counted: each
 * level J has exactly one state with M_J = 0 (integer J) or M_J = 1/2 (half-integer J), so the
 * total is the number of microstates with that M_J (Condon & Shortley 1935, ch. 7, the
 * diagonal-sum argument). Cheap: no term list is built.
 * Throws ConfigurationError for an invalid subshell, BudgetError like `microstateGrid`.
 * @example levelTotal(parseConfiguration('3d3')) // 19n
 */
export function levelTotal(input: Configuration | readonly Subshell[]): bigint {
	const mj = mjCounts(microstateGrid(input));
	return mj.get(0) ?? mj.get(1) ?? 0n;
}

/** Options of `termLabel`. */
export interface TermLabelOptions {
	/** 'odd' adds the ° mark of odd parity. */
	parity?: 'even' | 'odd';
}

/**
 * The term symbol as plain text: multiplicity then letter, "4F"; odd parity adds "°" ("4F°").
 * Throws RangeError like `levelsOf`.
 * @example termLabel({ twoS: 3, L: 3 }, { parity: 'odd' }) // '4F°'
 */
export function termLabel(term: TermLike, options: TermLabelOptions = {}): string {
	checkTerm(term);
	return `${term.twoS + 1}${termLetter(term.L)}${options.parity === 'odd' ? '°' : ''}`;
}

/**
 * A level as plain text, the term label followed by J: "4F3/2", "3P°2".
 * Throws RangeError when 2J is not one of the term's levels.
 * @example levelLabel({ twoS: 3, L: 3 }, 3) // '4F3/2'
 */
export function levelLabel(term: TermLike, twoJ: number, options: TermLabelOptions = {}): string {
	if (!levelsOf(term).some((v) => v.twoJ === twoJ)) {
		throw new RangeError(`J = ${halfString(twoJ)} is not a level of ${termLabel(term)}: J runs from |L−S| to L+S`);
	}
	return `${termLabel(term, options)}${halfString(twoJ)}`;
}

/**
 * The term list in the style of the published tables: "2P 2D(2) 2F 2G 2H 4P 4F", terms that
 * occur more than once followed by their count in parentheses, in the given order.
 * @example termSummary(termsOf(parseConfiguration('3d3'))) // '2P 2D(2) 2F 2G 2H 4P 4F'
 */
export function termSummary(terms: readonly Term[]): string {
	return terms.map((t) => (t.count > 1 ? `${termLabel(t)}(${t.count})` : termLabel(t))).join(' ');
}

/**
 * Number of terms counted with multiplicity (d³ → 8) and number of J levels (d³ → 19).
 * @example termAndLevelCounts(termsOf(parseConfiguration('2p2'))) // { terms: 3, levels: 5 }
 */
export function termAndLevelCounts(terms: readonly Term[]): { terms: number; levels: number } {
	let nTerms = 0;
	let nLevels = 0;
	for (const t of terms) {
		nTerms += t.count;
		nLevels += t.count * levelsOf(t).length;
	}
	return { terms: nTerms, levels: nLevels };
}
