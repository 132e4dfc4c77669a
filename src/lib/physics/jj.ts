/**
 * jj coupling of a configuration.
 *
 * Each subshell nl^N splits into j = l − 1/2 (2l electrons) and j = l + 1/2 (2l + 2 electrons);
 * an s subshell has j = 1/2 only. Every way of sharing the N electrons between the two
 * j-subshells is a jj "distribution". Each j^k group of equivalent electrons has its allowed J
 * values (with multiplicities and seniorities), and the open groups are coupled one after
 * another: ((J1, J2)_{J12}, J3)_J … (Condon & Shortley 1935, ch. 10; Cowan 1981, ch. 4 on jj
 * coupling; de-Shalit & Talmi 1963 for the j^k states and their seniority).
 *
 * All angular momenta are doubled (twoJ, twoJsub, …).
 */
import { levelsFromProjections, subsetSumRows, toSafeNumber, type SubsetSumRows } from './counting';
import type { Configuration, Subshell } from './types';
import { halfString } from './half';
import { lLetter } from './letters';
import { asSubshells, subshellCapacity } from './parse';
import { BIGINT_COST_FACTOR, checkBudget, gridExtent, MAX_GRID_WORK } from './budget';

/** Most levels `jjLevels` will list for one configuration; counts of any size come from `jjLevelCountsByJ`. */
export const MAX_JJ_LEVELS = 20000;

/** One occupied j-subshell of a jj level. */
export interface JjPart {
	n: number;
	l: number;
	/** 2j of the one-electron orbital: 2l − 1 or 2l + 1. */
	twoJsub: number;
	/** Electrons in this j-subshell (1 … 2j+1). */
	occupancy: number;
	/** 2J of the j^k group (0 for a closed j-subshell). */
	twoJgroup: number;
	/** Seniority of the group state (0 for a closed j-subshell). */
	seniority: number;
	/** 1, or 2, 3, … when the same (J, seniority) occurs more than once in this j^k group (j ≥ 9/2). */
	copy: number;
	/** True when the j-subshell is full (2j+1 electrons); it then takes no part in the coupling. */
	closed: boolean;
}

/** A piece of a subshell label for rendering: n, letter, j as a subscript and the occupancy as a superscript (shown when > 1). */
export interface JjLabelPiece {
	n: number;
	letter: string;
	j: string;
	occupancy: number;
}

/** One jj-coupled level. */
export interface JjLevel {
	twoJ: number;
	/** Subshell label and coupling label together, e.g. "2p1/2 2p3/2 (1/2, 3/2)_2". */
	label: string;
	/** E.g. "2p1/2^2 2p3/2" (closed nl subshells are not written; "" when all subshells are closed). */
	subshellLabel: string;
	/** E.g. "(3/2, 1/2)_2" or "((1/2, 3/2)_1, 5/2)_3/2"; "(3/2)_3/2" for one open group; "(0)_0" when no j-subshell is open. */
	couplingLabel: string;
	labelPieces: JjLabelPiece[];
	/** The occupied j-subshells of the open nl subshells, in configuration order (j = l − 1/2 first). */
	parts: JjPart[];
	/**
	 * 2J of the running couplings strictly between the first open group and the total:
	 * for groups G1 … Gk, the 2J of G1⊗G2, (G1⊗G2)⊗G3, …, up to k − 2 entries ([] for two groups or fewer).
	 */
	intermediates: number[];
}

// ------------------------------------------------------------- j^k groups

/** A J value of a j^k group with its seniority and how many times that (J, v) occurs. */
interface GroupJ {
	twoJ: number;
	seniority: number;
	count: number;
}

const rowsCache = new Map<number, SubsetSumRows>();

/**
 * Number of ways to put k electrons into the 2j+1 states m = −j … j with Σm = M, as a map
 * 2M → count: the coefficient of x^M in the generating function Π_m (1 + y x^m), read at y^k
 * (Condon & Shortley 1935, ch. 7 counting; the shared subset-sum counting of ./counting.ts).
 */
function mCountsOfGroup(twoJsub: number, k: number): Map<number, number> {
	let table = rowsCache.get(twoJsub);
	if (!table) {
		table = subsetSumRows(Array.from({ length: twoJsub + 1 }, (_, i) => -twoJsub + 2 * i));
		rowsCache.set(twoJsub, table);
	}
	const out = new Map<number, number>();
	table.rows[k].forEach((n, i) => {
		if (n !== 0) out.set(i - table.offsets[k], n);
	});
	return out;
}

