/**
 * Radiative transitions between levels: selection rules for E1, M1 and E2, the extra rules of
 * pure LS coupling, and the relative line strengths inside an LS multiplet.
 *
 * Rigorous rules (Condon & Shortley 1935, ch. IV §§ 4–8 and ch. IX; Cowan 1981, ch. 14; Sobelman 1979,
 * ch. 9), for an operator of rank k (E1, M1: k = 1; E2: k = 2) the triangle rule |J − J′| ≤ k ≤ J + J′:
 *   E1  parity changes;   ΔJ = 0, ±1, not 0–0
 *   M1  parity the same;  ΔJ = 0, ±1, not 0–0
 *   E2  parity the same;  ΔJ = 0, ±1, ±2, not 0–0, 1/2–1/2, 0–1
 * Pure LS coupling adds (same sources): E1 and E2 act on space only, so ΔS = 0, and (L, L′, k) is a
 * triad (E1: ΔL = 0, ±1, not 0–0; E2: ΔL = 0, ±1, ±2, not 0–0, 0–1); M1 (L + 2S) connects only levels
 * of one term. Lines breaking an LS rule (intercombination lines with ΔS ≠ 0 among them) are kept and
 * flagged: in real atoms LS is an approximation and such lines are often seen.
 *
 * Line strengths in an LS multiplet, for an operator acting on the orbital part only (E1, E2):
 *   S(SLJ, SL′J′) ∝ (2J+1)(2J′+1) {L J S; J′ L′ k}²
 * (Condon & Shortley 1935, ch. IX §2, the multiplet intensity formulas; Cowan 1981, ch. 14, the LS-coupling
 * line strength — equation number from memory, not checked; Sobelman 1979, ch. 9). By the orthogonality of
 * 6j symbols (Edmonds 1957, eq. 6.2.9), Σ_J′ (2J′+1){L J S; J′ L′ k}² = 1/(2L+1), so each level's strengths
 * add up to (2J+1)/(2L+1) and the whole multiplet to 2S+1. We report the strengths normalised so that the
 * multiplet total is (2S+1)(2L+1)(2L′+1) — each lower level J then carries (2J+1)(2L′+1) and each upper
 * level J′ carries (2J′+1)(2L+1) — and also as shares of the multiplet total (adding up to 1).
 */
import Fraction from 'fraction.js';
import { isTriad, wigner6j } from './wigner';
import { termLetter, TERM_LETTERS } from './letters';
import { halfString } from './half';

export type TransitionType = 'E1' | 'M1' | 'E2';
export const TRANSITION_TYPES: readonly TransitionType[] = ['E1', 'M1', 'E2'];
export type Parity = 'even' | 'odd';

/** Tensor rank of each multipole operator. */
export const TRANSITION_RANK: Record<TransitionType, number> = { E1: 1, M1: 1, E2: 2 };

/** An LS term: 2S as an integer and L. */
export interface LsTerm {
	twoS: number;
	L: number;
}

/** A level as the transition engine needs it. Energies and uncertainties are in cm⁻¹. */
export interface SpectralLevel {
	twoJ: number;
	parity: Parity;
	/** The LS term when known (LS labels are approximations; see the module comment). */
	term?: LsTerm | null;
	/**
	 * Which occurrence of the term the level belongs to (e.g. the configuration and parent, "3d6(5D)4s");
	 * levels with equal `group` and `term` form one term. Needed only for M1's same-term rule and the multiplets.
	 */
	group?: string | null;
	energy?: number | null;
	uncertainty?: number | null;
	label?: string | null;
}

/** Largest number of levels in one list given to `transitionsBetween`. */
export const MAX_TRANSITION_LEVELS = 20_000;
/** Largest number of level pairs `transitionsBetween` will examine (lower × upper, or n(n−1)/2 within one list). */
export const MAX_TRANSITION_PAIRS = 2_000_000;

/**
 * True when the rigorous parity and J rules allow `type` between the two levels (module comment).
 * J values are doubled. Never throws.
 * @example jParityAllows('E2', 0, 'even', 2, 'even') // false: 0–1 is forbidden for E2
 */
export function jParityAllows(type: TransitionType, twoJa: number, parityA: Parity, twoJb: number, parityB: Parity): boolean {
	const parityOk = type === 'E1' ? parityA !== parityB : parityA === parityB;
	return parityOk && isTriad(twoJa, twoJb, 2 * TRANSITION_RANK[type]);
}

