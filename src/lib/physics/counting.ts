/**
 * Counting shared by the LS and jj engines, done by generating functions rather than listing.
 *
 * - `subsetSumRows(values)`: how many k-subsets of a set of distinct projections have each sum —
 *   the coefficients of Π_m (1 + t x^m) by dynamic programming (the Gaussian binomial
 *   coefficients for m = −l … l; Condon & Shortley 1935, ch. 7, the counting behind the term tables).
 * - `levelsFromProjections`: the number of levels of each J from the counts of states by M,
 *   N(J) = n(M = J) − n(M = J + 1) (Condon & Shortley 1935, ch. 7, the method of diagonal sums).
 * - `toSafeNumber`: a BigInt count as a number when that is exact (below 2^53).
 */

/** Counts of k-subsets by their sum: `rows[k][sum + offsets[k]]`, k = 0 … values.length. */
export interface SubsetSumRows {
	rows: number[][];
	offsets: number[];
}

/**
 * For a set of distinct values symmetric about 0 (−l … l, or the doubled −2j … 2j in steps of 2),
 * the number of k-subsets with each sum, for every k. Entries are at most C(n, k): exact in floats
 * for the sets used here (n ≤ 33).
 * Throws RangeError when the set is not symmetric about 0 or not made of distinct integers.
 * @example subsetSumRows([-1, 0, 1]).rows[2] // [1, 1, 1]: sums −1, 0, 1 (p: {−1,0}, {−1,1}, {0,1})
 */
export function subsetSumRows(values: readonly number[]): SubsetSumRows {
	const sorted = [...values].sort((a, b) => a - b);
	const symmetric = sorted.every((v, i) => Number.isInteger(v) && v === -sorted[sorted.length - 1 - i] && (i === 0 || v !== sorted[i - 1]));
	if (!symmetric) throw new RangeError(`subsetSumRows needs distinct integers symmetric about 0, got ${values.join(', ')}`);
	const n = sorted.length;
	const zero = sorted.reduce((s, v) => s + Math.abs(v), 0);
	const span = 2 * zero + 1;
	const dp: number[][] = Array.from({ length: n + 1 }, () => new Array<number>(span).fill(0));
	dp[0][zero] = 1;
	for (const m of sorted) {
		// Descending k: dp[k] is read before this value updates it (each value used once).
		for (let k = n - 1; k >= 0; k--) {
			const row = dp[k];
			const target = dp[k + 1];
			for (let s = 0; s < span; s++) if (row[s] !== 0) target[s + m] += row[s];
		}
	}
	const rows: number[][] = [];
	const offsets: number[] = [];
	const descending = [...sorted].reverse();
	for (let k = 0; k <= n; k++) {
		// The largest sum of k values is the sum of the k largest; by symmetry the smallest is its negative.
		const top = descending.slice(0, k).reduce((s, v) => s + v, 0);
		rows.push(dp[k].slice(zero - top, zero + top + 1));
		offsets.push(top);
	}
	return { rows, offsets };
}

/**
 * Levels of each J from state counts by M (both doubled: 2M → count), N(J) = n(J) − n(J + 1),
 * for 2J ≥ 0; zero counts are left out. Works for numbers or BigInts.
 * @example levelsFromProjections(new Map([[-2, 1], [0, 2], [2, 1]])) // Map { 0 => 1, 2 => 1 } (J = 0 and J = 1)
 */
export function levelsFromProjections<T extends number | bigint>(byTwoM: ReadonlyMap<number, T>): Map<number, T> {
	const out = new Map<number, T>();
	for (const [twoM, n] of byTwoM) {
		if (twoM < 0) continue;
		const above = byTwoM.get(twoM + 2);
		const diff = (above === undefined ? n : (n as number) - (above as number)) as T;
		if (diff > 0) out.set(twoM, diff);
	}
	return new Map([...out].sort((a, b) => a[0] - b[0]));
}

/**
 * A count as a number when it is exact (at most 2^53 − 1); otherwise a RangeError naming `what`.
 * @example toSafeNumber(12n, 'the number of 2D terms') // 12
 */
export function toSafeNumber(v: bigint, what: string): number {
	if (v > BigInt(Number.MAX_SAFE_INTEGER)) {
		throw new RangeError(`${what} is ${v}, too large to report exactly (above 2^53); use a smaller configuration`);
	}
	return Number(v);
}
