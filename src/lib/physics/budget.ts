/**
 * Work and output budgets of the term engine.
 *
 * Every engine entry point that can grow with its input checks the input against a budget
 * *before* it starts working, from closed-form estimates computed from the subshells alone
 * (sizes of the (M_L, M_S) grids, their convolutions and the tables that come out). Over the
 * budget it throws `BudgetError` (a RangeError, so the API answers 400) with a message that
 * states the estimate, the limit and what to change. The estimates are upper bounds of the
 * loops the engine runs; the limits are engineering choices (common practice, no source),
 * chosen so that the configurations of atomic spectroscopy (up to e.g. 4f7 5g5 6h5 7i3 6d3 7p,
 * about 10¹⁸ microstates) stay far inside them while one request cannot take the server's
 * memory or seconds of CPU.
 */
import type { Subshell } from './types';
import { openSubshells, subshellCapacity } from './parse';

/** A computation refused before it started because it would exceed a stated limit. */
export class BudgetError extends RangeError {
	/** The estimate of the refused computation, in the limit's unit. */
	readonly estimate: number;
	/** The limit it was checked against. */
	readonly limit: number;
	constructor(message: string, estimate: number, limit: number) {
		super(message);
		this.name = 'BudgetError';
		this.estimate = estimate;
		this.limit = limit;
	}
}

/**
 * Budget for the counting work of one configuration, in multiply-adds of floating-point counts
 * (a BigInt multiply-add is charged BIGINT_COST_FACTOR): the per-subshell grids, their
 * convolution and, for one open subshell, the grids behind its seniorities. About a second of
 * CPU at the very limit; the configurations of atomic spectroscopy need far less (4f7 5d3 6p3 5g2: about 10⁵).
 */
export const MAX_GRID_WORK = 4e8;
/** Rough cost of a BigInt multiply-add relative to a float one (measured on V8, order of magnitude). */
export const BIGINT_COST_FACTOR = 25;
/** Most (M_L, M_S) cells a grid may have (output of the State grid; 16v33 has 18 530). */
export const MAX_GRID_CELLS = 40_000;
/**
 * Most J-level rows a Term sheet may have (one row per J of each distinct term, repeats counted
 * once), as bounded before the work from the grid's extent. 4f7 5g5 6h5 7i3 6d3 7p has 9 329.
 */
export const MAX_SHEET_LEVEL_ROWS = 15_000;
/**
 * Most single levels (every J of every occurrence of every term) a Shelf entry may have: its
 * page and exports list each one for notes. [Xe] 4f7 5d 6s 6p has 36 262.
 */
export const MAX_ENTRY_LEVELS = 50_000;

const fmt = (x: number) => (x < 1e6 ? String(Math.round(x)) : x.toExponential(1));

/** Largest M_L of l^N (the N largest values of {l, l, l−1, l−1, …}); the same sum as `maxMLOf` in ./microstates. */
function maxML(l: number, N: number): number {
	let sum = 0;
	for (let i = 0; i < N; i++) sum += l - Math.floor(i / 2);
	return sum;
}

/** Length of the Gaussian-binomial row of k-subsets of {−l … l}: 2·(k·l − k(k−1)/2) + 1. */
function rowLength(l: number, k: number): number {
	return 2 * (k * l - (k * (k - 1)) / 2) + 1;
}

/** Multiply-adds (BigInt, charged) to build the grid of one subshell l^N in ./microstates. */
export function subshellGridWork(l: number, N: number): number {
	const half = 2 * l + 1;
	let work = 0;
	for (let a = Math.max(0, N - half); a <= Math.min(N, half); a++) work += rowLength(l, a) * rowLength(l, N - a);
	return work * BIGINT_COST_FACTOR;
}

/** Extent of a grid: M_L runs over ±maxML, 2M_S over ±maxTwoMS. */
export interface GridExtent {
	maxML: number;
	maxTwoMS: number;
}

/** The extent of the (M_L, M_S) grid of a list of subshells, without building it. */
export function gridExtent(subshells: readonly Subshell[]): GridExtent {
	let ml = 0;
	let ms = 0;
	for (const s of openSubshells(subshells)) {
		ml += maxML(s.l, s.occupancy);
		ms += Math.min(s.occupancy, subshellCapacity(s.l) - s.occupancy);
	}
	return { maxML: ml, maxTwoMS: ms };
}

/**
 * Estimated work of counting a configuration's microstates by (M_L, M_S): per-subshell grids
 * plus the quadrant convolutions (smaller grids first, as ./microstates does them), in the
 * unit of MAX_GRID_WORK. `exactInFloat` is false when the total exceeds 2^53 (BigInt path).
 */
