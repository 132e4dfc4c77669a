/**
 * The Transition finder: the multiplets and lines between the LS terms of two configurations (or within
 * one, for forbidden lines), from notation alone. Terms come from ./terms.ts; rules and strengths from
 * ./transitions.ts. Without level energies there are no wavelengths: the result lists multiplets with their
 * J lines and relative strengths.
 *
 * It also reports which electron jumps between the configurations: in the one-electron (central-field)
 * picture an E1 line needs exactly one electron to change its l by ±1 (Condon & Shortley 1935 ch. IX;
 * Cowan 1981 ch. 14), so E1 between configurations that differ otherwise is flagged.
 */
import type { Configuration, Term } from './types';
import { parseConfiguration, displayConfiguration, formatConfiguration } from './parse';
import { termsOf } from './terms';
import { lLetter } from './letters';
import { halfString } from './half';
import { hundOrder } from './hund';
import {
	checkTransitionTypes,
	jParityAllows,
	lsVerdict,
	multipletLabel,
	multipletLines,
	termSymbol,
	type LineStrength,
	type Parity,
	type TransitionType
} from './transitions';

/** Most (lower level, upper level) pairs the finder examines, counted from the terms' J levels before any work. */
export const MAX_FINDER_LEVEL_PAIRS = 40_000;

/** Shown with every result. */
export const FINDER_CAUTION =
	'LS labels and the pure-LS rules (ΔS = 0, ΔL = 0, ±1) are approximations: when levels mix, intercombination and LS-forbidden lines appear. ' +
	'Strengths are relative inside a multiplet in pure LS coupling, not absolute, and without level energies no wavelengths are given.';

export interface FinderTerm {
	/** "³P°" */
	label: string;
	/** "3Po" */
	ascii: string;
	S: string;
	L: number;
	parity: Parity;
	/** How often the term occurs in its configuration (d³ has ²D twice). */
	count: number;
	J: string[];
}

export interface FinderLine {
	JLower: string;
	JUpper: string;
	strength: LineStrength | null;
}

export interface FinderMultiplet {
	/** "³P–³D°", lower term first. */
	label: string;
	type: TransitionType;
	lower: number;
	upper: number;
	lsAllowed: boolean;
	intercombination: boolean;
	lines: FinderLine[];
}

export interface FinderResult {
	lower: { notation: string; pretty: string; parity: Parity; terms: FinderTerm[] };
	upper: { notation: string; pretty: string; parity: Parity; terms: FinderTerm[] };
	/** Lower and upper are the same configuration: forbidden lines within it. */
	within: boolean;
	types: TransitionType[];
	/** The electron that changes subshell, when exactly one does; null otherwise (or within one configuration). */
	jump: { from: string; to: string; deltaL: number } | null;
	/** E1 is allowed in the one-electron picture: exactly one electron changes l by ±1. */
	oneElectronE1: boolean;
	multiplets: FinderMultiplet[];
	lineCount: number;
	energies: 'unknown';
	caution: string;
}

function termsOfConfiguration(cfg: Configuration): FinderTerm[] {
	return termsOf(cfg).map((t: Term) => {
		const J: string[] = [];
		for (let tj = Math.abs(2 * t.L - t.twoS); tj <= 2 * t.L + t.twoS; tj += 2) J.push(halfString(tj));
		return {
			label: termSymbol(t, cfg.parity),
			ascii: termSymbol(t, cfg.parity, { ascii: true }),
			S: halfString(t.twoS),
			L: t.L,
			parity: cfg.parity,
			count: t.count,
			J
		};
	});
}

/** The one electron moving between two configurations, if exactly one moves. */
export function electronJump(lower: Configuration, upper: Configuration): { from: string; to: string; deltaL: number } | null {
	const occupancy = new Map<string, { n: number; l: number; d: number }>();
	for (const s of lower.subshells) occupancy.set(`${s.n}|${s.l}`, { n: s.n, l: s.l, d: -s.occupancy });
	for (const s of upper.subshells) {
		const k = `${s.n}|${s.l}`;
		const e = occupancy.get(k);
		if (e) e.d += s.occupancy;
		else occupancy.set(k, { n: s.n, l: s.l, d: s.occupancy });
	}
	const changed = [...occupancy.values()].filter((e) => e.d !== 0);
	if (changed.length !== 2) return null;
	const from = changed.find((e) => e.d === -1);
	const to = changed.find((e) => e.d === 1);
	if (!from || !to) return null;
	return { from: `${from.n}${lLetter(from.l)}`, to: `${to.n}${lLetter(to.l)}`, deltaL: to.l - from.l };
}

const twice = (j: string) => {
	const [a, b] = j.split('/');
	return b ? Number(a) : 2 * Number(a);
};

