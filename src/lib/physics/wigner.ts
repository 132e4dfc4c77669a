/**
 * Wigner 3j, 6j and 9j symbols and Clebsch–Gordan coefficients, exact.
 *
 * Every angular momentum and projection is passed as twice its value (tj = 2j,
 * tm = 2m), so all arguments are integers. Results are `ExactSqrt`
 * (sign × sqrt(p/q)); the *Float variants convert that to a double.
 * Phase conventions are those of Condon & Shortley (1935) and Edmonds (1957).
 */

import {
	EXACT_ZERO,
	exactScale,
	exactSqrt,
	exactToNumber,
	factorial,
	rational,
	rationalAdd,
	rationalMultiply,
	type ExactSqrt,
	type Rational
} from './exact';
import { halfString } from './half';
import { BudgetError } from './budget';

// ---------------------------------------------------------------- validation

/**
 * Work budget of the exact symbols: every j is at most MAX_J_SYMBOL (9j: MAX_J_9J), checked
 * before any factorial is formed (the BigInt factorials grow with j; see ./budget.ts).
 */
function checkJ(where: string, name: string, tj: number): void {
	if (!Number.isInteger(tj) || tj < 0) {
		throw new RangeError(`${where}: ${name} must be given as twice its value, a non-negative integer (j = 0, 1/2, 1, …), got ${tj}`);
	}
	const max = where === 'wigner9j' ? MAX_J_9J : MAX_J_SYMBOL;
	if (tj > 2 * max) {
		throw new BudgetError(`${where}: ${name} = ${halfString(tj)} is over the limit of j = ${max} for exact evaluation`, tj / 2, max);
	}
}

function checkM(where: string, mName: string, tm: number, jName: string, tj: number): void {
	if (!Number.isInteger(tm)) {
		throw new RangeError(`${where}: ${mName} must be given as twice its value, an integer, got ${tm}`);
	}
	if (Math.abs(tm) > tj) {
		throw new RangeError(
			`${where}: |${mName}| = ${halfString(Math.abs(tm))} exceeds ${jName} = ${halfString(tj)}; allowed ${mName} = -${jName} … ${jName}`
		);
	}
	if ((tj + tm) % 2 !== 0) {
		throw new RangeError(
			`${where}: ${jName} + ${mName} = ${halfString(tj)} + ${halfString(tm)} is not an integer; ${mName} must step from -${jName} to ${jName} in whole units`
		);
	}
}

/** Checks each (j, m) pair of a coupling: j first, then its m (names as the caller's formula writes them). */
function checkPairs(where: string, pairs: [jName: string, tj: number, mName: string, tm: number][]): void {
	for (const [jName, tj] of pairs) checkJ(where, jName, tj);
	for (const [jName, tj, mName, tm] of pairs) checkM(where, mName, tm, jName, tj);
}

/**
 * True when (a, b, c), given doubled, form a triad: |a − b| ≤ c ≤ a + b with a + b + c an integer
 * (the triangle condition, Edmonds 1957 §3.7 and §6.2). Never throws.
 * @example isTriad(1, 1, 2) // true: (1/2, 1/2, 1)
 */
export function isTriad(ta: number, tb: number, tc: number): boolean {
	return tc <= ta + tb && tc >= Math.abs(ta - tb) && (ta + tb + tc) % 2 === 0;
}

function minusOnePower(e: number): 1 | -1 {
	return ((e % 2) + 2) % 2 === 0 ? 1 : -1;
}

// ------------------------------------------------------------ exact kernels

/**
 * Δ(abc)² = (a+b−c)!(a−b+c)!(−a+b+c)!/(a+b+c+1)! (Edmonds 1957, eq. 6.3.7 notation),
 * arguments doubled, triad assumed valid.
 */
function triangleSquared(ta: number, tb: number, tc: number): Rational {
	return rational(
		factorial((ta + tb - tc) / 2) * factorial((ta - tb + tc) / 2) * factorial((-ta + tb + tc) / 2),
		factorial((ta + tb + tc) / 2 + 1)
	);
}

interface FactorialTerm {
	negative: boolean;
	num: bigint;
	/** The term is ±num / ∏ den[i]!; every term has the same number of factorials. */
	den: number[];
}

/**
 * Σ ±num/∏(den[i]!) as one reduced rational, over the common denominator
 * ∏ (max over terms of den[i])! so that no gcd is taken inside the loop.
 */
