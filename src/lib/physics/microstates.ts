/**
 * Microstate counts by (M_L, M_S) through generating functions.
 *
 * A microstate (Slater determinant) of l^N picks N of the 2(2l+1) spin-orbitals (m_l, m_s).
 * Its M_L = Σ m_l and M_S = Σ m_s. The number of determinants of l^N with given (M_L, M_S) is
 * the coefficient of x^{M_L} y^{M_S} t^N in Π_{m_l} (1 + t x^{m_l} y^{1/2})(1 + t x^{m_l} y^{-1/2})
 * (the counting behind the term tables of Condon & Shortley 1935, ch. 7, and of Cowan 1981).
 * Spin-up and spin-down electrons are chosen independently, so with a up and b = N − a down
 * electrons the M_L distribution is the convolution of two Gaussian-binomial rows P_a ⋆ P_b,
 * where P_k(M) counts k-subsets of {−l … l} summing to M. Subshells are independent, so the
 * grid of a configuration is the 2-D convolution of its subshells' grids; a closed subshell
 * contributes only (0, 0) with count 1 and is skipped. Nothing is enumerated.
 *
 * Angular momenta are stored as twice their value where they may be half-integral: `twoMS`.
 */
import type { Configuration, Subshell } from './types';
import { asSubshells, openSubshells, subshellCapacity } from './parse';
import { subsetSumRows, type SubsetSumRows } from './counting';
import { checkGridBudget } from './budget';

/**
 * Counts of microstates by (M_L, M_S). M_L runs from `minML` = −maxML to `maxML`; 2M_S runs
 * from −maxTwoMS to maxTwoMS in steps of 2. `counts[ML − minML][(twoMS + maxTwoMS) / 2]`.
 * Use `countAt` rather than indexing by hand. The grid is symmetric in M_L → −M_L and
 * M_S → −M_S. Grids are frozen: do not modify them.
 */
export interface MicrostateGrid {
	minML: number;
	maxML: number;
	maxTwoMS: number;
	counts: readonly (readonly bigint[])[];
}

/** An LS term occurrence count read off a grid (before seniorities are attached). */
export interface TermCount {
	twoS: number;
	L: number;
	count: bigint;
}

/** Internal flat grid: rows are M_L (index ML + maxML), columns 2M_S (index (twoMS + maxTwoMS) / 2). */
interface FlatGrid {
	maxML: number;
	maxTwoMS: number;
	big: bigint[];
	/** The same counts as floats, present only when every count is below 2^53 (then exact). */
	small: Float64Array | null;
}

const subshellCache = new Map<string, FlatGrid>();

export { MAX_GRID_WORK, BIGINT_COST_FACTOR } from './budget';
const binomialCache = new Map<string, bigint>();

/**
 * Binomial coefficient C(n, k) as a BigInt (0 when k < 0 or k > n).
 * Throws RangeError when n or k is not an integer or n < 0.
 * @example binomial(10, 5) // 252n
 */
export function binomial(n: number, k: number): bigint {
	if (!Number.isInteger(n) || !Number.isInteger(k) || n < 0) {
		throw new RangeError(`binomial(n, k) needs integers with n ≥ 0, got n = ${n}, k = ${k}`);
	}
	if (k < 0 || k > n) return 0n;
	const key = `${n},${k}`;
	const hit = binomialCache.get(key);
	if (hit !== undefined) return hit;
	let r = 1n;
	const kk = Math.min(k, n - k);
	for (let i = 1; i <= kk; i++) r = (r * BigInt(n - kk + i)) / BigInt(i);
	binomialCache.set(key, r);
	return r;
}

/** Empties the per-subshell cache (for benchmarks that time a cold start). */
export function clearMicrostateCache(): void {
	subshellCache.clear();
	rowsCache.clear();
	combinedCache.clear();
}

/**
 * Largest M_L of l^N: the N largest values of the multiset {l, l, l−1, l−1, …, −l, −l}.
 * @example maxMLOf(2, 3) // 5 (d³: 2 + 2 + 1)
 */
export function maxMLOf(l: number, N: number): number {
	let sum = 0;
	for (let i = 0; i < N; i++) sum += l - Math.floor(i / 2);
	return sum;
}

const rowsCache = new Map<number, SubsetSumRows>();

