import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Fraction from 'fraction.js';
import { GS_FREE_ELECTRON, effectiveMagnetonNumber, fractionString, landeG, landeGsForm } from './lande';

/** g as a string, failing the test when it is null. */
function g(twoS: number, L: number, twoJ: number): string {
	const v = landeG(twoS, L, twoJ);
	if (v === null) throw new Error('expected a g-factor');
	return fractionString(v);
}

/** Rounding of the published effective-magneton table (two decimals), plus its small discrepancies (see below). */
const TABLE_TOLERANCE = 0.02;
/** Float comparison of the general formula with the exact one. */
const FLOAT_TOLERANCE = 1e-12;

describe('Landé g_J with g_s = 2, exact', () => {
	// Each value follows from g = 1 + [J(J+1) + S(S+1) − L(L+1)]/[2J(J+1)] and appears in the
	// textbook tables of Zeeman g-factors (Condon & Shortley 1935, Zeeman-effect chapter; general fact).
	it('²P₃/₂ has g = 4/3 and ²P₁/₂ has g = 2/3', () => {
		expect(g(1, 1, 3)).toBe('4/3');
		expect(g(1, 1, 1)).toBe('2/3');
	});
	it('²S₁/₂ has g = 2 and ⁶S₅/₂ has g = 2 (pure spin)', () => {
		expect(g(1, 0, 1)).toBe('2');
		expect(g(5, 0, 5)).toBe('2');
	});
	it('⁴F₃/₂ has g = 2/5', () => {
		expect(g(3, 3, 3)).toBe('2/5');
	});
	it('³P₁ and ³P₂ have g = 3/2', () => {
		expect(g(2, 1, 2)).toBe('3/2');
		expect(g(2, 1, 4)).toBe('3/2');
	});
	it('singlets have g = 1 (¹P₁, ¹D₂, ¹F₃)', () => {
		expect(g(0, 1, 2)).toBe('1');
		expect(g(0, 2, 4)).toBe('1');
		expect(g(0, 3, 6)).toBe('1');
	});
	it('Nd³⁺ ⁴I₉/₂ has g = 8/11 and Dy³⁺ ⁶H₁₅/₂ has g = 4/3', () => {
		// Kittel, Introduction to Solid State Physics, paramagnetism chapter (g of the Ln³⁺ ground
		// levels); Ashcroft & Mermin (1976) ch. 31.
		expect(g(3, 6, 9)).toBe('8/11');
		expect(g(5, 5, 15)).toBe('4/3');
	});
	it('⁵D₀ and ³P₀ (J = 0) have no g: null', () => {
		expect(landeG(4, 2, 0)).toBeNull();
		expect(landeG(2, 1, 0)).toBeNull();
	});
	it('⁴D₁/₂ has g = 0 and ⁶F₁/₂ has a negative g = −2/3', () => {
		// ⁴D₁/₂: J(J+1) = 3/4, S(S+1) = 15/4, L(L+1) = 6 → g = 1 + (3/4 + 15/4 − 6)/(3/2) = 0.
		// ⁶F₁/₂: J(J+1) = 3/4, S(S+1) = 35/4, L(L+1) = 12 → g = 1 + (3/4 + 35/4 − 12)/(3/2) = −2/3.
		// Worked from the formula by hand; g = 0 and negative g are textbook curiosities (from memory).
		expect(g(3, 2, 1)).toBe('0');
		expect(g(5, 3, 1)).toBe('-2/3');
	});
	it('Sm³⁺ ⁶H₅/₂ has g = 2/7', () => {
		// Kittel / Ashcroft & Mermin discussion of Sm³⁺ (small moment, g = 2/7); from memory.
		expect(g(5, 5, 5)).toBe('2/7');
	});
});

describe('Landé g_J with the free-electron g_s', () => {
	it(`²P₃/₂ with g_s = ${GS_FREE_ELECTRON} is 4/3 + (g_s − 2)/3`, () => {
		// ²P₃/₂: spin part [J(J+1) + S(S+1) − L(L+1)]/[2J(J+1)] = 1/3, orbital part 1 − 1/3 = 2/3.
		const value = landeG(1, 1, 3, { gs: GS_FREE_ELECTRON });
		expect(value).not.toBeNull();
		expect(Math.abs((value as number) - (4 / 3 + (GS_FREE_ELECTRON - 2) / 3))).toBeLessThan(FLOAT_TOLERANCE);
	});
	it('the free-electron g_s is 2(1 + a_e) with the electron anomaly a_e = 1.159 652 181 28(18) × 10⁻³', () => {
		// Source: CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021), the electron magnetic-moment
		// anomaly a_e; g_e = −2(1 + a_e). Independent of the constant in lande.ts, which is the quoted |g_e|.
		const aE = 1.15965218128e-3;
		expect(Math.abs(GS_FREE_ELECTRON - 2 * (1 + aE))).toBeLessThan(1e-13);
	});
	it('with g_s = 2 as a number the float equals the exact fraction (random levels)', () => {
		fc.assert(
			fc.property(fc.integer({ min: 0, max: 10 }), fc.integer({ min: 0, max: 10 }), fc.nat(20), (twoS, L, k) => {
				const lo = Math.abs(2 * L - twoS);
				const count = Math.min(2 * L, twoS) + 1;
				const twoJ = lo + 2 * (k % count);
				const exact = landeG(twoS, L, twoJ);
				const float = landeG(twoS, L, twoJ, { gs: 2 });
				if (exact === null) expect(float).toBeNull();
				else expect(Math.abs((float as number) - exact.valueOf())).toBeLessThan(FLOAT_TOLERANCE);
			})
		);
	});
	it('J = L + S of a doublet has g = 1 + 1/(2L+1) (random L)', () => {
		// From the formula with S = 1/2, J = L + 1/2 (general fact).
		fc.assert(
			fc.property(fc.integer({ min: 0, max: 30 }), (L) => {
				expect((landeG(1, L, 2 * L + 1) as Fraction).equals(new Fraction(1).add(new Fraction(1, 2 * L + 1)))).toBe(true);
			})
		);
	});
});

