/**
 * Racah seniority of the terms of one subshell l^N.
 *
 * Racah (Phys. Rev. 63, 367, 1943) showed that the states of l^N can be labelled by a seniority
 * v, the smallest number of electrons l^v in which the term first appears: l^N (N ≤ 2l+1)
 * contains every term of l^{N−2}, and the terms that are new in l^N have seniority v = N.
 * Hence the number of occurrences of (S, L) with seniority v is
 *   mult(S, L; l^v) − mult(S, L; l^{v−2}),  v = N′, N′−2, … ≥ 0,
 * with N′ = min(N, 4l+2−N) because l^N and l^{4l+2−N} have the same terms (electron–hole
 * symmetry; Condon & Shortley 1935; Cowan 1981). The seniority labels tabulated by
 * Nielson & Koster (1963) for p^N, d^N and f^N follow the same rule.
 */
import { decomposeGrid, subshellGrid } from './microstates';
import { subshellCapacity } from './parse';

/** The seniorities of one LS term of l^N, one entry per occurrence, ascending. */
export interface SeniorityEntry {
	twoS: number;
	L: number;
	seniorities: number[];
}

const tableCache = new Map<string, SeniorityEntry[]>();

function multiplicities(l: number, N: number): Map<string, number> {
	const m = new Map<string, number>();
	for (const t of decomposeGrid(subshellGrid(l, N))) m.set(`${t.twoS},${t.L}`, Number(t.count));
	return m;
}

/**
 * Seniorities of every term of l^N (Racah 1943), in the order of `decomposeGrid`
 * (2S+1 then L ascending). Throws RangeError for l outside 0…16 or N outside 0…2(2l+1).
 * @example seniorityTable(2, 3).find((t) => t.twoS === 1 && t.L === 2)?.seniorities // [1, 3]
 */
export function seniorityTable(l: number, N: number): SeniorityEntry[] {
	const key = `${l},${N}`;
	const hit = tableCache.get(key);
	if (hit) return hit;
	const top = Math.min(N, subshellCapacity(l) - N);
	const byV = new Map<number, Map<string, number>>();
	for (let v = top % 2; v <= top; v += 2) byV.set(v, multiplicities(l, v));
	const out: SeniorityEntry[] = [];
	for (const t of decomposeGrid(subshellGrid(l, N))) {
		const k = `${t.twoS},${t.L}`;
		const seniorities: number[] = [];
		for (let v = top % 2; v <= top; v += 2) {
			const fresh = (byV.get(v)?.get(k) ?? 0) - (byV.get(v - 2)?.get(k) ?? 0);
			for (let i = 0; i < fresh; i++) seniorities.push(v);
		}
		if (seniorities.length !== Number(t.count)) {
			throw new Error(`internal error: seniorities of 2S=${t.twoS} L=${t.L} in l=${l}^${N} do not add up`);
		}
		out.push({ twoS: t.twoS, L: t.L, seniorities });
	}
	tableCache.set(key, out);
	return out;
}

/**
 * Seniorities of the term (S, L) in l^N, one per occurrence, ascending; [] when the term does
 * not occur. Throws RangeError like `seniorityTable`.
 * @example senioritiesOf(2, 5, 1, 2) // [1, 3, 5] (d⁵ ²D occurs three times)
 */
export function senioritiesOf(l: number, N: number, twoS: number, L: number): number[] {
	return (
		seniorityTable(l, N)
			.find((t) => t.twoS === twoS && t.L === L)
			?.seniorities.slice() ?? []
	);
}