/** What the pure-LS rules say about one transition between two terms. */
export interface LsVerdict {
	/** ΔS = 0. */
	spinConserved: boolean;
	/** The L rule of the type holds (E1: ΔL = 0, ±1, not 0–0; E2: (L, L′, 2) a triad; M1: same term). */
	orbitalAllowed: boolean;
	/** Both hold: allowed in pure LS coupling. */
	allowed: boolean;
	/** ΔS ≠ 0. */
	intercombination: boolean;
}

/**
 * The pure-LS verdict for `type` between terms a and b (module comment). `sameTerm` says whether both
 * levels belong to one occurrence of one term (only M1 needs it). Never throws.
 * @example lsVerdict('E1', { twoS: 2, L: 1 }, { twoS: 0, L: 1 }, false).intercombination // true (³P–¹P)
 */
export function lsVerdict(type: TransitionType, a: LsTerm, b: LsTerm, sameTerm: boolean): LsVerdict {
	const spinConserved = a.twoS === b.twoS;
	let orbitalAllowed: boolean;
	if (type === 'M1') orbitalAllowed = sameTerm && a.L === b.L;
	else orbitalAllowed = isTriad(2 * a.L, 2 * b.L, 2 * TRANSITION_RANK[type]);
	return { spinConserved, orbitalAllowed, allowed: spinConserved && orbitalAllowed, intercombination: !spinConserved };
}

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/**
 * A term symbol as spectroscopists write it: ³P, ²D°, with ° on odd parity; `ascii` gives "3P", "2Do".
 * Throws RangeError when L has no letter.
 * @example termSymbol({ twoS: 2, L: 2 }, 'odd') // '³D°'
 */
export function termSymbol(term: LsTerm, parity: Parity, options: { ascii?: boolean } = {}): string {
	const multiplicity = String(term.twoS + 1);
	const letter = termLetter(term.L);
	if (options.ascii) return `${multiplicity}${letter}${parity === 'odd' ? 'o' : ''}`;
	const sup = multiplicity.replace(/\d/g, (d) => SUPERSCRIPT_DIGITS[Number(d)]);
	return `${sup}${letter}${parity === 'odd' ? '°' : ''}`;
}

/**
 * Reads a term symbol: multiplicity 2S+1 (ASCII or superscript digits), the L letter, and an optional ° (or o)
 * for odd parity: "3P", "²D°", "4Fo". `parity` is 'odd' with the mark and null without it (a missing ° is
 * often just omitted, so it does not prove even parity).
 * Throws RangeError naming the text and what is allowed.
 * @example parseTermSymbol('²D°') // { twoS: 1, L: 2, parity: 'odd' }
 */
export function parseTermSymbol(text: string): LsTerm & { parity: Parity | null } {
	const plain = text.trim().replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹]/g, (c) => String(SUPERSCRIPT_DIGITS.indexOf(c)));
	const m = /^(\d{1,2})\s*([A-Z])\s*([°o])?$/.exec(plain);
	const L = m ? TERM_LETTERS.indexOf(m[2]) : -1;
	if (!m || L < 0 || Number(m[1]) < 1) {
		throw new RangeError(
			`term "${text}" is not a term symbol: write the multiplicity 2S+1, an L letter (${TERM_LETTERS.split('').join(' ')}) and ° or o for odd parity, e.g. 3P or 2Do`
		);
	}
	return { twoS: Number(m[1]) - 1, L, parity: m[3] ? 'odd' : null };
}

/**
 * The label of a multiplet, lower term first: "³P–³D°".
 * @example multipletLabel({ twoS: 2, L: 1 }, 'even', { twoS: 2, L: 2 }, 'odd') // '³P–³D°'
 */
export function multipletLabel(lower: LsTerm, lowerParity: Parity, upper: LsTerm, upperParity: Parity): string {
	return `${termSymbol(lower, lowerParity)}–${termSymbol(upper, upperParity)}`;
}

/** A relative line strength, exact and decimal, normalised two ways (module comment). */
export interface LineStrength {
	/** Normalised so the multiplet adds up to (2S+1)(2L+1)(2L′+1); exact fraction as text ("21/4"). */
	exact: string;
	value: number;
	/** Share of the multiplet total (the multiplet adds up to 1), exact and decimal. */
	share: string;
	shareValue: number;
	/** This line's strength over the multiplet's strongest line (1 for the strongest). */
	ofStrongest: number;
}

/** One line of a theoretical LS multiplet. */
export interface MultipletLine {
	twoJLower: number;
	twoJUpper: number;
	strength: LineStrength;
}

const multipletCache = new Map<string, MultipletLine[] | null>();

/**
 * (2L+1)(2L′+1)(2J+1)(2J′+1){L J S; J′ L′ k}² exactly: the strength of one line of an LS multiplet
 * normalised to a multiplet total of (2S+1)(2L+1)(2L′+1) (module comment for the sources).
 * Arguments doubled where they may be half-integral. Throws RangeError from `wigner6j` on bad arguments.
 * @example lsLineStrength(1, 2, 1, 4, 2, 6).toFraction() // '21': ³P₂–³D₃ (84/4)
 */