/**
 * Number of k-subsets of {−l … l} with each sum M (Gaussian binomial coefficients), for
 * k = 0 … 2l+1: rows[k][M + offsets[k]]. Every entry is at most C(2l+1, k), exact in floats.
 */
function gaussianRows(l: number): SubsetSumRows {
	const hit = rowsCache.get(l);
	if (hit) return hit;
	const mls = Array.from({ length: 2 * l + 1 }, (_, i) => i - l);
	const result = subsetSumRows(mls);
	rowsCache.set(l, result);
	return result;
}

function subshellGridFlat(l: number, N: number): FlatGrid {
	const key = `${l},${N}`;
	const hit = subshellCache.get(key);
	if (hit) return hit;
	const cap = subshellCapacity(l);
	const maxML = maxMLOf(l, N);
	const maxTwoMS = Math.min(N, cap - N);
	const H = 2 * maxML + 1;
	const W = maxTwoMS + 1;
	const big = new Array<bigint>(H * W).fill(0n);
	const { rows, offsets } = gaussianRows(l);
	const half = 2 * l + 1;
	for (let a = Math.max(0, N - half); a <= Math.min(N, half); a++) {
		const b = N - a;
		const j = (2 * a - N + maxTwoMS) / 2;
		const pa = rows[a];
		const pb = rows[b];
		for (let x = 0; x < pa.length; x++) {
			if (pa[x] === 0) continue;
			const va = BigInt(pa[x]);
			for (let y = 0; y < pb.length; y++) {
				if (pb[y] === 0) continue;
				const ml = x - offsets[a] + (y - offsets[b]);
				const idx = (ml + maxML) * W + j;
				big[idx] += va * BigInt(pb[y]);
			}
		}
	}
	const grid: FlatGrid = { maxML, maxTwoMS, big, small: toSmall(big, binomial(cap, N)) };
	subshellCache.set(key, grid);
	return grid;
}

function toSmall(big: bigint[], total: bigint): Float64Array | null {
	if (total > BigInt(Number.MAX_SAFE_INTEGER)) return null;
	const out = new Float64Array(big.length);
	for (let i = 0; i < big.length; i++) out[i] = Number(big[i]);
	return out;
}

/**
 * 2-D convolution of two symmetric grids. Only the quadrant M_L ≥ 0, M_S ≥ 0 is summed and the
 * rest is filled by symmetry. Floats are used (exactly) when `exactInFloat` says the result's
 * total stays below 2^53, since every partial sum is bounded by the total.
 */
function convolve(A: FlatGrid, B: FlatGrid, exactInFloat: boolean): FlatGrid {
	const maxML = A.maxML + B.maxML;
	const maxTwoMS = A.maxTwoMS + B.maxTwoMS;
	const H = 2 * maxML + 1;
	const W = maxTwoMS + 1;
	const HA = 2 * A.maxML + 1;
	const WA = A.maxTwoMS + 1;
	const HB = 2 * B.maxML + 1;
	const WB = B.maxTwoMS + 1;
	const iMin = maxML; // row of M_L = 0
	const jMin = Math.ceil(maxTwoMS / 2); // column of the smallest 2M_S ≥ 0
	let big: bigint[];
	let small: Float64Array | null = null;
	if (exactInFloat && A.small && B.small) {
		const a = A.small;
		const b = B.small;
		const out = new Float64Array(H * W);
		for (let ia = 0; ia < HA; ia++) {
			const ibStart = Math.max(0, iMin - ia);
			for (let ja = 0; ja < WA; ja++) {
				const va = a[ia * WA + ja];
				if (va === 0) continue;
				const jbStart = Math.max(0, jMin - ja);
				for (let ib = ibStart; ib < HB; ib++) {
					const rowOut = (ia + ib) * W + ja;
					const rowB = ib * WB;
					for (let jb = jbStart; jb < WB; jb++) out[rowOut + jb] += va * b[rowB + jb];
				}
			}
		}
		mirror(out, H, W, iMin, jMin, maxTwoMS);
		small = out;
		big = new Array<bigint>(H * W);
		for (let i = 0; i < out.length; i++) big[i] = BigInt(out[i]);
	} else {
		const a = A.big;
		const b = B.big;
		const out = new Array<bigint>(H * W).fill(0n);
		for (let ia = 0; ia < HA; ia++) {
			const ibStart = Math.max(0, iMin - ia);
			for (let ja = 0; ja < WA; ja++) {
				const va = a[ia * WA + ja];
				if (va === 0n) continue;
				const jbStart = Math.max(0, jMin - ja);
				for (let ib = ibStart; ib < HB; ib++) {
					const rowOut = (ia + ib) * W + ja;
					const rowB = ib * WB;
					for (let jb = jbStart; jb < WB; jb++) {
						const vb = b[rowB + jb];
						if (vb !== 0n) out[rowOut + jb] += va * vb;
					}
				}
			}
		}
		mirror(out, H, W, iMin, jMin, maxTwoMS);
		big = out;
	}
	return { maxML, maxTwoMS, big, small };
}

