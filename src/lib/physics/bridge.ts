/**
 * The LS ↔ jj correlation of a configuration ("Coupling bridge").
 *
 * J is a good quantum number at every coupling strength, so each J level of the LS limit
 * turns continuously into a J level of the jj limit. Levels of the same J do not cross
 * (von Neumann–Wigner non-crossing rule), so the k-th lowest LS level of a given J joins the
 * k-th lowest jj level of that J (Condon & Shortley 1935, ch. 11, correlation diagrams;
 * Cowan 1981, §4-12).
 *
 * Both sides are ordered schematically, not by computed energies:
 * - LS side: Hund's heuristic order of terms and of J within a term (./hund.ts).
 * - jj side: the first-order spin–orbit energy of the j-subshell occupation,
 *   Σ N_j ⟨l·s⟩ with ⟨l·s⟩ = l/2 for j = l+½ and −(l+1)/2 for j = l−½ (in units of ζ_nl,
 *   the same ζ for every subshell), lowest first; then J ascending inside a group.
 */
import type { Configuration, Subshell } from './types';
import { hundOrder } from './hund';
import { levelLabel } from './terms';
import { jjLevels, type JjLevel } from './jj';
import { asSubshells } from './parse';

export interface BridgeLsLevel {
	label: string;
	twoJ: number;
	/** Occurrence of the term when it repeats (1, 2, …), else 1. */
	occurrence: number;
}

export interface BridgeJjLevel {
	label: string;
	twoJ: number;
	/** Σ N_j ⟨l·s⟩ in units of ζ (schematic spin–orbit energy of the group). */
	spinOrbitWeight: number;
	level: JjLevel;
}

export interface CouplingBridge {
	/** Schematic energy order, lowest first. */
	ls: BridgeLsLevel[];
	jj: BridgeJjLevel[];
	/** Pairs of indices into `ls` and `jj` with the same J. */
	links: { twoJ: number; ls: number; jj: number }[];
}

/** First-order spin–orbit weight of one jj level's j-subshell occupation, in units of ζ. */
export function jjSpinOrbitWeight(level: JjLevel): number {
	let w = 0;
	for (const p of level.parts) w += p.occupancy * (p.twoJsub > 2 * p.l ? p.l / 2 : -(p.l + 1) / 2);
	return w;
}

/**
 * Correlates LS and jj levels of equal J by the non-crossing rule (see the module comment).
 * Throws what jjLevels throws (over MAX_JJ_LEVELS levels, checked before any list is built) or
 * ConfigurationError for bad input, and an
 * Error when the J counts of the two sides differ (which would be a bug).
 * @example couplingBridge(parseConfiguration('2p 3p')).links.length // 10
 */
export function couplingBridge(input: Configuration | readonly Subshell[]): CouplingBridge {
	const subshells = asSubshells(input);
	// jjLevels checks its output budget (MAX_JJ_LEVELS) before listing; the LS side has as many
	// levels, so it is built only after that check.
	const jjList = jjLevels(subshells);
	const ls: BridgeLsLevel[] = [];
	for (const t of hundOrder(subshells)) {
		for (let k = 1; k <= t.term.count; k++) {
			for (const twoJ of t.twoJs) {
				ls.push({ label: levelLabel(t.term, twoJ) + (t.term.count > 1 ? ` (${k})` : ''), twoJ, occurrence: k });
			}
		}
	}
	const jj: BridgeJjLevel[] = jjList
		.map((level) => ({ label: level.label, twoJ: level.twoJ, spinOrbitWeight: jjSpinOrbitWeight(level), level }))
		.sort((a, b) => a.spinOrbitWeight - b.spinOrbitWeight || a.twoJ - b.twoJ);

	const byJ = (list: { twoJ: number }[]) => {
		const m = new Map<number, number[]>();
		list.forEach((x, i) => m.set(x.twoJ, [...(m.get(x.twoJ) ?? []), i]));
		return m;
	};
	const lsByJ = byJ(ls);
	const jjByJ = byJ(jj);
	const links: CouplingBridge['links'] = [];
	for (const [twoJ, lsIdx] of lsByJ) {
		const jjIdx = jjByJ.get(twoJ) ?? [];
		if (jjIdx.length !== lsIdx.length)
			throw new Error(`LS and jj disagree on the number of levels with 2J = ${twoJ}: ${lsIdx.length} against ${jjIdx.length}`);
		lsIdx.forEach((li, k) => links.push({ twoJ, ls: li, jj: jjIdx[k] }));
	}
	return { ls, jj, links };
}