/** J multiplicities of j^k from N(J) = n(M = J) − n(M = J + 1) (Condon & Shortley 1935, ch. 7). */
function jCountsOfGroup(twoJsub: number, k: number): Map<number, number> {
	return levelsFromProjections(mCountsOfGroup(twoJsub, k));
}

/**
 * The states of j^k: J values, each split by seniority v. States of seniority v in j^k
 * (v ≤ k, v ≡ k mod 2) are those of j^v not already present in j^{v−2}, and j^k has the same
 * states as j^{2j+1−k} (particle–hole) (de-Shalit & Talmi 1963; Racah 1943).
 */
function groupStates(twoJsub: number, k: number): GroupJ[] {
	const capacity = twoJsub + 1;
	if (k === 0 || k === capacity) return [{ twoJ: 0, seniority: 0, count: 1 }];
	const kk = Math.min(k, capacity - k);
	const out: GroupJ[] = [];
	for (let v = kk % 2; v <= kk; v += 2) {
		const upper = jCountsOfGroup(twoJsub, v);
		const lower = v >= 2 ? jCountsOfGroup(twoJsub, v - 2) : new Map<number, number>();
		for (const [twoJ, n] of upper) {
			const c = n - (lower.get(twoJ) ?? 0);
			if (c < 0) throw new Error(`internal: negative seniority count for j = ${halfString(twoJsub)}, v = ${v}, J = ${halfString(twoJ)}`);
			if (c > 0) out.push({ twoJ, seniority: v, count: c });
		}
	}
	return out.sort((a, b) => a.twoJ - b.twoJ || a.seniority - b.seniority);
}

/**
 * Allowed J of k equivalent electrons in one j-subshell, with multiplicities, as a map
 * 2J → count in ascending 2J (M-counting over the 2j+1 states; Condon & Shortley 1935, ch. 7;
 * the jⁿ tables of de-Shalit & Talmi 1963). A closed or empty subshell gives J = 0 once.
 *
 * Throws RangeError when twoJsub is not a positive odd integer or k is not in 0 … 2j+1.
 * @example jGroupJCounts(5, 3) // (5/2)^3: Map { 3 => 1, 5 => 1, 9 => 1 }, J = 3/2, 5/2, 9/2
 */
export function jGroupJCounts(twoJsub: number, k: number): Map<number, number> {
	if (!Number.isInteger(twoJsub) || twoJsub < 1 || twoJsub % 2 !== 1) {
		throw new RangeError(`jGroupJCounts: twoJsub must be twice a half-integer j (1, 3, 5, …), got ${twoJsub}`);
	}
	if (!Number.isInteger(k) || k < 0 || k > twoJsub + 1) {
		throw new RangeError(`jGroupJCounts: k must be an integer from 0 to ${twoJsub + 1} for j = ${halfString(twoJsub)}, got ${k}`);
	}
	if (k === 0 || k === twoJsub + 1) return new Map([[0, 1]]);
	return new Map([...jCountsOfGroup(twoJsub, k)].sort((a, b) => a[0] - b[0]));
}

/**
 * The states of j^k split by seniority: [{ twoJ, seniority, count }] ascending in J then v
 * (de-Shalit & Talmi 1963: seniority-v states of j^k are the j^v states not in j^{v−2}).
 * Throws RangeError like `jGroupJCounts`.
 * @example jGroupSeniorities(7, 4) // (7/2)^4: J=0 v=0, J=2 v=2, J=2 v=4, J=4 v=2, J=4 v=4, J=5 v=4, J=6 v=2, J=8 v=4
 */
export function jGroupSeniorities(twoJsub: number, k: number): { twoJ: number; seniority: number; count: number }[] {
	jGroupJCounts(twoJsub, k); // validates
	return groupStates(twoJsub, k).map((g) => ({ ...g }));
}

// --------------------------------------------------------- J table algebra

type JTable = Map<number, bigint>;