function mirror<T>(out: { [i: number]: T }, H: number, W: number, iMin: number, jMin: number, maxTwoMS: number): void {
	for (let i = iMin; i < H; i++) {
		for (let j = 0; j < jMin; j++) out[i * W + j] = out[i * W + (maxTwoMS - j)];
	}
	for (let i = 0; i < iMin; i++) {
		const src = 2 * iMin - i;
		for (let j = 0; j < W; j++) out[i * W + j] = out[src * W + j];
	}
}

const CLOSED: FlatGrid = { maxML: 0, maxTwoMS: 0, big: [1n], small: Float64Array.of(1) };

/**
 * Recently combined grids by their open (l, N) list: one Term sheet asks for the same grid from
 * several modules (terms, Hund's order, parentage, the grid itself), and n does not change it.
 */
const combinedCache = new Map<string, FlatGrid>();
const COMBINED_CACHE_SIZE = 16;

function flatGridOf(subshells: readonly Subshell[]): FlatGrid {
	const open = openSubshells(subshells);
	if (open.length === 0) return CLOSED;
	const key = open
		.map((s) => `${s.l}^${s.occupancy}`)
		.sort()
		.join(' ');
	const hit = combinedCache.get(key);
	if (hit) {
		// Most recently used last, so the oldest is evicted first.
		combinedCache.delete(key);
		combinedCache.set(key, hit);
		return hit;
	}
	const grid = combineGrids(open);
	combinedCache.set(key, grid);
	if (combinedCache.size > COMBINED_CACHE_SIZE) combinedCache.delete(combinedCache.keys().next().value!);
	return grid;
}

function combineGrids(open: readonly Subshell[]): FlatGrid {
	let total = 1n;
	for (const s of open) total *= binomial(subshellCapacity(s.l), s.occupancy);
	const exactInFloat = total <= BigInt(Number.MAX_SAFE_INTEGER);
	// Before any grid is built: the estimated work and grid size against the budget.
	checkGridBudget(open, exactInFloat);
	// Smaller grids first keeps the intermediate grids small.
	const grids = open.map((s) => subshellGridFlat(s.l, s.occupancy)).sort((x, y) => x.big.length - y.big.length);
	let acc = grids[0];
	for (let k = 1; k < grids.length; k++) acc = convolve(acc, grids[k], exactInFloat);
	return acc;
}

function toGrid(flat: FlatGrid): MicrostateGrid {
	const W = flat.maxTwoMS + 1;
	const counts: (readonly bigint[])[] = [];
	for (let i = 0; i < 2 * flat.maxML + 1; i++) counts.push(Object.freeze(flat.big.slice(i * W, (i + 1) * W)));
	return Object.freeze({ minML: -flat.maxML, maxML: flat.maxML, maxTwoMS: flat.maxTwoMS, counts: Object.freeze(counts) });
}

/**
 * The (M_L, M_S) count grid of a configuration (or a list of subshells), by generating
 * functions: per-subshell grids (cached by l and N) convolved together; closed subshells skipped.
 * Throws ConfigurationError for an invalid subshell (see `configurationOf`), BudgetError (a
 * RangeError, ./budget.ts) when the work would exceed MAX_GRID_WORK or the grid MAX_GRID_CELLS —
 * checked before any grid is built.
 * @example countAt(microstateGrid(parseConfiguration('2p2')), 0, 0) // 5n
 */
export function microstateGrid(input: Configuration | readonly Subshell[]): MicrostateGrid {
	return toGrid(flatGridOf(asSubshells(input)));
}

/**
 * The (M_L, M_S) grid of a single subshell l^N (any l ≥ 0, 0 ≤ N ≤ 2(2l+1)), from the cache.
 * Throws RangeError for l or N out of range.
 * @example subshellGrid(1, 3).maxML // 2
 */
