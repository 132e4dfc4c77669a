/**
 * Hund's rules: the ground term and level, and a heuristic order of the terms.
 *
 * For a single open subshell of equivalent electrons in LS coupling (Hund 1925; Condon &
 * Shortley 1935; Cowan 1981): (1) the ground term has the largest S; (2) among those, the
 * largest L; (3) its lowest level is J = |L−S| when the subshell is less than half full
 * (normal multiplet) and J = L+S when it is more than half full (inverted); a half-full
 * subshell has L = 0 in its ground term, so J = S.
 *
 * For several open subshells the same choice of S and L over all terms of the configuration is
 * only a heuristic, and J is chosen by the rule documented at `jOrderFor`. Known ground levels
 * break it (for example Ce I 4f 5d 6s² is ¹G°₄, not the ³H₄ this heuristic gives).
 */
import type { Configuration, Subshell, Term } from './types';
import { levelsOf, termLabel, termsOf } from './terms';
import { halfString } from './half';
import { asSubshells, openSubshells, subshellCapacity, subshellLabel } from './parse';

/** Caution to show beside every Hund's-rule result. */
export const HUND_CAUTION =
	"Hund's rules and LS labels are approximations: they are rigorous only for the ground term of a single open subshell of equivalent electrons in LS coupling. Heavy atoms and excited configurations mix strongly, and known ground levels break the simple rules.";

/** How the levels of a term are expected to be ordered in energy. */
export type JOrder = 'normal' | 'inverted' | 'undetermined';

/** Result of `hundGround`. */
export interface HundGround {
	term: { twoS: number; L: number };
	twoJ: number;
	/** True only for a single open subshell of equivalent electrons (or closed shells only). */
	rigorous: boolean;
	/** Why this term and J were chosen, and whether the result is rigorous. */
	reason: string;
}

/** One term in the heuristic order of `hundOrder`, with its J values in expected energy order. */
export interface HundOrderedTerm {
	term: Term;
	/** 2J values, lowest expected energy first. */
	twoJs: number[];
	order: JOrder;
}

function fillingOf(s: Subshell): 'less' | 'half' | 'more' {
	const half = subshellCapacity(s.l) / 2;
	return s.occupancy < half ? 'less' : s.occupancy > half ? 'more' : 'half';
}

/**
 * The rule that orders J: take the open subshell with the largest l that is not exactly half
 * full (a half-full subshell adds no orbital angular momentum to its own Hund term); if it is less
 * than half full the multiplets are normal (lowest J lowest), if more than half full inverted.
 * When every open subshell is half full (or none is open) the order is undetermined by this rule.
 * For one open subshell this is Hund's third rule.
 */
function jOrderFor(open: readonly Subshell[]): { order: JOrder; by: Subshell | null } {
	const candidates = open.filter((s) => fillingOf(s) !== 'half').sort((a, b) => b.l - a.l || b.n - a.n);
	if (candidates.length === 0) return { order: 'undetermined', by: null };
	const by = candidates[0];
	return { order: fillingOf(by) === 'less' ? 'normal' : 'inverted', by };
}

function pickGroundTerm(terms: readonly Term[]): Term {
	let best = terms[0];
	for (const t of terms) if (t.twoS > best.twoS || (t.twoS === best.twoS && t.L > best.L)) best = t;
	return best;
}

/**
 * The Hund's-rule ground term and level. Exactly one open subshell (others closed): rigorous
 * (Hund's three rules; Condon & Shortley 1935; Cowan 1981). Closed subshells only: ¹S₀,
 * rigorous. Several open subshells: the largest S, then the largest L among all terms of the
 * configuration, J by the rule of `jOrderFor`; rigorous = false.
 * Throws ConfigurationError for an invalid subshell.
 * @example hundGround(parseConfiguration('[Ar] 3d6 4s2')) // ⁵D, twoJ 8 (⁵D₄), rigorous
 */
export function hundGround(input: Configuration | readonly Subshell[]): HundGround {
	const subshells = asSubshells(input);
	const open = openSubshells(subshells);
	if (open.length === 0) {
		return {
			term: { twoS: 0, L: 0 },
			twoJ: 0,
			rigorous: true,
			reason: 'All subshells are closed: the only term is ¹S and its level is J = 0.'
		};
	}
	const terms = termsOf(subshells);
	const ground = pickGroundTerm(terms);
	const levels = levelsOf(ground).map((v) => v.twoJ);
	const lowJ = levels[0];
	const highJ = levels[levels.length - 1];
	const label = termLabel(ground);
	if (open.length === 1) {
		const s = open[0];
		const sub = subshellLabel(s);
		const fill = fillingOf(s);
		const twoJ = fill === 'less' ? lowJ : fill === 'more' ? highJ : lowJ;
		const jWhy =
			fill === 'less'
				? `less than half full, so J = |L−S| = ${halfString(twoJ)}`
				: fill === 'more'
					? `more than half full, so J = L+S = ${halfString(twoJ)}`
					: `exactly half full, so L = 0 and J = S = ${halfString(twoJ)}`;
		return {
			term: { twoS: ground.twoS, L: ground.L },
			twoJ,
			rigorous: true,
			reason: `One open subshell (${sub}): Hund's rules give the largest S, then the largest L (${label}); the subshell is ${jWhy}.`
		};
	}
	const { order, by } = jOrderFor(open);
	const twoJ = order === 'inverted' ? highJ : lowJ;
	const jWhy =
		by === null
			? `every open subshell is half full, so L = 0 and J = S = ${halfString(twoJ)}`
			: `J from the open subshell with the largest l that is not half full (${subshellLabel(by)}, ${
					order === 'normal' ? 'less than half full: J = |L−S|' : 'more than half full: J = L+S'
				}) = ${halfString(twoJ)}`;
	return {
		term: { twoS: ground.twoS, L: ground.L },
		twoJ,
		rigorous: false,
		reason: `${open.length} open subshells: Hund's rules are only a heuristic here. Largest S, then largest L among all terms of the configuration: ${label}; ${jWhy}.`
	};
}

