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
import { checkSeniorityBudget } from './budget';

/** How many occurrences of one LS term have one seniority v. */
export interface SeniorityCount {
	seniority: number;
	count: number;
}

/**
 * The seniorities of one LS term of l^N as counts per seniority, ascending in v, zero counts
 * left out: d⁵ ²D is [{ seniority: 1, count: 1 }, { seniority: 3, count: 1 }, { seniority: 5, count: 1 }].
 * The counts add up to the number of occurrences of the term. (Counts, not one entry per
 * occurrence: a large subshell has terms that occur 10⁸ times.)
 */
export interface SeniorityEntry {
	twoS: number;
	L: number;
	seniorities: SeniorityCount[];
}

const tableCache = new Map<string, SeniorityEntry[]>();

function multiplicities(l: number, N: number): Map<string, bigint> {
	const m = new Map<string, bigint>();
	for (const t of decomposeGrid(subshellGrid(l, N))) m.set(`${t.twoS},${t.L}`, t.count);
	return m;
}

/**
 * Seniorities of every term of l^N (Racah 1943), in the order of `decomposeGrid`
 * (2S+1 then L ascending), as counts per seniority. Throws RangeError for l outside 0…16 or N
 * outside 0…2(2l+1), BudgetError (a RangeError) when the work is over MAX_GRID_WORK (./budget.ts).
 * Every count of a single subshell with l ≤ 16 is below 2^53 (the largest, of 16v33, is about 6·10¹³).
 * @example seniorityTable(2, 3).find((t) => t.twoS === 1 && t.L === 2)?.seniorities
 *   // [{ seniority: 1, count: 1 }, { seniority: 3, count: 1 }]
 */
export function seniorityTable(l: number, N: number): SeniorityEntry[] {
	const key = `${l},${N}`;
	const hit = tableCache.get(key);
	if (hit) return hit;
	const grid = subshellGrid(l, N); // validates l and N
	checkSeniorityBudget(l, N);
	const top = Math.min(N, subshellCapacity(l) - N);
	const byV = new Map<number, Map<string, bigint>>();
	for (let v = top % 2; v <= top; v += 2) byV.set(v, multiplicities(l, v));
	const out: SeniorityEntry[] = [];
	for (const t of decomposeGrid(grid)) {
		const k = `${t.twoS},${t.L}`;
		const seniorities: SeniorityCount[] = [];
		let sum = 0n;
		for (let v = top % 2; v <= top; v += 2) {
			const fresh = (byV.get(v)?.get(k) ?? 0n) - (byV.get(v - 2)?.get(k) ?? 0n);
			if (fresh < 0n) throw new Error(`internal error: negative seniority count for 2S=${t.twoS} L=${t.L} v=${v} in l=${l}^${N}`);
			if (fresh > 0n) seniorities.push({ seniority: v, count: Number(fresh) });
			sum += fresh;
		}
		if (sum !== t.count) {
			throw new Error(`internal error: seniorities of 2S=${t.twoS} L=${t.L} in l=${l}^${N} do not add up`);
		}
		out.push({ twoS: t.twoS, L: t.L, seniorities });
	}
	tableCache.set(key, out);
	return out;
}

/**
 * Seniorities of the term (S, L) in l^N as counts per seniority (ascending v); [] when the term
 * does not occur. Throws like `seniorityTable`.
 * @example senioritiesOf(2, 5, 1, 2) // [{ seniority: 1, count: 1 }, { seniority: 3, count: 1 }, { seniority: 5, count: 1 }] (d⁵ ²D occurs three times)
 */
export function senioritiesOf(l: number, N: number, twoS: number, L: number): SeniorityCount[] {
	return (
		seniorityTable(l, N)
			.find((t) => t.twoS === twoS && t.L === L)
			?.seniorities.map((s) => ({ ...s })) ?? []
	);
}
