/**
 * The LS ↔ jK ↔ jj correlation of a configuration ("Coupling bridge").
 *
 * J is a good quantum number at every coupling strength, so each J level of the LS limit
 * turns continuously into a J level of the jj limit. Levels of the same J do not cross
 * (von Neumann–Wigner non-crossing rule), so the k-th lowest LS level of a given J joins the
 * k-th lowest jj level of that J (Condon & Shortley 1935, ch. 11, correlation diagrams;
 * Cowan 1981, §4-12). Where jK (pair) coupling applies (./jk.ts) its levels stand between the two
 * and are joined to both sides by the same rule.
 *
 * Every side is ordered schematically, not by computed energies:
 * - LS side: Hund's heuristic order of terms and of J within a term (./hund.ts).
 * - jK side: the core's levels in Hund order (J_core in the core's multiplet order), then K, then J.
 * - jj side: the first-order spin–orbit energy of the j-subshell occupation,
 *   Σ_subshells ζ_nl Σ_j N_j ⟨l·s⟩ with ⟨l·s⟩ = l/2 for j = l+½ and −(l+1)/2 for j = l−½, one ζ per
 *   subshell, lowest first; then J ascending inside a group.
 */
import type { Configuration, Subshell } from './types';
import { hundOrder } from './hund';
import { levelLabel } from './terms';
import { jjLevels, type JjLevel } from './jj';
import { jkLevels, jkSplit, JkNotApplicable, type JkLevel } from './jk';
import { asSubshells, openSubshells } from './parse';
import { letterToL } from './letters';

/**
 * Default ζ(core) / ζ(outer electron) where jK applies. A stand-in of the right order for a
 * p⁵ core and an outer electron one shell up: ζ(2p) of Ne II ≈ 520 cm⁻¹ (its ²P°₁/₂–²P°₃/₂
 * interval 780 cm⁻¹ = 3ζ/2) against ζ(3p) of Na I ≈ 11.5 cm⁻¹ (its 3p ²P interval 17.2 cm⁻¹);
 * both intervals from NIST ASD, from memory. Users set their own ζ per subshell.
 */
export const DEFAULT_CORE_TO_OUTER_ZETA = 45;

/** Where the default ζ ratio comes from, for display. */
export const ZETA_SOURCE =
	'Default ζ(core)/ζ(outer) = 45: ζ(2p) of Ne II ≈ 520 cm⁻¹ over ζ(3p) of Na I ≈ 11.5 cm⁻¹ (fine-structure intervals from NIST ASD, from memory). Other configurations: equal ζ for every subshell.';

/** ζ of one subshell, in arbitrary units (only ratios matter for the order). */
export interface SubshellZeta {
	n: number;
	l: number;
	zeta: number;
}

export interface BridgeLsLevel {
	label: string;
	twoJ: number;
	/** Occurrence of the term when it repeats (1, 2, …), else 1. */
	occurrence: number;
}

export interface BridgeJjLevel {
	label: string;
	twoJ: number;
	/** Σ ζ_nl N_j ⟨l·s⟩ (schematic spin–orbit energy of the group, in the units of ζ). */
	spinOrbitWeight: number;
	level: JjLevel;
}

export interface CouplingBridge {
	/** Schematic energy order, lowest first. */
	ls: BridgeLsLevel[];
	jj: BridgeJjLevel[];
	/** Pairs of indices into `ls` and `jj` with the same J. */
	links: { twoJ: number; ls: number; jj: number }[];
	/** jK levels in schematic order, or null where jK does not apply (then `jkReason` says why). */
	jk: JkLevel[] | null;
	jkReason: string | null;
	/** Triples of indices into `ls`, `jk`, `jj` of one J by the non-crossing rule; [] without jK. */
	jkLinks: { twoJ: number; ls: number; jk: number; jj: number }[];
	/** The ζ used for each open subshell, in configuration order. */
	zeta: SubshellZeta[];
}

/**
 * First-order spin–orbit weight of one jj level's j-subshell occupation, Σ ζ_nl N_j ⟨l·s⟩.
 * Without `zetaOf` every ζ is 1.
 */
export function jjSpinOrbitWeight(level: JjLevel, zetaOf: (n: number, l: number) => number = () => 1): number {
	let w = 0;
	for (const p of level.parts) w += zetaOf(p.n, p.l) * p.occupancy * (p.twoJsub > 2 * p.l ? p.l / 2 : -(p.l + 1) / 2);
	return w;
}

/**
 * The default ζ of each open subshell: 1, except the outer electron of a configuration where jK
 * applies, which gets 1 / DEFAULT_CORE_TO_OUTER_ZETA.
 * @example defaultZeta(parseConfiguration('2p5 3p')) // [{ n: 2, l: 1, zeta: 1 }, { n: 3, l: 1, zeta: 1/45 }]
 */
