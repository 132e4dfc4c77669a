/**
 * jK (pair) coupling: a core level J_core coupled to the orbital momentum of one outer electron,
 * K = J_core + l, and then its spin, J = K ± ½. This is the scheme of Racah (Phys. Rev. 61, 537,
 * 1942) for the noble-gas spectra, written 2p⁵(²P°₃/₂)3p ²[5/2]₃: the core's LS term and J in
 * parentheses, the outer electron, then ²[K]_J, the 2 being 2s+1 of the outer electron and ° marking
 * odd parity (Cowan 1981, sec. 4.12 on pair coupling, from memory).
 *
 * It applies when the last open subshell in (n, l) order holds one electron (the outer electron)
 * and the other subshells, the core, include an open one. The core's terms come from the count
 * grid (./terms.ts) with their parentage (./parentage.ts); each gives J_core = |L−S| … L+S. The
 * number of levels of each J equals the LS count (the same states recoupled); `jkLevels` checks it.
 */
import type { Configuration, Subshell } from './types';
import { halfString } from './half';
import { levelDisplay, subscriptDigits, superscriptDigits } from './display';
import { hundOrder } from './hund';
import { parentageOf } from './parentage';
import { asSubshells, openSubshells, parityOf, subshellLabel } from './parse';
import { levelCountsByJ } from './terms';

/** The most jK levels listed (the same order as the jj listing limit). */
export const MAX_JK_LEVELS = 5000;

/** Why jK coupling does not apply to a configuration; the API answers 400 with the message. */
export class JkNotApplicable extends RangeError {
	constructor(message: string) {
		super(message);
		this.name = 'JkNotApplicable';
	}
}

/** The core and the outer electron of a configuration in jK coupling. */
export interface JkSplit {
	/** Every subshell but the outer electron's (closed ones included). */
	core: Subshell[];
	outer: Subshell;
}

/** One jK level. */
export interface JkLevel {
	core: {
		twoS: number;
		L: number;
		twoJ: number;
		/** The core term's occurrence (1, 2, …) in the core's parentage order; 1 when it occurs once. */
		occurrence: number;
		/** The core term's own parentage label, "3d⁶(⁵D)4s ⁶D", or "2p⁵ ²P°". */
		parentage: string;
	};
	twoK: number;
	twoJ: number;
	/** "2p⁵(²P°₃/₂)3p ²[5/2]₃". */
	label: string;
}

/**
 * The core and outer electron of a configuration, or throws JkNotApplicable saying why:
 * no open subshell, the last open subshell holding more than one electron, or no open subshell in the core.
 * @example jkSplit(parseConfiguration('2p5 3p')).outer // { n: 3, l: 1, occupancy: 1 }
 */
export function jkSplit(input: Configuration | readonly Subshell[]): JkSplit {
	const subshells = asSubshells(input);
	const open = openSubshells(subshells);
	if (open.length === 0) throw new JkNotApplicable('jK coupling needs an open core and one outer electron; every subshell here is closed');
	const outer = open[open.length - 1];
	if (outer.occupancy !== 1) {
		throw new JkNotApplicable(
			`jK coupling needs one outer electron: the last open subshell, ${subshellLabel(outer)}, holds ${outer.occupancy} electrons`
		);
	}
	if (open.length === 1) {
		throw new JkNotApplicable(
			`jK coupling needs an open core besides the outer electron: ${subshellLabel(outer)} is the only open subshell (use LS or jj)`
		);
	}
	return { core: subshells.filter((s) => s !== outer), outer };
}

/**
 * The jK levels of a configuration: for each core term occurrence (Hund order of the core) and each
 * J_core (in the core's expected multiplet order: the lowest first), K = |J_core − l| … J_core + l
 * ascending, J = K − ½, K + ½. A schematic order, not computed energies.
 * Source: Racah 1942; Cowan 1981, sec. 4.12 (from memory).
 * Throws JkNotApplicable (a RangeError) when jK does not apply, RangeError over MAX_JK_LEVELS or the
 * parentage limit, and Error when the J counts disagree with LS (a bug).
 * @example jkLevels(parseConfiguration('2p5 3p'))[0].label // '2p⁵(²P°₃/₂)3p ²[1/2]₀'
 */
export function jkLevels(input: Configuration | readonly Subshell[]): JkLevel[] {
	const subshells = asSubshells(input);
	const { core, outer } = jkSplit(subshells);
	const coreOdd = parityOf(core) === 'odd';
	const odd = parityOf(subshells) === 'odd';
	const paths = parentageOf(core);
	const order = hundOrder(core);
	const twoL = 2 * outer.l;
	const outerText = subshellLabel(outer, true);

	const out: JkLevel[] = [];
	for (const t of order) {
		const occurrences = paths.filter((p) => p.twoS === t.term.twoS && p.L === t.term.L);
		occurrences.forEach((path, k) => {
			for (const twoJc of t.twoJs) {
				const corePart = `${path.prefix}(${levelDisplay(t.term.twoS, t.term.L, twoJc, coreOdd)}${path.tell ? `, ${path.tell}` : ''})`;
				for (let twoK = Math.abs(twoJc - twoL); twoK <= twoJc + twoL; twoK += 2) {
					for (const twoJ of twoK === 0 ? [1] : [twoK - 1, twoK + 1]) {
						out.push({
							core: { twoS: t.term.twoS, L: t.term.L, twoJ: twoJc, occurrence: k + 1, parentage: path.label },
							twoK,
							twoJ,
							label: `${corePart}${outerText} ${superscriptDigits(2)}[${halfString(twoK)}]${odd ? '°' : ''}${subscriptDigits(halfString(twoJ))}`
						});
						if (out.length > MAX_JK_LEVELS)
							throw new RangeError(`this configuration has more than ${MAX_JK_LEVELS} jK levels; at most ${MAX_JK_LEVELS} are listed`);
					}
				}
			}
		});
	}
	assertJkAgreesWithLs(jkLevelCountsByJ(out), levelCountsByJ(subshells));
	return out;
}

/** Number of jK levels of each 2J, ascending 2J. */
export function jkLevelCountsByJ(levels: readonly JkLevel[]): Map<number, number> {
	const m = new Map<number, number>();
	for (const lv of levels) m.set(lv.twoJ, (m.get(lv.twoJ) ?? 0) + 1);
	return new Map([...m.entries()].sort((a, b) => a[0] - b[0]));
}

function assertJkAgreesWithLs(jk: Map<number, number>, ls: Map<number, number>): void {
	const keys = new Set([...jk.keys(), ...ls.keys()]);
	for (const twoJ of keys) {
		if ((jk.get(twoJ) ?? 0) !== (ls.get(twoJ) ?? 0)) {
			throw new Error(`internal error: jK gives ${jk.get(twoJ) ?? 0} levels with J = ${halfString(twoJ)}, LS gives ${ls.get(twoJ) ?? 0}`);
		}
	}
}