/**
 * All terms in the heuristic Hund order (largest S first, then largest L), each with its J values
 * in expected energy order: ascending J for a normal multiplet, descending for an inverted one,
 * ascending with order 'undetermined' when the rule of `jOrderFor` decides nothing (half-full
 * subshells). Only the ground term is rigorous, and only for one open subshell.
 * Throws ConfigurationError for an invalid subshell.
 * @example hundOrder(parseConfiguration('2p2')).map((t) => t.term.L) // [1, 2, 0] (³P, ¹D, ¹S)
 */
export function hundOrder(input: Configuration | readonly Subshell[]): HundOrderedTerm[] {
	const subshells = asSubshells(input);
	const open = openSubshells(subshells);
	const { order } = open.length === 0 ? { order: 'normal' as JOrder } : jOrderFor(open);
	const terms = termsOf(subshells)
		.slice()
		.sort((a, b) => b.twoS - a.twoS || b.L - a.L);
	return terms.map((term) => {
		const js = levelsOf(term).map((v) => v.twoJ);
		return { term, twoJs: order === 'inverted' ? js.reverse() : js, order };
	});
}

/** How the Hund's-rule level may be named on screen (see `hundWording`). */
export interface HundWording {
	/** 'ground' only for one open subshell in a configuration that is not excited; else 'lowest'. */
	kind: 'ground' | 'lowest';
	/** "ground level by Hund's rules" or "lowest level by Hund's rules (heuristic)". */
	phrase: string;
	/** Why this phrase: which rule made the configuration count as excited or multi-open. */
	why: string;
}

const madelungRank = (s: { n: number; l: number }) => (s.n + s.l) * 100 + s.n;

/**
 * True when the configuration, within the span of subshells it lists, leaves a subshell that comes
 * earlier in the Madelung (n + l, then n) filling order than an occupied one not full: 1s2 2s2 3p2,
 * 2p5 3s2, [Ar] 3d7 (4s empty). Subshells below the lowest one listed count as implied full ("3d7"
 * alone is not called excited). A rule of thumb (Madelung 1936); ions often break it.
 */
function looksExcited(subshells: readonly Subshell[]): boolean {
	if (subshells.length === 0) return false;
	const ranks = subshells.map(madelungRank);
	const lowest = Math.min(...ranks);
	const highest = Math.max(...ranks);
	for (let n = 1; n <= 20; n++) {
		for (let l = 0; l < n; l++) {
			const r = madelungRank({ n, l });
			if (r < lowest || r >= highest) continue;
			const s = subshells.find((x) => x.n === n && x.l === l);
			if (!s || s.occupancy < subshellCapacity(l)) return true;
		}
	}
	return false;
}

/**
 * The words for the Hund's-rule level of a configuration. "ground level by Hund's rules" only
 * when one subshell is open (or none) and the configuration does not look excited (the
 * rule of `looksExcited`); otherwise "lowest level by Hund's rules (heuristic)", because for
 * several open subshells or an excited configuration the rules are a heuristic and the level is
 * at best the lowest of this configuration, not of the atom (Cowan 1981, sec. 4.10; Condon &
 * Shortley 1935, ch. XII on exceptions).
 * Throws ConfigurationError for an invalid subshell.
 * @example hundWording(parseConfiguration('3d6 4s')).phrase // "lowest level by Hund's rules (heuristic)"
 */
export function hundWording(input: Configuration | readonly Subshell[]): HundWording {
	const subshells = asSubshells(input);
	const open = openSubshells(subshells);
	if (open.length > 1) {
		return {
			kind: 'lowest',
			phrase: "lowest level by Hund's rules (heuristic)",
			why: `${open.length} open subshells: Hund's rules only suggest which level of this configuration is lowest.`
		};
	}
	if (looksExcited(subshells)) {
		return {
			kind: 'lowest',
			phrase: "lowest level by Hund's rules (heuristic)",
			why: 'An excited configuration (a subshell earlier in the filling order is not full): the level is the lowest of this configuration at best, not the ground level of the atom or ion.'
		};
	}
	return {
		kind: 'ground',
		phrase: "ground level by Hund's rules",
		why: "One open subshell of equivalent electrons: Hund's rules give the ground level."
	};
}