export function defaultZeta(input: Configuration | readonly Subshell[]): SubshellZeta[] {
	const subshells = asSubshells(input);
	let outer: Subshell | null = null;
	try {
		outer = jkSplit(subshells).outer;
	} catch (e) {
		if (!(e instanceof JkNotApplicable)) throw e;
	}
	return openSubshells(subshells).map((s) => ({
		n: s.n,
		l: s.l,
		zeta: outer && s.n === outer.n && s.l === outer.l ? 1 / DEFAULT_CORE_TO_OUTER_ZETA : 1
	}));
}

const byJ = (list: { twoJ: number }[]) => {
	const m = new Map<number, number[]>();
	list.forEach((x, i) => m.set(x.twoJ, [...(m.get(x.twoJ) ?? []), i]));
	return m;
};

/**
 * Correlates LS, jK (where it applies) and jj levels of equal J by the non-crossing rule (see the
 * module comment). `zeta` overrides the default ζ of some open subshells (./bridge.ts `defaultZeta`).
 * Throws what jjLevels (over MAX_JJ_LEVELS levels, checked before any list is built) and jkLevels
 * throw, ConfigurationError for bad input,
 * RangeError for a ζ that is not a positive finite number or names a subshell that is not open,
 * and an Error when the J counts of two sides differ (which would be a bug).
 * @example couplingBridge(parseConfiguration('2p 3p')).links.length // 10
 */
export function couplingBridge(input: Configuration | readonly Subshell[], zeta: readonly SubshellZeta[] = []): CouplingBridge {
	const subshells = asSubshells(input);
	const zetas = defaultZeta(subshells);
	for (const z of zeta) {
		const hit = zetas.find((x) => x.n === z.n && x.l === z.l);
		if (!hit)
			throw new RangeError(`ζ is given for a subshell that is not open here (n = ${z.n}, l = ${z.l}); give ζ for open subshells only`);
		if (!Number.isFinite(z.zeta) || z.zeta <= 0) throw new RangeError(`ζ must be a positive number, got ${z.zeta}`);
		hit.zeta = z.zeta;
	}
	const zetaOf = (n: number, l: number) => zetas.find((x) => x.n === n && x.l === l)?.zeta ?? 1;

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
		.map((level) => ({ label: level.label, twoJ: level.twoJ, spinOrbitWeight: jjSpinOrbitWeight(level, zetaOf), level }))
		.sort((a, b) => a.spinOrbitWeight - b.spinOrbitWeight || a.twoJ - b.twoJ);

	let jk: JkLevel[] | null = null;
	let jkReason: string | null = null;
	try {
		jk = jkLevels(subshells);
	} catch (e) {
		// jK that does not apply, or has more levels than it lists, leaves its column out; LS and jj stay.
		if (e instanceof JkNotApplicable) jkReason = e.message;
		else if (e instanceof RangeError) jkReason = `the jK column is left out: ${e.message}`;
		else throw e;
	}

	const lsByJ = byJ(ls);
	const jjByJ = byJ(jj);
	const jkByJ = jk ? byJ(jk) : null;
	const links: CouplingBridge['links'] = [];
	const jkLinks: CouplingBridge['jkLinks'] = [];
	for (const [twoJ, lsIdx] of lsByJ) {
		const jjIdx = jjByJ.get(twoJ) ?? [];
		if (jjIdx.length !== lsIdx.length)
			throw new Error(`LS and jj disagree on the number of levels with 2J = ${twoJ}: ${lsIdx.length} against ${jjIdx.length}`);
		lsIdx.forEach((li, k) => links.push({ twoJ, ls: li, jj: jjIdx[k] }));
		if (jkByJ) {
			const jkIdx = jkByJ.get(twoJ) ?? [];
			if (jkIdx.length !== lsIdx.length)
				throw new Error(`LS and jK disagree on the number of levels with 2J = ${twoJ}: ${lsIdx.length} against ${jkIdx.length}`);
			lsIdx.forEach((li, k) => jkLinks.push({ twoJ, ls: li, jk: jkIdx[k], jj: jjIdx[k] }));
		}
	}
	return { ls, jj, links, jk, jkReason, jkLinks, zeta: zetas };
}

/**
 * Reads ζ per subshell as written in the API: "2p:1,3p:0.022" (subshell n and letter, a colon, a
 * positive number; commas between). Empty text: [].
 * Throws RangeError naming the piece that cannot be read and what is allowed.
 * @example parseZetaList('2p:1, 3p:0.02') // [{ n: 2, l: 1, zeta: 1 }, { n: 3, l: 1, zeta: 0.02 }]
 */
export function parseZetaList(text: string): SubshellZeta[] {
	if (text.trim() === '') return [];
	return text.split(',').map((piece) => {
		const m = /^\s*(\d+)([a-z])\s*:\s*([0-9]*\.?[0-9]+(?:e[+-]?\d+)?)\s*$/i.exec(piece);
		const l = m ? letterToL(m[2]) : null;
		if (!m || l === null) {
			throw new RangeError(`cannot read ζ "${piece.trim()}": write subshell:value pairs such as 2p:1,3p:0.022 (positive numbers)`);
		}
		return { n: Number(m[1]), l, zeta: Number(m[3]) };
	});
}
