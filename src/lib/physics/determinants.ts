/**
 * The determinant (uncoupled) basis of one configuration, one M_J block at a time.
 *
 * Only open subshells carry determinants: a closed subshell has one state, and its interaction
 * with everything else is the same for every determinant, so it only shifts the average energy
 * (Condon & Shortley 1935, §6⁵ and ch. VII; Cowan 1981, §6-1 and §13-1). A determinant is the
 * ascending list of its occupied spin-orbitals; spin-orbital numbers run subshell by subshell,
 * m_l from −l to l, m_s = −½ then +½. Phases follow the standard second-quantisation convention:
 * |D⟩ = a†_{i1} a†_{i2} … |0⟩ with i1 < i2 < … (Cowan 1981, §6-3; Slater 1960).
 */
import type { Configuration, Subshell } from './types';
import { openSubshells } from './parse';

/** Largest number of determinants in the one M_J block the solver diagonalises (checked before any work). */
export const MAX_BLOCK_DETERMINANTS = 1200;
/** Largest number of determinants of the whole configuration (all M_J), checked before any work. */
export const MAX_TOTAL_DETERMINANTS = 60000;

/** One spin-orbital n l m_l m_s of an open subshell; `shell` indexes the open-subshell list. */
export interface SpinOrbital {
	shell: number;
	l: number;
	ml: number;
	/** 2 m_s: −1 or +1. */
	twoMs: number;
}

/** The open subshells of a configuration and their spin-orbitals. */
export interface OrbitalSet {
	shells: Subshell[];
	orbitals: SpinOrbital[];
	/** First spin-orbital number of each open subshell. */
	offsets: number[];
	electrons: number;
}

/** The determinants of one M_J block: `occ` holds `size` rows of `electrons` ascending spin-orbital numbers. */
export interface DeterminantBlock {
	twoMJ: number;
	size: number;
	electrons: number;
	occ: Int16Array;
	/** M_L of each determinant. */
	ML: Int32Array;
	/** 2 M_S of each determinant. */
	twoMS: Int32Array;
	/** Row of a determinant by its key (`detKey`). */
	index: Map<string, number>;
}

/**
 * The open subshells of a configuration with their spin-orbitals.
 * @example orbitalSet(parseConfiguration('2p2')).orbitals.length // 6
 */
export function orbitalSet(cfg: Configuration | readonly Subshell[]): OrbitalSet {
	const shells = openSubshells(cfg as Configuration);
	const orbitals: SpinOrbital[] = [];
	const offsets: number[] = [];
	shells.forEach((s, shell) => {
		offsets.push(orbitals.length);
		for (let ml = -s.l; ml <= s.l; ml++) for (const twoMs of [-1, 1]) orbitals.push({ shell, l: s.l, ml, twoMs });
	});
	return { shells, orbitals, offsets, electrons: shells.reduce((a, s) => a + s.occupancy, 0) };
}

/** Counts of one subshell's determinants by 2M_J (dynamic programming over its spin-orbitals). */
function subshellMJCounts(l: number, N: number): Map<number, number> {
	// table[k] maps 2M -> number of ways to place k electrons in the spin-orbitals seen so far
	let table: Map<number, number>[] = [new Map([[0, 1]])];
	for (let ml = -l; ml <= l; ml++) {
		for (const twoMs of [-1, 1]) {
			const w = 2 * ml + twoMs;
			const next = table.map((m) => new Map(m));
			for (let k = 0; k < table.length && k < N; k++) {
				if (!next[k + 1]) next[k + 1] = new Map();
				for (const [t, c] of table[k]) next[k + 1].set(t + w, (next[k + 1].get(t + w) ?? 0) + c);
			}
			table = next;
		}
	}
	return table[N] ?? new Map();
}

/**
 * Number of determinants of the configuration's open subshells for every 2M_J, and in total.
 * Cheap (no listing); used to check the budgets before any work.
 * @example determinantCounts(parseConfiguration('2p2')).total // 15
 */
export function determinantCounts(cfg: Configuration | readonly Subshell[]): { byTwoMJ: Map<number, number>; total: number } {
	let acc = new Map<number, number>([[0, 1]]);
	for (const s of openSubshells(cfg as Configuration)) {
		const one = subshellMJCounts(s.l, s.occupancy);
		const next = new Map<number, number>();
		for (const [a, x] of acc) for (const [b, y] of one) next.set(a + b, (next.get(a + b) ?? 0) + x * y);
		acc = next;
	}
	let total = 0;
	for (const c of acc.values()) total += c;
	return { byTwoMJ: acc, total };
}

/** 2M_J of the block that holds one state of every level: 0 for an even electron count, 1 otherwise. */
export function centralTwoMJ(electrons: number): number {
	return electrons % 2;
}

/**
 * Throws RangeError when the configuration is over the determinant budgets (whole configuration,
 * or the one M_J block the solver diagonalises). The message states the limit.
 * @example checkDeterminantBudget(parseConfiguration('4f7 5d')) // throws: 3106 determinants … at most 1200
 */