export function lsLineStrength(rank: number, twoS: number, L: number, twoJ: number, Lp: number, twoJp: number): Fraction {
	const six = wigner6j(2 * L, twoJ, twoS, twoJp, 2 * Lp, 2 * rank);
	if (six.sign === 0) return new Fraction(0);
	const weight = BigInt((2 * L + 1) * (2 * Lp + 1) * (twoJ + 1) * (twoJp + 1));
	return new Fraction(weight * six.num, six.den);
}

function jValues(term: LsTerm): number[] {
	const out: number[] = [];
	for (let t = Math.abs(2 * term.L - term.twoS); t <= 2 * term.L + term.twoS; t += 2) out.push(t);
	return out;
}

/**
 * All lines of the LS multiplet lower → upper for E1 or E2, with their relative strengths
 * (module comment), ordered by lower J descending then upper J descending. Returns null when
 * the multiplet is not allowed in pure LS coupling (ΔS ≠ 0 or the L rule fails) and for M1
 * (whose strengths inside a term are not of this form and are not computed here).
 * Throws RangeError for a negative or non-integer 2S or L.
 * @example multipletLines('E1', { twoS: 1, L: 0 }, { twoS: 1, L: 1 })!.map((l) => l.strength.exact) // ['4', '2']
 */
export function multipletLines(type: TransitionType, lower: LsTerm, upper: LsTerm): MultipletLine[] | null {
	for (const t of [lower, upper]) {
		if (!Number.isInteger(t.twoS) || t.twoS < 0 || !Number.isInteger(t.L) || t.L < 0) {
			throw new RangeError(`a term needs 2S and L as non-negative integers, got 2S = ${t.twoS}, L = ${t.L}`);
		}
	}
	const key = `${type}|${lower.twoS}|${lower.L}|${upper.twoS}|${upper.L}`;
	const cached = multipletCache.get(key);
	if (cached !== undefined) return cached;
	let result: MultipletLine[] | null = null;
	if (type !== 'M1' && lsVerdict(type, lower, upper, false).allowed) {
		const rank = TRANSITION_RANK[type];
		const raw: { twoJLower: number; twoJUpper: number; s: Fraction }[] = [];
		for (const a of jValues(lower).reverse()) {
			for (const b of jValues(upper).reverse()) {
				if (!isTriad(a, b, 2 * rank)) continue;
				const s = lsLineStrength(rank, lower.twoS, lower.L, a, upper.L, b);
				if (!s.equals(0)) raw.push({ twoJLower: a, twoJUpper: b, s });
			}
		}
		const total = raw.reduce((acc, r) => acc.add(r.s), new Fraction(0));
		const strongest = raw.reduce((m, r) => Math.max(m, r.s.valueOf()), 0);
		result = raw.map((r) => {
			const share = r.s.div(total);
			return {
				twoJLower: r.twoJLower,
				twoJUpper: r.twoJUpper,
				strength: {
					exact: r.s.toFraction(),
					value: r.s.valueOf(),
					share: share.toFraction(),
					shareValue: share.valueOf(),
					ofStrongest: r.s.valueOf() / strongest
				}
			};
		});
	}
	multipletCache.set(key, result);
	return result;
}

/** The theoretical strength of one line, or null when the multiplet has none (see `multipletLines`). */
export function lineStrengthOf(
	type: TransitionType,
	lower: LsTerm,
	twoJLower: number,
	upper: LsTerm,
	twoJUpper: number
): LineStrength | null {
	const lines = multipletLines(type, lower, upper);
	return lines?.find((l) => l.twoJLower === twoJLower && l.twoJUpper === twoJUpper)?.strength ?? null;
}

/** One allowed transition between two levels of the given lists. */
export interface Transition {
	/** Index into the lower list. */
	lower: number;
	/** Index into the upper list. */
	upper: number;
	type: TransitionType;
	/** Pure-LS verdict, null when either level has no LS term. */
	ls: LsVerdict | null;
	/** "³P–³D°", null without terms. */
	multiplet: string | null;
	/** Relative strength inside its multiplet, null when not computed (see `multipletLines`). */
	strength: LineStrength | null;
}

/** Options of `transitionsBetween`. */
export interface TransitionOptions {
	/** Types to list (default all three). */
	types?: readonly TransitionType[];
	/** Lower and upper are one list (forbidden lines within a configuration): each pair once. */
	within?: boolean;
}