/**
 * Multiplets and lines between the terms of two configurations (or within one when the notations give the
 * same configuration), for the chosen types. Within one configuration each pair of terms is listed once, the
 * lower term being the lower one in Hund's heuristic order, and lines inside one term once per J pair (J < J′;
 * lines between two occurrences of a repeated term with equal J are not listed).
 * Throws ConfigurationError for bad notation, RangeError for an unknown type, a configuration whose terms the
 * engine refuses (see ./terms.ts budgets), or more than MAX_FINDER_LEVEL_PAIRS level pairs (checked first).
 * @example transitionFinder('3s', '3p', ['E1']).multiplets[0].label // '²S–²P°'
 */
export function transitionFinder(
	lowerText: string | Configuration,
	upperText: string | Configuration,
	types: readonly string[]
): FinderResult {
	const chosen = checkTransitionTypes(types);
	const lowerCfg = typeof lowerText === 'string' ? parseConfiguration(lowerText) : lowerText;
	const upperCfg = typeof upperText === 'string' ? parseConfiguration(upperText) : upperText;
	const within = formatConfiguration(lowerCfg) === formatConfiguration(upperCfg);
	let lowerTerms = termsOfConfiguration(lowerCfg);
	if (within) {
		// Within one configuration the lower term of each pair is the one lower in Hund's heuristic order
		// (energies are unknown here; the order is a heuristic, see ./hund.ts).
		const rank = new Map(hundOrder(lowerCfg).map((t, i) => [`${t.term.twoS}|${t.term.L}`, i]));
		lowerTerms = lowerTerms
			.map((t) => ({ t, r: rank.get(`${twice(t.S)}|${t.L}`) ?? 0 }))
			.sort((x, y) => x.r - y.r)
			.map((x) => x.t);
	}
	const upperTerms = within ? lowerTerms : termsOfConfiguration(upperCfg);
	const levelsLower = lowerTerms.reduce((a, t) => a + t.J.length, 0);
	const levelsUpper = upperTerms.reduce((a, t) => a + t.J.length, 0);
	const pairs = within ? (levelsLower * (levelsLower + 1)) / 2 : levelsLower * levelsUpper;
	if (pairs > MAX_FINDER_LEVEL_PAIRS) {
		throw new RangeError(
			`these configurations give ${pairs} pairs of J levels; the Transition finder examines at most ${MAX_FINDER_LEVEL_PAIRS} — choose smaller configurations`
		);
	}

	const multiplets: FinderMultiplet[] = [];
	let lineCount = 0;
	for (let a = 0; a < lowerTerms.length; a++) {
		for (let b = within ? a : 0; b < upperTerms.length; b++) {
			const lo = lowerTerms[a];
			const up = upperTerms[b];
			const loTerm = { twoS: twice(lo.S), L: lo.L };
			const upTerm = { twoS: twice(up.S), L: up.L };
			const sameTerm = within && a === b;
			for (const type of chosen) {
				const verdict = lsVerdict(type, loTerm, upTerm, sameTerm);
				const theory = verdict.allowed ? multipletLines(type, loTerm, upTerm) : null;
				const lines: FinderLine[] = [];
				for (const jl of [...lo.J].reverse()) {
					for (const ju of [...up.J].reverse()) {
						const tl = twice(jl);
						const tu = twice(ju);
						if (sameTerm && tu <= tl) continue;
						if (!jParityAllows(type, tl, lo.parity, tu, up.parity)) continue;
						const strength = theory?.find((x) => x.twoJLower === tl && x.twoJUpper === tu)?.strength ?? null;
						lines.push({ JLower: jl, JUpper: ju, strength });
					}
				}
				if (lines.length === 0) continue;
				lineCount += lines.length;
				multiplets.push({
					label: multipletLabel(loTerm, lo.parity, upTerm, up.parity),
					type,
					lower: a,
					upper: b,
					lsAllowed: verdict.allowed,
					intercombination: verdict.intercombination,
					lines
				});
			}
		}
	}
	const jump = within ? null : electronJump(lowerCfg, upperCfg);
	const side = (cfg: Configuration, terms: FinderTerm[]) => ({
		notation: formatConfiguration(cfg),
		pretty: displayConfiguration(cfg),
		parity: cfg.parity,
		terms
	});
	return {
		lower: side(lowerCfg, lowerTerms),
		upper: side(upperCfg, upperTerms),
		within,
		types: chosen,
		jump,
		oneElectronE1: jump !== null && Math.abs(jump.deltaL) === 1,
		multiplets,
		lineCount,
		energies: 'unknown',
		caution: FINDER_CAUTION
	};
}