describe('effective magneton numbers of trivalent lanthanide ions', () => {
	// Calculated p = g√(J(J+1)) of the Hund ground levels, from the table "Effective magneton
	// numbers for trivalent lanthanide group ions" in Kittel, Introduction to Solid State Physics
	// (paramagnetism chapter), values from memory. The remembered values for Dy, Ho, Er and Tm
	// (10.63, 10.60, 9.59, 7.57) differ from g√(J(J+1)) (10.646, 10.607, 9.581, 7.561) in the
	// second decimal, hence TABLE_TOLERANCE = 0.02 rather than the 0.005 of rounding.
	const table: [string, number, number, number, number][] = [
		['Ce³⁺ ²F₅/₂', 1, 3, 5, 2.54],
		['Pr³⁺ ³H₄', 2, 5, 8, 3.58],
		['Nd³⁺ ⁴I₉/₂', 3, 6, 9, 3.62],
		['Pm³⁺ ⁵I₄', 4, 6, 8, 2.68],
		['Sm³⁺ ⁶H₅/₂', 5, 5, 5, 0.84],
		['Eu³⁺ ⁷F₀', 6, 3, 0, 0],
		['Gd³⁺ ⁸S₇/₂', 7, 0, 7, 7.94],
		['Tb³⁺ ⁷F₆', 6, 3, 12, 9.72],
		['Dy³⁺ ⁶H₁₅/₂', 5, 5, 15, 10.63],
		['Ho³⁺ ⁵I₈', 4, 6, 16, 10.6],
		['Er³⁺ ⁴I₁₅/₂', 3, 6, 15, 9.59],
		['Tm³⁺ ³H₆', 2, 5, 12, 7.57],
		['Yb³⁺ ²F₇/₂', 1, 3, 7, 4.54]
	];
	for (const [label, twoS, L, twoJ, p] of table) {
		it(`${label}: p = ${p}`, () => {
			expect(Math.abs(effectiveMagnetonNumber(twoS, L, twoJ) - p)).toBeLessThan(TABLE_TOLERANCE);
		});
	}
});

describe('errors and formatting', () => {
	it('J outside |L−S| … L+S is refused with the allowed range', () => {
		expect(() => landeG(1, 1, 5)).toThrow(/from \|L−S\| = 1\/2 to L\+S = 3\/2/);
		expect(() => landeG(1, 1, 2)).toThrow(RangeError);
		expect(() => landeG(-1, 1, 1)).toThrow(/2S must be a non-negative integer/);
		expect(() => landeG(1, 1, 3, { gs: Number.NaN })).toThrow(/finite number/);
	});
	it('fractionString writes 3/2, 2, -1/2 and 0', () => {
		expect(fractionString(new Fraction(3, 2))).toBe('3/2');
		expect(fractionString(new Fraction(4, 2))).toBe('2');
		expect(fractionString(new Fraction(-1, 2))).toBe('-1/2');
		expect(fractionString(new Fraction(0))).toBe('0');
	});

	it('the exact form in g_s matches the free-electron decimal: ²P₃/₂ = 2/3 + 1/3 g_s, ⁶D₉/₂ = 4/9 + 5/9 g_s, ⁴D₁/₂ = 2 − g_s', () => {
		// General Landé formula with g_L = 1 (Condon & Shortley 1935; Cowan 1981, Zeeman-effect chapters).
		expect(landeGsForm('4/3')).toEqual({ constant: '2/3', gsCoefficient: '1/3' });
		expect(landeGsForm('14/9')).toEqual({ constant: '4/9', gsCoefficient: '5/9' });
		expect(landeGsForm('0')).toEqual({ constant: '2', gsCoefficient: '-1' });
		for (const [twoS, L, twoJ] of [
			[1, 1, 3],
			[5, 2, 9],
			[3, 2, 1],
			[2, 3, 4],
			[6, 0, 6]
		]) {
			const form = landeGsForm(fractionString(landeG(twoS, L, twoJ)!));
			const value = new Fraction(form.constant).valueOf() + new Fraction(form.gsCoefficient).valueOf() * GS_FREE_ELECTRON;
			expect(Math.abs(value - (landeG(twoS, L, twoJ, { gs: GS_FREE_ELECTRON }) as number))).toBeLessThan(FLOAT_TOLERANCE);
		}
	});
});