function factorialSum(terms: FactorialTerm[]): Rational {
	if (terms.length === 0) return { num: 0n, den: 1n };
	const width = terms[0].den.length;
	const top = new Array<number>(width).fill(0);
	for (const t of terms) for (let i = 0; i < width; i++) top[i] = Math.max(top[i], t.den[i]);
	let common = 1n;
	for (let i = 0; i < width; i++) common *= factorial(top[i]);
	let total = 0n;
	for (const t of terms) {
		let v = t.num;
		for (let i = 0; i < width; i++) if (t.den[i] !== top[i]) v *= factorial(top[i]) / factorial(t.den[i]);
		total += t.negative ? -v : v;
	}
	return rational(total, common);
}

/**
 * The Racah sum of the 6j symbol (Edmonds 1957, eq. 6.3.7; Racah 1942, eq. 36), without the Δ prefactor:
 * Σ_t (−1)^t (t+1)! / [(t−a₁)!(t−a₂)!(t−a₃)!(t−a₄)!(b₁−t)!(b₂−t)!(b₃−t)!].
 * Arguments doubled; the four triads are assumed valid.
 */
function sixJSum(t1: number, t2: number, t3: number, t4: number, t5: number, t6: number): Rational {
	const a = [(t1 + t2 + t3) / 2, (t1 + t5 + t6) / 2, (t4 + t2 + t6) / 2, (t4 + t5 + t3) / 2];
	const b = [(t1 + t2 + t4 + t5) / 2, (t2 + t3 + t5 + t6) / 2, (t3 + t1 + t6 + t4) / 2];
	const terms: FactorialTerm[] = [];
	for (let t = Math.max(...a); t <= Math.min(...b); t++) {
		terms.push({
			negative: t % 2 === 1,
			num: factorial(t + 1),
			den: [t - a[0], t - a[1], t - a[2], t - a[3], b[0] - t, b[1] - t, b[2] - t]
		});
	}
	return factorialSum(terms);
}

function sixJTriadsHold(t1: number, t2: number, t3: number, t4: number, t5: number, t6: number): boolean {
	return isTriad(t1, t2, t3) && isTriad(t1, t5, t6) && isTriad(t4, t2, t6) && isTriad(t4, t5, t3);
}

// ---------------------------------------------------------------- 3j and CG

/**
 * Wigner 3j symbol (j1 j2 j3; m1 m2 m3), exact, arguments doubled.
 *
 * Racah's formula as printed in Edmonds (1957) eq. 3.7.3 (Racah 1942, eq. 16′):
 * (−1)^{j1−j2−m3} Δ(j1j2j3) [(j1+m1)!(j1−m1)!(j2+m2)!(j2−m2)!(j3+m3)!(j3−m3)!]^{1/2}
 * × Σ_k (−1)^k / [k!(j3−j2+k+m1)!(j3−j1+k−m2)!(j1+j2−j3−k)!(j1−k−m1)!(j2−k+m2)!].
 * Zero when m1+m2+m3 ≠ 0 or the triangle rule fails.
 *
 * Throws RangeError when a j is not a non-negative integer (doubled), an m is not
 * an integer, |m| > j, or j + m is not an integer.
 * @example wigner3j(2, 2, 0, 2, -2, 0) // (1 1 0; 1 −1 0) = +sqrt(1/3)
 */
export function wigner3j(tj1: number, tj2: number, tj3: number, tm1: number, tm2: number, tm3: number): ExactSqrt {
	checkPairs('wigner3j', [
		['j1', tj1, 'm1', tm1],
		['j2', tj2, 'm2', tm2],
		['j3', tj3, 'm3', tm3]
	]);
	if (tm1 + tm2 + tm3 !== 0 || !isTriad(tj1, tj2, tj3)) return EXACT_ZERO;

	const delta = triangleSquared(tj1, tj2, tj3);
	const radicand =
		factorial((tj1 + tm1) / 2) *
		factorial((tj1 - tm1) / 2) *
		factorial((tj2 + tm2) / 2) *
		factorial((tj2 - tm2) / 2) *
		factorial((tj3 + tm3) / 2) *
		factorial((tj3 - tm3) / 2);

	const a = (tj3 - tj2 + tm1) / 2;
	const b = (tj3 - tj1 - tm2) / 2;
	const c = (tj1 + tj2 - tj3) / 2;
	const d = (tj1 - tm1) / 2;
	const e = (tj2 + tm2) / 2;
	const terms: FactorialTerm[] = [];
	for (let k = Math.max(0, -a, -b); k <= Math.min(c, d, e); k++) {
		terms.push({ negative: k % 2 === 1, num: 1n, den: [k, a + k, b + k, c - k, d - k, e - k] });
	}
	const sum = factorialSum(terms);
	const phase = minusOnePower((tj1 - tj2 - tm3) / 2);
	return exactScale(exactSqrt(phase, delta.num * radicand, delta.den), sum);
}

