/**
 * Landé g-factor of an LS level.
 *
 * With the orbital g-factor g_L = 1 and the spin g-factor g_s, the vector model gives
 *   g_J = g_L [J(J+1) − S(S+1) + L(L+1)] / [2J(J+1)] + g_s [J(J+1) + S(S+1) − L(L+1)] / [2J(J+1)],
 * which for g_s = 2 is the familiar g_J = 1 + [J(J+1) + S(S+1) − L(L+1)] / [2J(J+1)]
 * (Landé 1923; Condon & Shortley 1935, chapter on the Zeeman effect; Cowan 1981, chapter on
 * the Zeeman effect; Bethe & Salpeter 1957). With g_s = 2 the result is an exact rational.
 */
import Fraction from 'fraction.js';
import { halfString } from './half';

/**
 * Magnitude of the free-electron g-factor, CODATA 2018: g_e = −2.002 319 304 362 56(35)
 * (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021).
 */
export const GS_FREE_ELECTRON = 2.00231930436256;

/** Why `landeG` returns null for J = 0. */
export const LANDE_J0_NOTE =
	'g_J is undefined for J = 0: the level has a single state with no magnetic moment, so it does not split in a magnetic field (tables leave g blank or write 0).';

/** Options of `landeG`: the spin g-factor, exactly 2 (default, exact Fraction) or a number (float result). */
export interface LandeOptions {
	gs?: number | 'exact2';
}

function checkLevel(twoS: number, L: number, twoJ: number): void {
	if (!Number.isInteger(twoS) || twoS < 0) throw new RangeError(`twoS = ${twoS} is not allowed: 2S must be a non-negative integer`);
	if (!Number.isInteger(L) || L < 0) throw new RangeError(`L = ${L} is not allowed: L must be a non-negative integer`);
	if (!Number.isInteger(twoJ) || twoJ < 0) throw new RangeError(`twoJ = ${twoJ} is not allowed: 2J must be a non-negative integer`);
	const lo = Math.abs(2 * L - twoS);
	const hi = 2 * L + twoS;
	if (twoJ < lo || twoJ > hi || (twoJ - lo) % 2 !== 0) {
		throw new RangeError(
			`J = ${halfString(twoJ)} is not a level of S = ${halfString(twoS)}, L = ${L}: J must run from |L−S| = ${halfString(lo)} to L+S = ${halfString(hi)} in steps of 1`
		);
	}
}

/**
 * Landé g_J of the level ^{2S+1}L_J (S and J given as twice their value).
 * Default and `gs: 'exact2'`: g_s = 2, exact Fraction g_J = 1 + [J(J+1) + S(S+1) − L(L+1)] / [2J(J+1)].
 * `gs: number` (e.g. GS_FREE_ELECTRON): the general formula with g_L = 1, as a float.
 * Source: Landé (1923); Condon & Shortley (1935) and Cowan (1981), chapters on the Zeeman effect.
 * Returns null for J = 0 (see LANDE_J0_NOTE). Throws RangeError when J is not one of the levels
 * |L−S| … L+S of the term, or an argument is negative or not an integer, or gs is not finite.
 * @example fractionString(landeG(1, 1, 3)!) // '4/3' (²P_{3/2})
 */
export function landeG(twoS: number, L: number, twoJ: number): Fraction | null;
export function landeG(twoS: number, L: number, twoJ: number, options: { gs?: 'exact2' }): Fraction | null;
export function landeG(twoS: number, L: number, twoJ: number, options: { gs: number }): number | null;
export function landeG(twoS: number, L: number, twoJ: number, options?: LandeOptions): Fraction | number | null;
export function landeG(twoS: number, L: number, twoJ: number, options: LandeOptions = {}): Fraction | number | null {
	checkLevel(twoS, L, twoJ);
	if (twoJ === 0) return null;
	// In quarters: 4J(J+1) = twoJ(twoJ+2), 4S(S+1) = twoS(twoS+2), 4L(L+1).
	const jj = twoJ * (twoJ + 2);
	const ss = twoS * (twoS + 2);
	const ll = 4 * L * (L + 1);
	const gs = options.gs ?? 'exact2';
	if (gs === 'exact2') return new Fraction(jj + ss - ll, 2 * jj).add(1);
	if (typeof gs !== 'number' || !Number.isFinite(gs))
		throw new RangeError(`gs = ${String(gs)} is not allowed: give a finite number or 'exact2'`);
	return (jj - ss + ll) / (2 * jj) + (gs * (jj + ss - ll)) / (2 * jj);
}

/**
 * Effective magneton number p = g_J √(J(J+1)) of a level with g_s = 2 (0 for J = 0), the
 * quantity tabulated for paramagnetic ions (Kittel, Introduction to Solid State Physics,
 * chapter on paramagnetism; Ashcroft & Mermin 1976, ch. 31). Throws like `landeG`.
 * @example effectiveMagnetonNumber(7, 0, 7) // 7.937… (Gd³⁺ ⁸S_{7/2})
 */
export function effectiveMagnetonNumber(twoS: number, L: number, twoJ: number): number {
	const g = landeG(twoS, L, twoJ);
	if (g === null) return 0;
	return g.valueOf() * Math.sqrt((twoJ * (twoJ + 2)) / 4);
}

/**
 * A fraction as text: "3/2", "2", "-1/2", "0".
 * @example fractionString(new Fraction(-1, 2)) // '-1/2'
 */
export function fractionString(f: Fraction): string {
	const sign = f.s < 0n && f.n !== 0n ? '-' : '';
	return f.d === 1n ? `${sign}${f.n}` : `${sign}${f.n}/${f.d}`;
}

/** g_J written exactly with the spin g-factor as a symbol: g_J = constant + gsCoefficient · g_s. */
export interface GsForm {
	/** [J(J+1) − S(S+1) + L(L+1)] / [2J(J+1)], the orbital part (g_L = 1), e.g. "1/3". */
	constant: string;
	/** [J(J+1) + S(S+1) − L(L+1)] / [2J(J+1)], the factor of g_s, e.g. "2/3". */
	gsCoefficient: string;
}

/**
 * The exact form of g_J for any g_s, from its g_s = 2 value g: the general Landé formula (module
 * comment) is a + b·g_s with a + b = 1, and g = a + 2b, so b = g − 1 and a = 2 − g. It matches the
 * decimal computed with g_s = GS_FREE_ELECTRON. Throws (fraction.js) when `g2` is not a fraction.
 * @example landeGsForm('4/3') // { constant: '2/3', gsCoefficient: '1/3' } (²P₃/₂: 2/3 + g_s/3)
 */
export function landeGsForm(g2: string): GsForm {
	const g = new Fraction(g2);
	return { constant: fractionString(new Fraction(2).sub(g)), gsCoefficient: fractionString(g.sub(1)) };
}