export function gridWork(subshells: readonly Subshell[], exactInFloat: boolean): number {
	const open = openSubshells(subshells);
	if (open.length === 0) return 0;
	let build = 0;
	const sizes = open
		.map((s) => {
			build += subshellGridWork(s.l, s.occupancy);
			const e = gridExtent([s]);
			return { ...e, cells: (2 * e.maxML + 1) * (e.maxTwoMS + 1) };
		})
		.sort((x, y) => x.cells - y.cells);
	let work = 0;
	let accML = sizes[0].maxML;
	let accMS = sizes[0].maxTwoMS;
	for (let k = 1; k < sizes.length; k++) {
		work += ((2 * accML + 1) * (accMS + 1) * sizes[k].cells) / 4;
		accML += sizes[k].maxML;
		accMS += sizes[k].maxTwoMS;
	}
	return build + (exactInFloat ? work : work * BIGINT_COST_FACTOR);
}

/** Work of the seniority table of l^N (Racah): one subshell grid for each v = N′, N′−2, … ≥ 0. */
export function seniorityWork(l: number, N: number): number {
	const top = Math.min(N, subshellCapacity(l) - N);
	let work = 0;
	for (let v = top % 2; v <= top; v += 2) work += subshellGridWork(l, v);
	return work;
}

/**
 * Upper bound of the J-level rows of a Term sheet (one row per J of each distinct term) from
 * the grid's extent: every (S, L) with 2S ≤ maxTwoMS (same parity) and L ≤ maxML, each with
 * min(2S, 2L) + 1 values of J.
 */
export function sheetLevelRowsBound(extent: GridExtent): number {
	let rows = 0;
	for (let twoS = extent.maxTwoMS % 2; twoS <= extent.maxTwoMS; twoS += 2) {
		for (let L = 0; L <= extent.maxML; L++) rows += Math.min(twoS, 2 * L) + 1;
	}
	return rows;
}

/** Cells of the (M_L, M_S) grid of this extent. */
export function gridCells(extent: GridExtent): number {
	return (2 * extent.maxML + 1) * (extent.maxTwoMS + 1);
}

/** Throws BudgetError when `estimate` is over `limit`; `what` names the quantity, `unit` its unit. */
export function checkBudget(what: string, estimate: number, limit: number, advice: string): void {
	if (estimate > limit) {
		throw new BudgetError(`${what} is about ${fmt(estimate)}, over the limit of ${fmt(limit)}; ${advice}`, estimate, limit);
	}
}

const SMALLER = 'use fewer or less-filled open subshells, or subshells of lower l';

/**
 * Checks that counting the microstates of `subshells` by (M_L, M_S) stays within MAX_GRID_WORK
 * and MAX_GRID_CELLS. Throws BudgetError with the estimate and the limit otherwise.
 * @example checkGridBudget(parseConfiguration('3d5 4s').subshells) // passes
 */
export function checkGridBudget(subshells: readonly Subshell[], exactInFloat: boolean): void {
	checkBudget('the counting work of this configuration (operations)', gridWork(subshells, exactInFloat), MAX_GRID_WORK, SMALLER);
	checkBudget('the (M_L, M_S) grid of this configuration (cells)', gridCells(gridExtent(subshells)), MAX_GRID_CELLS, SMALLER);
}

/**
 * Checks the seniority table of l^N against MAX_GRID_WORK. Throws BudgetError otherwise.
 * @example checkSeniorityBudget(3, 7) // passes
 */
export function checkSeniorityBudget(l: number, N: number): void {
	checkBudget(`the seniority work of l = ${l}, N = ${N} (operations)`, seniorityWork(l, N), MAX_GRID_WORK, SMALLER);
}

/**
 * Checks a whole Term sheet before it is computed: the grid budget, the seniority budget when
 * one subshell is open, and the bound on its J-level rows (MAX_SHEET_LEVEL_ROWS).
 * Throws BudgetError naming the limit that is exceeded.
 * @example checkTermSheetBudget(parseConfiguration('12o23').subshells) // throws: … level rows … over the limit of 15000
 */
export function checkTermSheetBudget(subshells: readonly Subshell[], exactInFloat: boolean): void {
	checkGridBudget(subshells, exactInFloat);
	const open = openSubshells(subshells);
	if (open.length === 1) checkSeniorityBudget(open[0].l, open[0].occupancy);
	checkBudget(
		'the Term sheet of this configuration (J-level rows, bound)',
		sheetLevelRowsBound(gridExtent(subshells)),
		MAX_SHEET_LEVEL_ROWS,
		SMALLER
	);
}