/**
 * Clebsch–Gordan coefficient ⟨j1 m1 j2 m2 | J M⟩, exact, arguments doubled, Condon–Shortley phase.
 *
 * Edmonds (1957) eq. 3.7.1: ⟨j1 m1 j2 m2|J M⟩ = (−1)^{j1−j2+M} (2J+1)^{1/2} (j1 j2 J; m1 m2 −M).
 * Zero when m1 + m2 ≠ M or (j1, j2, J) is not a triad.
 *
 * Throws RangeError on the same input faults as `wigner3j` (naming j1, m1, j2, m2, J or M).
 * @example clebschGordan(2, 0, 1, 1, 3, 1) // ⟨1 0, 1/2 1/2 | 3/2 1/2⟩ = +sqrt(2/3)
 */
export function clebschGordan(tj1: number, tm1: number, tj2: number, tm2: number, tJ: number, tM: number): ExactSqrt {
	checkPairs('clebschGordan', [
		['j1', tj1, 'm1', tm1],
		['j2', tj2, 'm2', tm2],
		['J', tJ, 'M', tM]
	]);
	if (tm1 + tm2 !== tM || !isTriad(tj1, tj2, tJ)) return EXACT_ZERO;
	const threeJ = wigner3j(tj1, tj2, tJ, tm1, tm2, -tM);
	const phase = minusOnePower((tj1 - tj2 + tM) / 2);
	return exactSqrt(phase * threeJ.sign, threeJ.num * BigInt(tJ + 1), threeJ.den);
}

// ----------------------------------------------------------------------- 6j

/**
 * Wigner 6j symbol {j1 j2 j3; j4 j5 j6}, exact, arguments doubled.
 *
 * Racah's formula, Edmonds (1957) eq. 6.3.7 (Racah 1942, eq. 36):
 * Δ(j1j2j3)Δ(j1j5j6)Δ(j4j2j6)Δ(j4j5j3) Σ_t (−1)^t (t+1)! / [(t−j1−j2−j3)!(t−j1−j5−j6)!
 * (t−j4−j2−j6)!(t−j4−j5−j3)!(j1+j2+j4+j5−t)!(j2+j3+j5+j6−t)!(j3+j1+j6+j4−t)!].
 * Zero unless (j1 j2 j3), (j1 j5 j6), (j4 j2 j6), (j4 j5 j3) are all triads.
 *
 * Throws RangeError when an argument is not a non-negative integer (twice a j).
 * @example wigner6j(2, 2, 2, 2, 2, 2) // {1 1 1; 1 1 1} = +1/6
 */
export function wigner6j(tj1: number, tj2: number, tj3: number, tj4: number, tj5: number, tj6: number): ExactSqrt {
	const where = 'wigner6j';
	[tj1, tj2, tj3, tj4, tj5, tj6].forEach((t, i) => checkJ(where, `j${i + 1}`, t));
	if (!sixJTriadsHold(tj1, tj2, tj3, tj4, tj5, tj6)) return EXACT_ZERO;
	const deltas = [
		triangleSquared(tj1, tj2, tj3),
		triangleSquared(tj1, tj5, tj6),
		triangleSquared(tj4, tj2, tj6),
		triangleSquared(tj4, tj5, tj3)
	].reduce(rationalMultiply);
	return exactScale(exactSqrt(1, deltas.num, deltas.den), sixJSum(tj1, tj2, tj3, tj4, tj5, tj6));
}

// ----------------------------------------------------------------------- 9j

/**
 * Wigner 9j symbol {j1 j2 j3; j4 j5 j6; j7 j8 j9} (rows in order), exact, arguments doubled.
 *
 * Edmonds (1957) eq. 6.4.3: Σ_x (−1)^{2x}(2x+1) {j1 j4 j7; j8 j9 x}{j2 j5 j8; j4 x j6}{j3 j6 j9; x j1 j2}.
 * Writing each 6j as Δ-prefactor × Racah sum (eq. 6.3.7), the twelve triangle factors of a
 * product are the six triads of the 9j (rows and columns) once each, plus (j1 j9 x),
 * (j8 j4 x) and (j2 x j6) twice each. So the symbol is
 * [∏ rows, columns Δ²]^{1/2} × Σ_x (−1)^{2x}(2x+1) Δ²(j1j9x)Δ²(j8j4x)Δ²(j2xj6) S₁S₂S₃,
 * a square root of one rational times a rational sum, and is evaluated exactly.
 * Zero unless every row and column is a triad.
 *
 * Throws RangeError when an argument is not a non-negative integer (twice a j).
 * @example wigner9j(1, 1, 2, 1, 1, 2, 2, 2, 4) // {1/2 1/2 1; 1/2 1/2 1; 1 1 2} = +1/9
 */
