/**
 * Coupled ↔ uncoupled basis tables for two angular momenta j1 ⊗ j2.
 *
 * |J M⟩ = Σ_{m1,m2} ⟨j1 m1 j2 m2|J M⟩ |m1 m2⟩ and, the transformation being real orthogonal,
 * |m1 m2⟩ = Σ_{J} ⟨j1 m1 j2 m2|J M⟩ |J M⟩ with M = m1 + m2 (Edmonds 1957 eqs. 3.5.1–3.5.2;
 * Condon & Shortley 1935 ch. 3). All angular momenta are doubled (twoJ, tm1, …).
 */

import { clebschGordan } from './wigner';
import { halfString } from './half';
import type { ExactSqrt } from './exact';

/** Largest j1 or j2 (not doubled) accepted by `couplingTable`: 10, i.e. at most 441 product states. */
export const MAX_J_COUPLING_TABLE = 10;

/** One term of a coupled state in the product basis: coefficient × |m1 m2⟩. */
export interface UncoupledComponent {
	tm1: number;
	tm2: number;
	coefficient: ExactSqrt;
}

/** A coupled state |J M⟩ written in the product basis (only non-zero coefficients). */
export interface CoupledRow {
	twoJ: number;
	twoM: number;
	components: UncoupledComponent[];
}

/** One term of a product state in the coupled basis: coefficient × |J M⟩. */
export interface CoupledComponent {
	twoJ: number;
	twoM: number;
	coefficient: ExactSqrt;
}

/** A product state |m1 m2⟩ written in the coupled basis (only non-zero coefficients). */
export interface UncoupledRow {
	tm1: number;
	tm2: number;
	components: CoupledComponent[];
}

/** Both directions of the j1 ⊗ j2 transformation. */
export interface CouplingTable {
	tj1: number;
	tj2: number;
	/** Coupled states, J descending then M descending; components m1 descending. */
	rows: CoupledRow[];
	/** Product states, m1 descending then m2 descending; components J descending. */
	inverse: UncoupledRow[];
}

function checkTwiceJ(name: string, tj: number): void {
	if (!Number.isInteger(tj) || tj < 0 || tj > 2 * MAX_J_COUPLING_TABLE) {
		throw new RangeError(
			`couplingTable: ${name} must be given as twice its value, an integer from 0 to ${2 * MAX_J_COUPLING_TABLE} (j from 0 to ${MAX_J_COUPLING_TABLE}), got ${tj}`
		);
	}
}

/**
 * The Clebsch–Gordan table of j1 ⊗ j2 in both directions, exact, Condon–Shortley phase
 * (coefficients from `clebschGordan`, Edmonds 1957 eq. 3.7.1).
 *
 * Throws RangeError when tj1 or tj2 is not an integer from 0 to 2·MAX_J_COUPLING_TABLE.
 * @example couplingTable(2, 1).rows[1]
 *   // |3/2 1/2⟩ = sqrt(1/3)|1, −1/2⟩ + sqrt(2/3)|0, 1/2⟩:
 *   // { twoJ: 3, twoM: 1, components: [{ tm1: 2, tm2: -1, coefficient: √(1/3) }, { tm1: 0, tm2: 1, coefficient: √(2/3) }] }
 */
export function couplingTable(tj1: number, tj2: number): CouplingTable {
	checkTwiceJ('j1', tj1);
	checkTwiceJ('j2', tj2);
	const rows: CoupledRow[] = [];
	for (let tJ = tj1 + tj2; tJ >= Math.abs(tj1 - tj2); tJ -= 2) {
		for (let tM = tJ; tM >= -tJ; tM -= 2) {
			const components: UncoupledComponent[] = [];
			for (let tm1 = tj1; tm1 >= -tj1; tm1 -= 2) {
				const tm2 = tM - tm1;
				if (Math.abs(tm2) > tj2) continue;
				const coefficient = clebschGordan(tj1, tm1, tj2, tm2, tJ, tM);
				if (coefficient.sign !== 0) components.push({ tm1, tm2, coefficient });
			}
			rows.push({ twoJ: tJ, twoM: tM, components });
		}
	}
	const inverse: UncoupledRow[] = [];
	for (let tm1 = tj1; tm1 >= -tj1; tm1 -= 2) {
		for (let tm2 = tj2; tm2 >= -tj2; tm2 -= 2) {
			const tM = tm1 + tm2;
			const components: CoupledComponent[] = [];
			for (let tJ = tj1 + tj2; tJ >= Math.abs(tj1 - tj2); tJ -= 2) {
				if (Math.abs(tM) > tJ) continue;
				const coefficient = clebschGordan(tj1, tm1, tj2, tm2, tJ, tM);
				if (coefficient.sign !== 0) components.push({ twoJ: tJ, twoM: tM, coefficient });
			}
			inverse.push({ tm1, tm2, components });
		}
	}
	return { tj1, tj2, rows, inverse };
}

/**
 * A ket label for display: "|3/2, 1/2⟩" from doubled values.
 * @example ketLabel(3, 1) // "|3/2, 1/2⟩"
 */
export function ketLabel(twoA: number, twoB: number): string {
	return `|${halfString(twoA)}, ${halfString(twoB)}⟩`;
}