/** Validates a list of transition types, naming what is allowed. Throws RangeError. */
export function checkTransitionTypes(types: readonly string[]): TransitionType[] {
	if (!Array.isArray(types) || types.length === 0) throw new RangeError('choose at least one transition type: E1, M1 or E2');
	for (const t of types) {
		if (!(TRANSITION_TYPES as readonly string[]).includes(t)) throw new RangeError(`transition type "${t}" is not known: use E1, M1 or E2`);
	}
	return [...new Set(types)] as TransitionType[];
}

function checkLevel(where: string, level: SpectralLevel, i: number): void {
	if (!Number.isInteger(level.twoJ) || level.twoJ < 0)
		throw new RangeError(`${where} level ${i}: 2J must be a non-negative integer, got ${level.twoJ}`);
	if (level.parity !== 'even' && level.parity !== 'odd')
		throw new RangeError(`${where} level ${i}: parity must be "even" or "odd", got "${String(level.parity)}"`);
}

function sameTermOccurrence(a: SpectralLevel, b: SpectralLevel): boolean {
	return (
		!!a.term &&
		!!b.term &&
		a.term.twoS === b.term.twoS &&
		a.term.L === b.term.L &&
		a.parity === b.parity &&
		(a.group ?? '') === (b.group ?? '')
	);
}

/**
 * Every transition of the chosen types allowed by the rigorous rules between a lower and an upper
 * list of levels (or within one list with `within`, each unordered pair once, lower = the earlier index
 * or, when both energies are known, the lower energy). LS verdicts and multiplet strengths are attached
 * when both levels carry a term. Ordered by lower index, then upper index, then type.
 *
 * Throws RangeError when a list has more than MAX_TRANSITION_LEVELS levels, when the pairs to examine
 * exceed MAX_TRANSITION_PAIRS (checked before any work), for a bad level (2J, parity) or an unknown type.
 * @example transitionsBetween([{ twoJ: 1, parity: 'even' }], [{ twoJ: 3, parity: 'odd' }], { types: ['E1'] }).length // 1
 */
export function transitionsBetween(
	lower: readonly SpectralLevel[],
	upper: readonly SpectralLevel[],
	options: TransitionOptions = {}
): Transition[] {
	const types = checkTransitionTypes(options.types ?? TRANSITION_TYPES);
	const within = options.within === true;
	for (const [name, list] of [
		['lower', lower],
		['upper', upper]
	] as const) {
		if (list.length > MAX_TRANSITION_LEVELS)
			throw new RangeError(`the ${name} list has ${list.length} levels; at most ${MAX_TRANSITION_LEVELS} are allowed`);
	}
	const pairs = within ? (lower.length * (lower.length - 1)) / 2 : lower.length * upper.length;
	if (pairs > MAX_TRANSITION_PAIRS)
		throw new RangeError(`${pairs} level pairs to examine; at most ${MAX_TRANSITION_PAIRS} are allowed — choose smaller level lists`);
	lower.forEach((l, i) => checkLevel('lower', l, i));
	if (!within) upper.forEach((l, i) => checkLevel('upper', l, i));

	const out: Transition[] = [];
	for (let i = 0; i < lower.length; i++) {
		for (let j = within ? i + 1 : 0; j < upper.length; j++) {
			let lo = i;
			let up = j;
			if (within) {
				const ei = lower[i].energy;
				const ej = lower[j].energy;
				if (ei != null && ej != null && ei > ej) [lo, up] = [j, i];
			}
			const a = lower[lo];
			const b = within ? lower[up] : upper[up];
			for (const type of types) {
				if (!jParityAllows(type, a.twoJ, a.parity, b.twoJ, b.parity)) continue;
				let ls: LsVerdict | null = null;
				let multiplet: string | null = null;
				let strength: LineStrength | null = null;
				if (a.term && b.term) {
					ls = lsVerdict(type, a.term, b.term, sameTermOccurrence(a, b));
					multiplet = multipletLabel(a.term, a.parity, b.term, b.parity);
					strength = ls.allowed ? lineStrengthOf(type, a.term, a.twoJ, b.term, b.twoJ) : null;
				}
				out.push({ lower: lo, upper: up, type, ls, multiplet, strength });
			}
		}
	}
	return out;
}

/** "³P₂–³D°₃" style text of a transition's levels, for messages and tables (J as fractions). */
export function transitionText(a: SpectralLevel, b: SpectralLevel): string {
	const side = (l: SpectralLevel) =>
		(l.term ? termSymbol(l.term, l.parity) : l.parity === 'odd' ? '(odd)' : '(even)') + ` J=${halfString(l.twoJ)}`;
	return `${side(a)} – ${side(b)}`;
}