export function wigner9j(
	tj1: number,
	tj2: number,
	tj3: number,
	tj4: number,
	tj5: number,
	tj6: number,
	tj7: number,
	tj8: number,
	tj9: number
): ExactSqrt {
	const where = 'wigner9j';
	[tj1, tj2, tj3, tj4, tj5, tj6, tj7, tj8, tj9].forEach((t, i) => checkJ(where, `j${i + 1}`, t));
	const triads: [number, number, number][] = [
		[tj1, tj2, tj3],
		[tj4, tj5, tj6],
		[tj7, tj8, tj9],
		[tj1, tj4, tj7],
		[tj2, tj5, tj8],
		[tj3, tj6, tj9]
	];
	if (!triads.every(([a, b, c]) => isTriad(a, b, c))) return EXACT_ZERO;
	const common = triads.map(([a, b, c]) => triangleSquared(a, b, c)).reduce(rationalMultiply);

	const lo = Math.max(Math.abs(tj1 - tj9), Math.abs(tj4 - tj8), Math.abs(tj2 - tj6));
	const hi = Math.min(tj1 + tj9, tj4 + tj8, tj2 + tj6);
	let total: Rational = { num: 0n, den: 1n };
	for (let tx = lo; tx <= hi; tx++) {
		if (!isTriad(tj1, tj9, tx) || !isTriad(tj8, tj4, tx) || !isTriad(tj2, tx, tj6)) continue;
		const xDeltas = rationalMultiply(
			rationalMultiply(triangleSquared(tj1, tj9, tx), triangleSquared(tj8, tj4, tx)),
			triangleSquared(tj2, tx, tj6)
		);
		const sums = [sixJSum(tj1, tj4, tj7, tj8, tj9, tx), sixJSum(tj2, tj5, tj8, tj4, tx, tj6), sixJSum(tj3, tj6, tj9, tx, tj1, tj2)].reduce(
			rationalMultiply
		);
		const weight = rational(BigInt(minusOnePower(tx) * (tx + 1)), 1n);
		total = rationalAdd(total, rationalMultiply(weight, rationalMultiply(xDeltas, sums)));
	}
	return exactScale(exactSqrt(1, common.num, common.den), total);
}

// -------------------------------------------------------------- float forms

/** `wigner3j` as a double (exactToNumber of the exact value). Throws as `wigner3j`. @example wigner3jFloat(2, 2, 0, 2, -2, 0) // 0.5773502691896257 */
export function wigner3jFloat(tj1: number, tj2: number, tj3: number, tm1: number, tm2: number, tm3: number): number {
	return exactToNumber(wigner3j(tj1, tj2, tj3, tm1, tm2, tm3));
}

/** `clebschGordan` as a double. Throws as `clebschGordan`. @example clebschGordanFloat(1, 1, 1, -1, 2, 0) // 0.7071067811865476 */
export function clebschGordanFloat(tj1: number, tm1: number, tj2: number, tm2: number, tJ: number, tM: number): number {
	return exactToNumber(clebschGordan(tj1, tm1, tj2, tm2, tJ, tM));
}

/** `wigner6j` as a double. Throws as `wigner6j`. @example wigner6jFloat(2, 2, 2, 2, 2, 2) // 0.16666666666666666 */
export function wigner6jFloat(tj1: number, tj2: number, tj3: number, tj4: number, tj5: number, tj6: number): number {
	return exactToNumber(wigner6j(tj1, tj2, tj3, tj4, tj5, tj6));
}

/** `wigner9j` as a double. Throws as `wigner9j`. @example wigner9jFloat(1, 1, 2, 1, 1, 2, 2, 2, 4) // 0.1111111111111111 */
export function wigner9jFloat(...args: Parameters<typeof wigner9j>): number {
	return exactToNumber(wigner9j(...args));
}

// ------------------------------------------------------------- limits

/** Largest j (not doubled) of the exact 3j, 6j and CG functions (their work budget). */
export const MAX_J_SYMBOL = 200;
/** Largest j (not doubled) of the exact 9j (a sum of 6j products, so costlier). */
export const MAX_J_9J = 50;