/** Multiset of J from coupling every J of a with every J of b, |Ja − Jb| … Ja + Jb (triangle rule). */
function coupleTables(a: JTable, b: JTable): JTable {
	const out: JTable = new Map();
	for (const [ja, na] of a) {
		for (const [jb, nb] of b) {
			for (let j = Math.abs(ja - jb); j <= ja + jb; j += 2) out.set(j, (out.get(j) ?? 0n) + na * nb);
		}
	}
	return out;
}

function addInto(target: JTable, more: JTable): void {
	for (const [j, n] of more) target.set(j, (target.get(j) ?? 0n) + n);
}

function groupTable(twoJsub: number, k: number): JTable {
	const out: JTable = new Map();
	for (const [j, n] of jGroupJCounts(twoJsub, k)) out.set(j, BigInt(n));
	return out;
}

/** The j-subshells of an nl subshell: [2j, capacity] pairs, j = l − 1/2 first. */
function jSubshells(l: number): [number, number][] {
	return l === 0
		? [[1, 2]]
		: [
				[2 * l - 1, 2 * l],
				[2 * l + 1, 2 * l + 2]
			];
}

/** Ways (N₋, N₊) of sharing N electrons between j = l − 1/2 and j = l + 1/2, N₋ descending. */
function distributions(l: number, N: number): number[][] {
	if (l === 0) return [[N]];
	const out: number[][] = [];
	const capMinus = 2 * l;
	const capPlus = 2 * l + 2;
	for (let nMinus = Math.min(N, capMinus); nMinus >= Math.max(0, N - capPlus); nMinus--) out.push([nMinus, N - nMinus]);
	return out;
}

/** The multiset of J of one nl^N subshell in jj coupling, summed over its distributions. */
function subshellTable(l: number, N: number): JTable {
	const total: JTable = new Map();
	const subs = jSubshells(l);
	for (const dist of distributions(l, N)) {
		let t: JTable = new Map([[0, 1n]]);
		dist.forEach((k, i) => (t = coupleTables(t, groupTable(subs[i][0], k))));
		addInto(total, t);
	}
	return total;
}

/**
 * Number of jj-coupled levels of each J, as a map 2J → count in ascending 2J (zero counts left out).
 * Works without listing levels: each j^k group's J multiplicities by M-counting, coupled by the
 * triangle rule, summed over distributions, then coupled across subshells (the multiset of
 * coupled J does not depend on the coupling order). Must equal the LS count of each J
 * (Condon & Shortley 1935, ch. 10; Cowan 1981, ch. 4: coupling schemes share the J multiplicities).
 *
 * Throws ConfigurationError (from ./parse) for an invalid subshell, RangeError when a count exceeds 2^53.
 * @example jjLevelCountsByJ([{ n: 2, l: 1, occupancy: 2 }]) // Map { 0 => 2, 2 => 1, 4 => 2 }
 */
export function jjLevelCountsByJ(input: Configuration | readonly Subshell[]): Map<number, number> {
	const subshells = asSubshells(input);
	checkBudget(
		'the jj counting work of this configuration (operations)',
		jjCountWork(subshells),
		MAX_GRID_WORK,
		'use fewer or less-filled open subshells'
	);
	let total: JTable = new Map([[0, 1n]]);
	for (const s of subshells) {
		if (s.occupancy === subshellCapacity(s.l)) continue;
		total = coupleTables(total, subshellTable(s.l, s.occupancy));
	}
	const out = new Map<number, number>();
	for (const [j, n] of [...total].sort((a, b) => a[0] - b[0]))
		if (n > 0n) out.set(j, toSafeNumber(n, `the number of jj levels with J = ${halfString(j)}`));
	return out;
}

/**
 * Upper bound of the BigInt multiply-adds of `jjLevelCountsByJ`: coupling J tables of sizes
 * a and b costs at most a·b·(min span + 1); a subshell's 2J is at most 2·maxM_L + 2·maxM_S.
 */
function jjCountWork(subshells: readonly Subshell[]): number {
	let runningTwoJ = 0;
	let work = 0;
	for (const s of subshells) {
		if (s.occupancy === subshellCapacity(s.l)) continue;
		const e = gridExtent([s]);
		const twoJ = 2 * e.maxML + e.maxTwoMS;
		const inner = (twoJ / 2 + 1) * (twoJ / 2 + 1) * (twoJ + 1); // the subshell's own distributions
		work += inner + (runningTwoJ / 2 + 1) * (twoJ / 2 + 1) * (Math.min(runningTwoJ, twoJ) + 1);
		runningTwoJ += twoJ;
	}
	return work * BIGINT_COST_FACTOR;
}