export function checkDeterminantBudget(
	cfg: Configuration | readonly Subshell[],
	limits: { maxBlock?: number; maxTotal?: number } = {}
): { total: number; block: number } {
	const maxBlock = limits.maxBlock ?? MAX_BLOCK_DETERMINANTS;
	const maxTotal = limits.maxTotal ?? MAX_TOTAL_DETERMINANTS;
	const shells = openSubshells(cfg as Configuration);
	const electrons = shells.reduce((a, s) => a + s.occupancy, 0);
	const { byTwoMJ, total } = determinantCounts(shells);
	const block = byTwoMJ.get(centralTwoMJ(electrons)) ?? 0;
	if (total > maxTotal) {
		throw new RangeError(`The open subshells have ${total} determinants; the energy solver takes at most ${maxTotal} (all M_J together)`);
	}
	if (block > maxBlock) {
		throw new RangeError(
			`The M_J = ${electrons % 2 ? '1/2' : '0'} block has ${block} determinants; the energy solver diagonalises at most ${maxBlock} in one block`
		);
	}
	return { total, block };
}

/** All ways to choose N of one subshell's spin-orbitals, grouped by 2M_J (lists of global spin-orbital numbers). */
function subshellDeterminants(set: OrbitalSet, shell: number): Map<number, number[][]> {
	const s = set.shells[shell];
	const first = set.offsets[shell];
	const g = 2 * (2 * s.l + 1);
	const out = new Map<number, number[][]>();
	const pick: number[] = [];
	const rec = (start: number, left: number, twoM: number) => {
		if (left === 0) {
			const list = out.get(twoM) ?? [];
			list.push(pick.slice());
			out.set(twoM, list);
			return;
		}
		for (let i = start; i <= g - left; i++) {
			const o = set.orbitals[first + i];
			pick.push(first + i);
			rec(i + 1, left - 1, twoM + 2 * o.ml + o.twoMs);
			pick.pop();
		}
	};
	rec(0, s.occupancy, 0);
	return out;
}

/** Key of a determinant for lookups. */
export function detKey(occ: ArrayLike<number>): string {
	return Array.prototype.join.call(occ, ',');
}

/**
 * The determinants with the given 2M_J, listed subshell by subshell (never the whole product space).
 * Call `checkDeterminantBudget` first.
 * @example determinantBlock(orbitalSet(parseConfiguration('2p2')), 0).size // 5
 */
export function determinantBlock(set: OrbitalSet, twoMJ: number): DeterminantBlock {
	const per = set.shells.map((_, i) => subshellDeterminants(set, i));
	const ranges = per.map((m) => {
		const keys = [...m.keys()];
		return { lo: Math.min(...keys), hi: Math.max(...keys) };
	});
	// Reachable 2M range of the subshells after position i.
	const restLo: number[] = new Array(per.length + 1).fill(0);
	const restHi: number[] = new Array(per.length + 1).fill(0);
	for (let i = per.length - 1; i >= 0; i--) {
		restLo[i] = restLo[i + 1] + ranges[i].lo;
		restHi[i] = restHi[i + 1] + ranges[i].hi;
	}
	const rows: number[][] = [];
	const parts: number[][] = [];
	const rec = (i: number, left: number) => {
		if (i === per.length) {
			if (left === 0) rows.push(parts.flat());
			return;
		}
		if (left < restLo[i] || left > restHi[i]) return;
		for (const [twoM, list] of per[i]) {
			const rest = left - twoM;
			if (rest < restLo[i + 1] || rest > restHi[i + 1]) continue;
			for (const d of list) {
				parts.push(d);
				rec(i + 1, rest);
				parts.pop();
			}
		}
	};
	rec(0, twoMJ);
	const electrons = set.electrons;
	const occ = new Int16Array(rows.length * electrons);
	const ML = new Int32Array(rows.length);
	const twoMS = new Int32Array(rows.length);
	const index = new Map<string, number>();
	rows.forEach((r, k) => {
		occ.set(r, k * electrons);
		let ml = 0;
		let ms = 0;
		for (const o of r) {
			ml += set.orbitals[o].ml;
			ms += set.orbitals[o].twoMs;
		}
		ML[k] = ml;
		twoMS[k] = ms;
		index.set(detKey(r), k);
	});
	return { twoMJ, size: rows.length, electrons, occ, ML, twoMS, index };
}

/** The occupied spin-orbitals of row `k` of a block. */
export function rowOf(block: DeterminantBlock, k: number): Int16Array {
	return block.occ.subarray(k * block.electrons, (k + 1) * block.electrons);
}

/**
 * a_i |D⟩ for the ascending occupation list D: the new list and the sign (−1)^{number of occupied
 * spin-orbitals before i}, or null when i is empty.
 */
export function annihilate(occ: readonly number[], i: number): { occ: number[]; sign: number } | null {
	const p = occ.indexOf(i);
	if (p < 0) return null;
	const out = occ.slice();
	out.splice(p, 1);
	return { occ: out, sign: p % 2 === 0 ? 1 : -1 };
}

/** a†_i |D⟩: the new ascending list and the sign (−1)^{number of occupied spin-orbitals before i}, or null when i is occupied. */
export function create(occ: readonly number[], i: number): { occ: number[]; sign: number } | null {
	let p = 0;
	while (p < occ.length && occ[p] < i) p++;
	if (occ[p] === i) return null;
	const out = occ.slice();
	out.splice(p, 0, i);
	return { occ: out, sign: p % 2 === 0 ? 1 : -1 };
}
