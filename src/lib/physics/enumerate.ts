/**
 * The classic method of finding LS terms, kept for cross-checks and the benchmark only.
 *
 * Every microstate is written out (each subshell's determinants with `combinations`, then their
 * Cartesian product with `cartesianProduct`), the (M_L, M_S) tally is built, and terms are
 * peeled off one at a time: the largest M_L present, at the largest M_S present with it, is a
 * term (L = M_L, S = M_S); one microstate of every (M_L′, M_S′) with |M_L′| ≤ L, |M_S′| ≤ S is
 * crossed out, and the search repeats (the textbook method; e.g. Condon & Shortley 1935, ch. 7,
 * worked for p² and d²). It costs time in proportion to the number of microstates; use
 * `termsOf` from ./terms.ts in the product.
 */
import { cartesianProduct, combinations } from 'combinatorial-generators';
import type { Configuration, Subshell, Term } from './types';
import { asSubshells, openSubshells, subshellCapacity } from './parse';
import { microstateTotal } from './microstates';

/** Largest number of microstates `termsByEnumeration` accepts. */
export const ENUMERATION_LIMIT = 2_000_000;

/** (M_L, 2M_S) of every determinant of l^N, by listing the N-subsets of its spin-orbitals. */
function determinantsOf(l: number, N: number): [number, number][] {
	const orbitals: [number, number][] = [];
	for (let ml = l; ml >= -l; ml--) orbitals.push([ml, 1], [ml, -1]);
	const out: [number, number][] = [];
	for (const pick of combinations(orbitals, N)) {
		let ML = 0;
		let twoMS = 0;
		for (const [ml, ms] of pick) {
			ML += ml;
			twoMS += ms;
		}
		out.push([ML, twoMS]);
	}
	return out;
}

/**
 * LS terms by explicit enumeration and peeling, sorted like `termsOf` (2S+1, then L, ascending),
 * with `seniorities` null. Throws RangeError when the configuration has more than
 * ENUMERATION_LIMIT microstates, ConfigurationError for an invalid subshell.
 * @example termsByEnumeration(parseConfiguration('2p2')).map((t) => t.L) // [0, 2, 1] (¹S ¹D ³P)
 */
export function termsByEnumeration(input: Configuration | readonly Subshell[]): Term[] {
	const subshells = asSubshells(input);
	const total = microstateTotal(subshells);
	if (total > BigInt(ENUMERATION_LIMIT)) {
		throw new RangeError(
			`the configuration has ${total} microstates; enumeration is limited to ${ENUMERATION_LIMIT} (use termsOf instead)`
		);
	}
	const open = openSubshells(subshells);
	let maxML = 0;
	let maxTwoMS = 0;
	for (const s of open) {
		const N = Math.min(s.occupancy, subshellCapacity(s.l) - s.occupancy);
		maxTwoMS += N;
		maxML += s.l * s.occupancy; // generous bound, only sizes the tally
	}
	const W = 2 * maxTwoMS + 1;
	const tally = new Map<number, number>();
	const key = (ML: number, twoMS: number) => (ML + maxML) * W + (twoMS + maxTwoMS);
	const lists = open.map((s) => determinantsOf(s.l, s.occupancy));
	if (lists.length === 0) lists.push([[0, 0]]);
	for (const microstate of cartesianProduct(...lists)) {
		let ML = 0;
		let twoMS = 0;
		for (const [a, b] of microstate) {
			ML += a;
			twoMS += b;
		}
		const k = key(ML, twoMS);
		tally.set(k, (tally.get(k) ?? 0) + 1);
	}
	const found = new Map<string, Term>();
	let left = Number(total);
	while (left > 0) {
		// Largest M_L present; then the largest M_S present with it.
		let bestML = -Infinity;
		let bestTwoMS = -Infinity;
		for (const [k, v] of tally) {
			if (v <= 0) continue;
			const ML = Math.floor(k / W) - maxML;
			const twoMS = (k % W) - maxTwoMS;
			if (ML > bestML || (ML === bestML && twoMS > bestTwoMS)) {
				bestML = ML;
				bestTwoMS = twoMS;
			}
		}
		const L = bestML;
		const twoS = bestTwoMS;
		for (let ML = -L; ML <= L; ML++) {
			for (let twoMS = -twoS; twoMS <= twoS; twoMS += 2) {
				const k = key(ML, twoMS);
				const v = tally.get(k) ?? 0;
				if (v <= 0) throw new Error(`internal error: no microstate left at M_L = ${ML}, 2M_S = ${twoMS} while peeling ${twoS + 1}/${L}`);
				tally.set(k, v - 1);
				left--;
			}
		}
		const id = `${twoS},${L}`;
		const t = found.get(id);
		if (t) t.count++;
		else found.set(id, { twoS, L, count: 1, seniorities: null });
	}
	return [...found.values()].sort((a, b) => a.twoS - b.twoS || a.L - b.L);
}