/**
 * Throws an Error naming the first J (ascending) at which two level counts by J differ, e.g. the
 * LS counts of `levelCountsByJ` (./terms.ts) and the jj counts of `jjLevelCountsByJ`; returns
 * nothing when they agree. A missing J counts as 0. Both schemes must give the same number of
 * levels of each J (Condon & Shortley 1935, ch. 10; Cowan 1981, ch. 4).
 * @example assertLsJjAgree(new Map([[0, 2]]), new Map([[0, 1]])) // throws "… at J = 0: LS gives 2 levels, jj gives 1"
 */
export function assertLsJjAgree(lsCounts: ReadonlyMap<number, number>, jjCounts: ReadonlyMap<number, number>): void {
	const keys = [...new Set([...lsCounts.keys(), ...jjCounts.keys()])].sort((a, b) => a - b);
	for (const twoJ of keys) {
		const ls = lsCounts.get(twoJ) ?? 0;
		const jj = jjCounts.get(twoJ) ?? 0;
		if (ls !== jj) {
			throw new Error(`LS and jj coupling disagree at J = ${halfString(twoJ)}: LS gives ${ls} level${ls === 1 ? '' : 's'}, jj gives ${jj}`);
		}
	}
}

// ------------------------------------------------------------ level listing

interface OccupiedJ {
	n: number;
	l: number;
	twoJsub: number;
	occupancy: number;
	closed: boolean;
}

interface GroupChoice {
	twoJ: number;
	seniority: number;
	copy: number;
	/** Text of this group J in the coupling label, with [v=…] or #copy only where J alone is ambiguous. */
	text: string;
}

/** Each distinguishable state of j^k, in J then seniority order, with its label text. */
function groupChoices(twoJsub: number, k: number): GroupChoice[] {
	const states = groupStates(twoJsub, k);
	const perJ = new Map<number, number>();
	for (const g of states) perJ.set(g.twoJ, (perJ.get(g.twoJ) ?? 0) + g.count);
	const out: GroupChoice[] = [];
	for (const g of states) {
		for (let copy = 1; copy <= g.count; copy++) {
			let text = halfString(g.twoJ);
			if ((perJ.get(g.twoJ) ?? 0) > 1) text += g.count > 1 ? `[v=${g.seniority}, #${copy}]` : `[v=${g.seniority}]`;
			out.push({ twoJ: g.twoJ, seniority: g.seniority, copy, text });
		}
	}
	return out;
}

function pieceText(p: OccupiedJ): string {
	return `${p.n}${lLetter(p.l)}${halfString(p.twoJsub)}${p.occupancy > 1 ? `^${p.occupancy}` : ''}`;
}

/**
 * All jj-coupled levels of a configuration. Distributions come in configuration order with the
 * j = l − 1/2 subshell filled first (p²: (1/2)², then 1/2 3/2, then (3/2)²); inside one, group
 * states by J then seniority, then running couplings ascending, then J ascending. Closed nl
 * subshells are left out of parts and labels; closed j-subshells are written but not coupled.
 * (Condon & Shortley 1935, ch. 10; Cowan 1981, ch. 4; j^k states: de-Shalit & Talmi 1963.)
 *
 * Throws ConfigurationError (from ./parse) for an invalid subshell, and RangeError when the
 * configuration has more than MAX_JJ_LEVELS levels (the message gives the count; use
 * `jjLevelCountsByJ` for counts of large configurations).
 * @example jjLevels([{ n: 2, l: 1, occupancy: 2 }]).map((x) => x.label)
 *   // ['2p1/2^2 (0)_0', '2p1/2 2p3/2 (1/2, 3/2)_1', '2p1/2 2p3/2 (1/2, 3/2)_2', '2p3/2^2 (0)_0', '2p3/2^2 (2)_2']
 */