export function subshellGrid(l: number, N: number): MicrostateGrid {
	if (!Number.isInteger(l) || l < 0 || l > 16) throw new RangeError(`l = ${l} is out of range: l must be an integer from 0 to 16`);
	if (!Number.isInteger(N) || N < 0 || N > subshellCapacity(l)) {
		throw new RangeError(`N = ${N} is out of range for l = ${l}: N must be an integer from 0 to ${subshellCapacity(l)}`);
	}
	if (N === 0 || N === subshellCapacity(l)) return toGrid(CLOSED);
	return toGrid(subshellGridFlat(l, N));
}

/**
 * Number of microstates with the given M_L and 2M_S (0n outside the grid or for the wrong parity).
 * @example countAt(subshellGrid(1, 2), 1, 2) // 1n (p²: only m_l = 1, 0 with both spins up)
 */
export function countAt(grid: MicrostateGrid, ML: number, twoMS: number): bigint {
	if (!Number.isInteger(ML) || !Number.isInteger(twoMS)) return 0n;
	if (ML < grid.minML || ML > grid.maxML || Math.abs(twoMS) > grid.maxTwoMS) return 0n;
	if ((twoMS + grid.maxTwoMS) % 2 !== 0) return 0n;
	return grid.counts[ML - grid.minML][(twoMS + grid.maxTwoMS) / 2];
}

/**
 * Sum of all counts of a grid.
 * @example gridTotal(subshellGrid(2, 5)) // 252n
 */
export function gridTotal(grid: MicrostateGrid): bigint {
	let t = 0n;
	for (const row of grid.counts) for (const v of row) t += v;
	return t;
}

/**
 * Total number of microstates, Π C(2(2l+1), N) over subshells (independent choices of
 * spin-orbitals per subshell; Condon & Shortley 1935, ch. 7). Computed directly, not from a grid.
 * Throws ConfigurationError for an invalid subshell.
 * @example microstateTotal(parseConfiguration('3d5 4s')) // 504n
 */
export function microstateTotal(input: Configuration | readonly Subshell[]): bigint {
	let t = 1n;
	for (const s of asSubshells(input)) t *= binomial(subshellCapacity(s.l), s.occupancy);
	return t;
}

/**
 * LS terms and how often each occurs, read off a grid by the difference formula
 * N(L, S) = n(L, S) − n(L+1, S) − n(L, S+1) + n(L+1, S+1), n being the grid count at
 * M_L = L, M_S = S (Condon & Shortley 1935, ch. 7, the method of diagonal sums; Cowan 1981, the same counting).
 * Sorted by 2S+1, then L, ascending. Used by the State grid to show the term decomposition.
 * @example decomposeGrid(subshellGrid(1, 2)) // 1S, 1D, 3P, each count 1n
 */
export function decomposeGrid(grid: MicrostateGrid): TermCount[] {
	const out: TermCount[] = [];
	const start = grid.maxTwoMS % 2;
	for (let twoS = start; twoS <= grid.maxTwoMS; twoS += 2) {
		for (let L = 0; L <= grid.maxML; L++) {
			const c = countAt(grid, L, twoS) - countAt(grid, L + 1, twoS) - countAt(grid, L, twoS + 2) + countAt(grid, L + 1, twoS + 2);
			if (c < 0n) throw new Error(`internal error: negative term count for 2S = ${twoS}, L = ${L}`);
			if (c > 0n) out.push({ twoS, L, count: c });
		}
	}
	return out;
}

/**
 * Number of microstates for each 2M_J = 2M_L + 2M_S, as a map from 2M_J to count (ascending).
 * @example mjCounts(subshellGrid(0, 1)).get(1) // 1n
 */
export function mjCounts(grid: MicrostateGrid): Map<number, bigint> {
	const tally = new Map<number, bigint>();
	for (let ML = grid.minML; ML <= grid.maxML; ML++) {
		const row = grid.counts[ML - grid.minML];
		for (let j = 0; j < row.length; j++) {
			if (row[j] === 0n) continue;
			const twoMJ = 2 * ML + (2 * j - grid.maxTwoMS);
			tally.set(twoMJ, (tally.get(twoMJ) ?? 0n) + row[j]);
		}
	}
	return new Map([...tally.entries()].sort((a, b) => a[0] - b[0]));
}