export function jjLevels(input: Configuration | readonly Subshell[]): JjLevel[] {
	const subshells = asSubshells(input);
	let total = 0n;
	for (const n of jjLevelCountsByJ(subshells).values()) total += BigInt(n);
	if (total > BigInt(MAX_JJ_LEVELS)) {
		throw new RangeError(
			`this configuration has ${total} jj levels; at most ${MAX_JJ_LEVELS} can be listed (counts by J come from jjLevelCountsByJ without listing)`
		);
	}
	const open = subshells.filter((s) => s.occupancy < subshellCapacity(s.l));
	if (open.length === 0) {
		return [{ twoJ: 0, label: '(0)_0', subshellLabel: '', couplingLabel: '(0)_0', labelPieces: [], parts: [], intermediates: [] }];
	}

	// Every combination of distributions over the open nl subshells, first subshell slowest.
	let combos: OccupiedJ[][] = [[]];
	for (const s of open) {
		const subs = jSubshells(s.l);
		const next: OccupiedJ[][] = [];
		for (const prefix of combos) {
			for (const dist of distributions(s.l, s.occupancy)) {
				const occupied: OccupiedJ[] = [];
				dist.forEach((k, i) => {
					if (k > 0) occupied.push({ n: s.n, l: s.l, twoJsub: subs[i][0], occupancy: k, closed: k === subs[i][1] });
				});
				next.push([...prefix, ...occupied]);
			}
		}
		combos = next;
	}

	const levels: JjLevel[] = [];
	for (const occupied of combos) {
		const subshellLabel = occupied.map(pieceText).join(' ');
		// Shared by every level of this distribution, so frozen.
		const labelPieces: JjLabelPiece[] = Object.freeze(
			occupied.map((p) => Object.freeze({ n: p.n, letter: lLetter(p.l), j: halfString(p.twoJsub), occupancy: p.occupancy }))
		) as JjLabelPiece[];
		const openIdx = occupied.map((p, i) => (p.closed ? -1 : i)).filter((i) => i >= 0);
		const choices = openIdx.map((i) => groupChoices(occupied[i].twoJsub, occupied[i].occupancy));

		/** `chain` holds the running 2J after coupling groups 1–2, 1–3, …; its last entry is the total. */
		const emit = (picked: GroupChoice[], chain: number[]) => {
			const twoJ = picked.length === 0 ? 0 : picked.length === 1 ? picked[0].twoJ : chain[chain.length - 1];
			const parts: JjPart[] = occupied.map((p, i) => {
				const g = openIdx.indexOf(i);
				return {
					n: p.n,
					l: p.l,
					twoJsub: p.twoJsub,
					occupancy: p.occupancy,
					twoJgroup: g < 0 ? 0 : picked[g].twoJ,
					seniority: g < 0 ? 0 : picked[g].seniority,
					copy: g < 0 ? 1 : picked[g].copy,
					closed: p.closed
				};
			});
			const couplingLabel = couplingText(
				picked.map((c) => c.text),
				chain,
				twoJ
			);
			levels.push({
				twoJ,
				label: subshellLabel === '' ? couplingLabel : `${subshellLabel} ${couplingLabel}`,
				subshellLabel,
				couplingLabel,
				labelPieces,
				parts,
				intermediates: chain.slice(0, Math.max(0, chain.length - 1))
			});
		};

		// Depth-first over the group states and the running couplings.
		const walk = (picked: GroupChoice[], chain: number[]) => {
			const g = picked.length;
			if (g === choices.length) {
				emit(picked, chain);
				return;
			}
			for (const c of choices[g]) {
				if (g === 0) {
					walk([c], []);
					continue;
				}
				const running = g === 1 ? picked[0].twoJ : chain[chain.length - 1];
				for (let j = Math.abs(running - c.twoJ); j <= running + c.twoJ; j += 2) walk([...picked, c], [...chain, j]);
			}
		};
		walk([], []);
	}
	return levels;
}

/**
 * The coupling label from group texts and running totals: "(0)_0" with no open group,
 * "(3/2)_3/2" with one, "(3/2, 1/2)_2" with two, "((3/2, 1/2)_1, 5/2)_3/2" with three, ….
 */
function couplingText(groups: string[], chain: number[], twoJ: number): string {
	if (groups.length === 0) return '(0)_0';
	if (groups.length === 1) return `(${groups[0]})_${halfString(twoJ)}`;
	let text = `(${groups[0]}, ${groups[1]})`;
	for (let i = 2; i < groups.length; i++) text = `(${text}_${halfString(chain[i - 2])}, ${groups[i]})`;
	return `${text}_${halfString(twoJ)}`;
}
