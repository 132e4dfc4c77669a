import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	EXACT_ZERO,
	exactSqrt,
	exactToNumber,
	factorial,
	rational,
	rationalAdd,
	rationalMultiply,
	type ExactSqrt,
	type Rational
} from './exact';
import {
	clebschGordan,
	clebschGordanFloat,
	isTriad,
	wigner3j,
	wigner3jFloat,
	wigner6j,
	wigner6jFloat,
	wigner9j,
	wigner9jFloat
} from './wigner';

/** Agreement expected between two double evaluations of the same identity (sums of a few hundred terms). */
const FLOAT_TOLERANCE = 1e-12;

/** Every argument is twice the angular momentum; `d(3/2)` = 3. */
const d = (x: number) => Math.round(2 * x);

const sgn = (e: number): 1 | -1 => (((e % 2) + 2) % 2 === 0 ? 1 : -1);

/**
 * The exact number sign × sqrt(∏nums / ∏dens), where the factors may be half-integers.
 * Each factor x is carried as 2x, so ∏x = ∏(2x) / 2^count.
 */
function closedForm(sign: number, nums: number[], dens: number[]): ExactSqrt {
	let n = 1n;
	let m = 1n;
	for (const x of nums) n *= BigInt(d(x));
	for (const y of dens) m *= BigInt(d(y));
	n *= 2n ** BigInt(dens.length);
	m *= 2n ** BigInt(nums.length);
	if (n === 0n) return EXACT_ZERO;
	return exactSqrt(sign, n, m);
}

/** All doubled projections of a doubled j: -tj, -tj+2, …, tj. */
function projections(tj: number): number[] {
	const out: number[] = [];
	for (let t = -tj; t <= tj; t += 2) out.push(t);
	return out;
}

/** Doubled values from |ta−tb| to ta+tb in steps of 2. */
function triadRange(ta: number, tb: number): number[] {
	const out: number[] = [];
	for (let t = Math.abs(ta - tb); t <= ta + tb; t += 2) out.push(t);
	return out;
}

function square(x: ExactSqrt): Rational {
	return rational(x.num, x.den);
}

// ------------------------------------------------------------------ 3j

describe('3j closed forms of Edmonds (1957) Table 2', () => {
	const J_MAX = 12; // doubled: j up to 6

	it('(j j 0; m −m 0) = (−1)^{j−m} / sqrt(2j+1)', () => {
		for (let tj = 0; tj <= J_MAX; tj++) {
			for (const tm of projections(tj)) {
				const j = tj / 2;
				const m = tm / 2;
				expect(wigner3j(tj, tj, 0, tm, -tm, 0)).toEqual(closedForm(sgn(j - m), [1], [2 * j + 1]));
			}
		}
	});

	it('(j+1/2 j 1/2; m −m−1/2 1/2) = (−1)^{j−m−1/2} [(j−m+1/2)/((2j+2)(2j+1))]^{1/2}', () => {
		let checked = 0;
		for (let tj = 0; tj <= J_MAX; tj++) {
			for (const tm of projections(tj + 1)) {
				if (Math.abs(-tm - 1) > tj) continue;
				const j = tj / 2;
				const m = tm / 2;
				const expected = closedForm(sgn(j - m - 0.5), [j - m + 0.5], [2 * j + 2, 2 * j + 1]);
				expect(wigner3j(tj + 1, tj, 1, tm, -tm - 1, 1)).toEqual(expected);
				checked++;
			}
		}
		expect(checked).toBeGreaterThan(50);
	});

	it('(j+1 j 1; m −m−1 1) = (−1)^{j−m−1} [(j−m)(j−m+1)/((2j+1)(2j+2)(2j+3))]^{1/2}', () => {
		for (let tj = 0; tj <= J_MAX; tj++) {
			for (const tm of projections(tj + 2)) {
				if (Math.abs(-tm - 2) > tj) continue;
				const j = tj / 2;
				const m = tm / 2;
				const expected = closedForm(sgn(j - m - 1), [j - m, j - m + 1], [2 * j + 1, 2 * j + 2, 2 * j + 3]);
				expect(wigner3j(tj + 2, tj, 2, tm, -tm - 2, 2)).toEqual(expected);
			}
		}
	});

	it('(j+1 j 1; m −m 0) = (−1)^{j−m−1} [2(j+m+1)(j−m+1)/((2j+1)(2j+2)(2j+3))]^{1/2}', () => {
		for (let tj = 0; tj <= J_MAX; tj++) {
			for (const tm of projections(tj)) {
				const j = tj / 2;
				const m = tm / 2;
				const expected = closedForm(sgn(j - m - 1), [2, j + m + 1, j - m + 1], [2 * j + 1, 2 * j + 2, 2 * j + 3]);
				expect(wigner3j(tj + 2, tj, 2, tm, -tm, 0)).toEqual(expected);
			}
		}
	});

	it('(j j 1; m −m−1 1) = (−1)^{j−m} [2(j−m)(j+m+1)/(2j(2j+1)(2j+2))]^{1/2}', () => {
		for (let tj = 1; tj <= J_MAX; tj++) {
			for (const tm of projections(tj)) {
				if (Math.abs(-tm - 2) > tj) continue;
				const j = tj / 2;
				const m = tm / 2;
				const expected = closedForm(sgn(j - m), [2, j - m, j + m + 1], [2 * j, 2 * j + 1, 2 * j + 2]);
				expect(wigner3j(tj, tj, 2, tm, -tm - 2, 2)).toEqual(expected);
			}
		}
	});

	it('(j j 1; m −m 0) = (−1)^{j−m} 2m / [2j(2j+1)(2j+2)]^{1/2}', () => {
		for (let tj = 1; tj <= J_MAX; tj++) {
			for (const tm of projections(tj)) {
				const j = tj / 2;
				const m = tm / 2;
				const expected = closedForm(sgn(j - m) * Math.sign(m), [2 * m, 2 * m], [2 * j, 2 * j + 1, 2 * j + 2]);
				expect(wigner3j(tj, tj, 2, tm, -tm, 0)).toEqual(expected);
			}
		}
	});

	it('(j1 j2 j3; 0 0 0) = 0 for odd J = j1+j2+j3, else (−1)^{J/2} [(J−2j1)!(J−2j2)!(J−2j3)!/(J+1)!]^{1/2} (J/2)!/[(J/2−j1)!(J/2−j2)!(J/2−j3)!] (Edmonds 1957 eq. 3.7.17)', () => {
		for (let j1 = 0; j1 <= 8; j1++) {
			for (let j2 = 0; j2 <= 8; j2++) {
				for (let j3 = Math.abs(j1 - j2); j3 <= j1 + j2; j3++) {
					const J = j1 + j2 + j3;
					const got = wigner3j(2 * j1, 2 * j2, 2 * j3, 0, 0, 0);
					if (J % 2 === 1) {
						expect(got).toEqual(EXACT_ZERO);
						continue;
					}
					const g = J / 2;
					const ratio = factorial(g) / (factorial(g - j1) * factorial(g - j2) * factorial(g - j3));
					const expected = exactSqrt(
						sgn(g),
						factorial(J - 2 * j1) * factorial(J - 2 * j2) * factorial(J - 2 * j3) * ratio * ratio,
						factorial(J + 1)
					);
					expect(got).toEqual(expected);
				}
			}
		}
	});
});

describe('3j selection rules and input checks', () => {
	it('vanishes when m1+m2+m3 ≠ 0 or the triangle rule fails (Edmonds 1957 §3.7)', () => {
		expect(wigner3j(2, 2, 2, 2, 0, 0)).toEqual(EXACT_ZERO);
		expect(wigner3j(2, 2, 6, 0, 0, 0)).toEqual(EXACT_ZERO);
		expect(wigner3j(1, 1, 4, 1, -1, 0)).toEqual(EXACT_ZERO); // j3 = 2 > j1 + j2 = 1
	});
	it('names the bad argument and the allowed values', () => {
		expect(() => wigner3j(2, 2, 2, 4, -4, 0)).toThrow(/\|m1\| = 2 exceeds j1 = 1/);
		expect(() => wigner3j(2, 2, 2, 1, -1, 0)).toThrow(/j1 \+ m1 = 1 \+ 1\/2 is not an integer/);
		expect(() => wigner3j(1.5, 2, 2, 0, 0, 0)).toThrow(/j1 must be given as twice its value/);
		expect(() => wigner3j(2, -2, 2, 0, 0, 0)).toThrow(/j2 must be given as twice its value, a non-negative integer/);
		expect(() => wigner3j(2, 2, 2, 0, 0.5, 0)).toThrow(/m2 must be given as twice its value, an integer/);
	});
});

/** A random valid 3j argument list (doubled, j ≤ 6) with the m's summing to zero. */
const threeJArgs = fc
	.tuple(fc.integer({ min: 0, max: 12 }), fc.integer({ min: 0, max: 12 }), fc.nat(), fc.nat(), fc.nat())
	.map(([a, b, k, i, l]) => {
		const c = triadRange(a, b)[k % (Math.min(a, b) + 1)];
		const ma = projections(a)[i % (a + 1)];
		const mb = projections(b)[l % (b + 1)];
		return [a, b, c, ma, mb, -ma - mb] as [number, number, number, number, number, number];
	})
	.filter(([, , c, , , mc]) => Math.abs(mc) <= c);

describe('3j symmetries (Edmonds 1957 eqs. 3.7.5–3.7.6)', () => {
	it('is unchanged by cyclic column permutations and gains (−1)^{j1+j2+j3} under an odd one or m → −m', () => {
		fc.assert(
			fc.property(threeJArgs, ([a, b, c, ma, mb, mc]) => {
				const x = wigner3j(a, b, c, ma, mb, mc);
				const p = sgn((a + b + c) / 2);
				const flip = (y: ExactSqrt) => (p === 1 ? y : { ...y, sign: (-y.sign || 0) as -1 | 0 | 1 });
				expect(wigner3j(b, c, a, mb, mc, ma)).toEqual(x);
				expect(wigner3j(c, a, b, mc, ma, mb)).toEqual(x);
				expect(flip(wigner3j(b, a, c, mb, ma, mc))).toEqual(x);
				expect(flip(wigner3j(a, c, b, ma, mc, mb))).toEqual(x);
				expect(flip(wigner3j(a, b, c, -ma || 0, -mb || 0, -mc || 0))).toEqual(x);
			}),
			{ numRuns: 300 }
		);
	});
});

describe('3j orthogonality (Edmonds 1957 eqs. 3.7.7–3.7.8)', () => {
	it('Σ_{m1,m2} (2j3+1) (j1 j2 j3; m1 m2 m3)² = 1 exactly for every allowed j3, m3', () => {
		for (const [a, b] of [
			[1, 1],
			[2, 1],
			[2, 2],
			[3, 4],
			[5, 6],
			[8, 7]
		]) {
			for (const c of triadRange(a, b)) {
				for (const mc of projections(c)) {
					let total: Rational = { num: 0n, den: 1n };
					for (const ma of projections(a)) {
						const mb = -ma - mc;
						if (Math.abs(mb) > b) continue;
						total = rationalAdd(total, square(wigner3j(a, b, c, ma, mb, mc)));
					}
					expect(rationalMultiply(total, rational(BigInt(c + 1), 1n))).toEqual({ num: 1n, den: 1n });
				}
			}
		}
	});

	it('Σ_{m1,m2} (2j3+1)(j1 j2 j3; m1 m2 m3)(j1 j2 j3′; m1 m2 m3′) = δ_{j3 j3′} δ_{m3 m3′} (floats)', () => {
		for (const [a, b] of [
			[2, 2],
			[3, 5],
			[4, 6]
		]) {
			for (const c of triadRange(a, b)) {
				for (const c2 of triadRange(a, b)) {
					for (const mc of projections(Math.min(c, c2))) {
						let total = 0;
						for (const ma of projections(a)) {
							const mb = -ma - mc;
							if (Math.abs(mb) > b) continue;
							total += wigner3jFloat(a, b, c, ma, mb, mc) * wigner3jFloat(a, b, c2, ma, mb, mc);
						}
						expect(Math.abs((c + 1) * total - (c === c2 ? 1 : 0))).toBeLessThan(FLOAT_TOLERANCE);
					}
				}
			}
		}
	});

	it('Σ_{j3,m3} (2j3+1)(j1 j2 j3; m1 m2 m3)(j1 j2 j3; m1′ m2′ m3) = δ δ (property, floats)', () => {
		fc.assert(
			fc.property(threeJArgs, fc.nat(), ([a, b, , ma, mb], shift) => {
				const ma2 = projections(a)[shift % (a + 1)];
				const mb2 = ma + mb - ma2;
				if (Math.abs(mb2) > b) return;
				let total = 0;
				for (const c of triadRange(a, b)) {
					const mc = -ma - mb;
					if (Math.abs(mc) > c) continue;
					total += (c + 1) * wigner3jFloat(a, b, c, ma, mb, mc) * wigner3jFloat(a, b, c, ma2, mb2, mc);
				}
				expect(Math.abs(total - (ma === ma2 ? 1 : 0))).toBeLessThan(FLOAT_TOLERANCE);
			}),
			{ numRuns: 200 }
		);
	});
});

// ------------------------------------------------------------------ CG

describe('Clebsch–Gordan coefficients, PDG "Clebsch-Gordan coefficients" table (Review of Particle Physics)', () => {
	const cg = (j1: number, m1: number, j2: number, m2: number, J: number, M: number) =>
		clebschGordan(d(j1), d(m1), d(j2), d(m2), d(J), d(M));

	it('1/2 × 1/2: |1 0⟩ = sqrt(1/2)(|+−⟩ + |−+⟩), |0 0⟩ = sqrt(1/2)(|+−⟩ − |−+⟩), |1 1⟩ = |++⟩', () => {
		expect(cg(0.5, 0.5, 0.5, 0.5, 1, 1)).toEqual(exactSqrt(1, 1n, 1n));
		expect(cg(0.5, 0.5, 0.5, -0.5, 1, 0)).toEqual(exactSqrt(1, 1n, 2n));
		expect(cg(0.5, -0.5, 0.5, 0.5, 1, 0)).toEqual(exactSqrt(1, 1n, 2n));
		expect(cg(0.5, 0.5, 0.5, -0.5, 0, 0)).toEqual(exactSqrt(1, 1n, 2n));
		expect(cg(0.5, -0.5, 0.5, 0.5, 0, 0)).toEqual(exactSqrt(-1, 1n, 2n));
	});

	it('1 × 1/2: |3/2 1/2⟩ = sqrt(1/3)|1,−1/2⟩ + sqrt(2/3)|0,1/2⟩; |1/2 1/2⟩ = sqrt(2/3)|1,−1/2⟩ − sqrt(1/3)|0,1/2⟩; |1/2 −1/2⟩ = sqrt(1/3)|0,−1/2⟩ − sqrt(2/3)|−1,1/2⟩', () => {
		expect(cg(1, 1, 0.5, -0.5, 1.5, 0.5)).toEqual(exactSqrt(1, 1n, 3n));
		expect(cg(1, 0, 0.5, 0.5, 1.5, 0.5)).toEqual(exactSqrt(1, 2n, 3n));
		expect(cg(1, 1, 0.5, -0.5, 0.5, 0.5)).toEqual(exactSqrt(1, 2n, 3n));
		expect(cg(1, 0, 0.5, 0.5, 0.5, 0.5)).toEqual(exactSqrt(-1, 1n, 3n));
		expect(cg(1, 0, 0.5, -0.5, 0.5, -0.5)).toEqual(exactSqrt(1, 1n, 3n));
		expect(cg(1, -1, 0.5, 0.5, 0.5, -0.5)).toEqual(exactSqrt(-1, 2n, 3n));
		expect(cg(1, 0, 0.5, -0.5, 1.5, -0.5)).toEqual(exactSqrt(1, 2n, 3n));
		expect(cg(1, -1, 0.5, 0.5, 1.5, -0.5)).toEqual(exactSqrt(1, 1n, 3n));
	});

	it('1 × 1: |2 0⟩ = sqrt(1/6)|1,−1⟩ + sqrt(2/3)|0,0⟩ + sqrt(1/6)|−1,1⟩; |1 0⟩ = sqrt(1/2)|1,−1⟩ − sqrt(1/2)|−1,1⟩; |0 0⟩ = sqrt(1/3)(|1,−1⟩ − |0,0⟩ + |−1,1⟩); |1 1⟩ = sqrt(1/2)(|1,0⟩ − |0,1⟩)', () => {
		expect(cg(1, 1, 1, -1, 2, 0)).toEqual(exactSqrt(1, 1n, 6n));
		expect(cg(1, 0, 1, 0, 2, 0)).toEqual(exactSqrt(1, 2n, 3n));
		expect(cg(1, -1, 1, 1, 2, 0)).toEqual(exactSqrt(1, 1n, 6n));
		expect(cg(1, 1, 1, -1, 1, 0)).toEqual(exactSqrt(1, 1n, 2n));
		expect(cg(1, 0, 1, 0, 1, 0)).toEqual(EXACT_ZERO);
		expect(cg(1, -1, 1, 1, 1, 0)).toEqual(exactSqrt(-1, 1n, 2n));
		expect(cg(1, 1, 1, -1, 0, 0)).toEqual(exactSqrt(1, 1n, 3n));
		expect(cg(1, 0, 1, 0, 0, 0)).toEqual(exactSqrt(-1, 1n, 3n));
		expect(cg(1, -1, 1, 1, 0, 0)).toEqual(exactSqrt(1, 1n, 3n));
		expect(cg(1, 1, 1, 0, 1, 1)).toEqual(exactSqrt(1, 1n, 2n));
		expect(cg(1, 0, 1, 1, 1, 1)).toEqual(exactSqrt(-1, 1n, 2n));
	});

	it('2 × 1/2: |5/2 3/2⟩ = sqrt(1/5)|2,−1/2⟩ + sqrt(4/5)|1,1/2⟩; |3/2 3/2⟩ = sqrt(4/5)|2,−1/2⟩ − sqrt(1/5)|1,1/2⟩', () => {
		expect(cg(2, 2, 0.5, -0.5, 2.5, 1.5)).toEqual(exactSqrt(1, 1n, 5n));
		expect(cg(2, 1, 0.5, 0.5, 2.5, 1.5)).toEqual(exactSqrt(1, 4n, 5n));
		expect(cg(2, 2, 0.5, -0.5, 1.5, 1.5)).toEqual(exactSqrt(1, 4n, 5n));
		expect(cg(2, 1, 0.5, 0.5, 1.5, 1.5)).toEqual(exactSqrt(-1, 1n, 5n));
	});

	it('j2 = 1/2 in general: ⟨l m∓1/2, 1/2 ±1/2 | l+1/2 m⟩ = sqrt((l ± m + 1/2)/(2l+1)), ⟨l m−1/2, 1/2 1/2 | l−1/2 m⟩ = −sqrt((l − m + 1/2)/(2l+1)), ⟨l m+1/2, 1/2 −1/2 | l−1/2 m⟩ = sqrt((l + m + 1/2)/(2l+1)) (Condon & Shortley 1935 ch. 3 table for j2 = 1/2; same entries in the PDG table)', () => {
		for (let l = 0; l <= 8; l++) {
			for (const tm of projections(2 * l + 1)) {
				const m = tm / 2;
				const up = m - 0.5;
				const down = m + 0.5;
				if (Math.abs(up) <= l) {
					expect(clebschGordan(2 * l, d(up), 1, 1, 2 * l + 1, tm)).toEqual(closedForm(1, [l + m + 0.5], [2 * l + 1]));
					if (l > 0 && Math.abs(m) <= l - 0.5)
						expect(clebschGordan(2 * l, d(up), 1, 1, 2 * l - 1, tm)).toEqual(closedForm(-1, [l - m + 0.5], [2 * l + 1]));
				}
				if (Math.abs(down) <= l) {
					expect(clebschGordan(2 * l, d(down), 1, -1, 2 * l + 1, tm)).toEqual(closedForm(1, [l - m + 0.5], [2 * l + 1]));
					if (l > 0 && Math.abs(m) <= l - 0.5)
						expect(clebschGordan(2 * l, d(down), 1, -1, 2 * l - 1, tm)).toEqual(closedForm(1, [l + m + 0.5], [2 * l + 1]));
				}
			}
		}
	});

	it('j2 = 1 in general (Condon & Shortley 1935 ch. 3 table for j2 = 1, table location from memory; entries agree with the PDG 1 × 1 block above)', () => {
		let checked = 0;
		for (let tj = 2; tj <= 12; tj++) {
			const j = tj / 2;
			for (const tm of projections(tj + 2)) {
				const m = tm / 2;
				const cgAt = (mm2: number, tJ: number) => {
					const tm1 = tm - 2 * mm2;
					if (Math.abs(tm1) > tj || Math.abs(tm) > tJ) return null;
					return clebschGordan(tj, tm1, 2, 2 * mm2, tJ, tm);
				};
				const checks: [number, number, () => ExactSqrt][] = [
					[1, tj + 2, () => closedForm(1, [j + m, j + m + 1], [2 * j + 1, 2 * j + 2])],
					[0, tj + 2, () => closedForm(1, [j - m + 1, j + m + 1], [2 * j + 1, j + 1])],
					[-1, tj + 2, () => closedForm(1, [j - m, j - m + 1], [2 * j + 1, 2 * j + 2])],
					[1, tj, () => closedForm(-1, [j + m, j - m + 1], [2 * j, j + 1])],
					[0, tj, () => closedForm(Math.sign(m), [m, m], [j, j + 1])],
					[-1, tj, () => closedForm(1, [j - m, j + m + 1], [2 * j, j + 1])],
					[1, tj - 2, () => closedForm(1, [j - m, j - m + 1], [2 * j, 2 * j + 1])],
					[0, tj - 2, () => closedForm(-1, [j - m, j + m], [j, 2 * j + 1])],
					[-1, tj - 2, () => closedForm(1, [j + m + 1, j + m], [2 * j, 2 * j + 1])]
				];
				for (const [mm2, tJ, expected] of checks) {
					const got = cgAt(mm2, tJ);
					if (got !== null) {
						expect(got).toEqual(expected());
						checked++;
					}
				}
			}
		}
		expect(checked).toBeGreaterThan(300);
	});

	it('is zero unless m1 + m2 = M, and names J or M when they are invalid', () => {
		expect(clebschGordan(2, 2, 2, 0, 2, 0)).toEqual(EXACT_ZERO);
		expect(() => clebschGordan(2, 0, 2, 0, 2, 4)).toThrow(/\|M\| = 2 exceeds J = 1/);
		expect(() => clebschGordan(2, 0, 2, 0, -2, 0)).toThrow(/J must be given/);
	});

	it('the float form agrees with the exact value (1 × 1 → 2, M = 0: sqrt(2/3))', () => {
		expect(Math.abs(clebschGordanFloat(2, 0, 2, 0, 4, 0) - Math.sqrt(2 / 3))).toBeLessThan(FLOAT_TOLERANCE);
	});
});

// ------------------------------------------------------------------ 6j

describe('6j closed forms of Edmonds (1957) Table 5 (s = a + b + c)', () => {
	const cases: [number, number, number][] = [];
	for (let ta = 0; ta <= 12; ta++)
		for (let tb = 0; tb <= 12; tb++) for (const tc of triadRange(ta, tb)) if (tc <= 14) cases.push([ta, tb, tc]);

	/** Runs `check` on every (a, b, c) whose 6j has valid triads and non-negative arguments. */
	function each(lower: (tb: number, tc: number) => [number, number, number], formula: (a: number, b: number, c: number) => ExactSqrt) {
		let checked = 0;
		for (const [ta, tb, tc] of cases) {
			const [t4, t5, t6] = lower(tb, tc);
			if (t4 < 0 || t5 < 0 || t6 < 0) continue;
			const got = wigner6j(ta, tb, tc, t4, t5, t6);
			const triads = isTriad(ta, t5, t6) && isTriad(t4, tb, t6) && isTriad(t4, t5, tc);
			if (!triads) {
				expect(got).toEqual(EXACT_ZERO);
				continue;
			}
			expect(got).toEqual(formula(ta / 2, tb / 2, tc / 2));
			checked++;
		}
		expect(checked).toBeGreaterThan(40);
	}

	it('{a b c; 0 c b} = (−1)^s / [(2b+1)(2c+1)]^{1/2}', () => {
		each(
			(tb, tc) => [0, tc, tb],
			(a, b, c) => closedForm(sgn(a + b + c), [1], [2 * b + 1, 2 * c + 1])
		);
	});

	it('{a b c; 1/2 c−1/2 b+1/2} = (−1)^s [(s−2b)(s−2c+1)/((2b+1)(2b+2)2c(2c+1))]^{1/2}', () => {
		each(
			(tb, tc) => [1, tc - 1, tb + 1],
			(a, b, c) => {
				const s = a + b + c;
				return closedForm(sgn(s), [s - 2 * b, s - 2 * c + 1], [2 * b + 1, 2 * b + 2, 2 * c, 2 * c + 1]);
			}
		);
	});

	it('{a b c; 1/2 c−1/2 b−1/2} = (−1)^s [(s+1)(s−2a)/(2b(2b+1)2c(2c+1))]^{1/2}', () => {
		each(
			(tb, tc) => [1, tc - 1, tb - 1],
			(a, b, c) => {
				const s = a + b + c;
				return closedForm(sgn(s), [s + 1, s - 2 * a], [2 * b, 2 * b + 1, 2 * c, 2 * c + 1]);
			}
		);
	});

	it('{a b c; 1 c−1 b−1} = (−1)^s [s(s+1)(s−2a−1)(s−2a)/((2b−1)2b(2b+1)(2c−1)2c(2c+1))]^{1/2}', () => {
		each(
			(tb, tc) => [2, tc - 2, tb - 2],
			(a, b, c) => {
				const s = a + b + c;
				return closedForm(sgn(s), [s, s + 1, s - 2 * a - 1, s - 2 * a], [2 * b - 1, 2 * b, 2 * b + 1, 2 * c - 1, 2 * c, 2 * c + 1]);
			}
		);
	});

	it('{a b c; 1 c−1 b} = (−1)^s [2(s+1)(s−2a)(s−2b)(s−2c+1)/(2b(2b+1)(2b+2)(2c−1)2c(2c+1))]^{1/2}', () => {
		each(
			(tb, tc) => [2, tc - 2, tb],
			(a, b, c) => {
				const s = a + b + c;
				return closedForm(
					sgn(s),
					[2, s + 1, s - 2 * a, s - 2 * b, s - 2 * c + 1],
					[2 * b, 2 * b + 1, 2 * b + 2, 2 * c - 1, 2 * c, 2 * c + 1]
				);
			}
		);
	});

	it('{a b c; 1 c−1 b+1} = (−1)^s [(s−2b−1)(s−2b)(s−2c+1)(s−2c+2)/((2b+1)(2b+2)(2b+3)(2c−1)2c(2c+1))]^{1/2}', () => {
		each(
			(tb, tc) => [2, tc - 2, tb + 2],
			(a, b, c) => {
				const s = a + b + c;
				return closedForm(
					sgn(s),
					[s - 2 * b - 1, s - 2 * b, s - 2 * c + 1, s - 2 * c + 2],
					[2 * b + 1, 2 * b + 2, 2 * b + 3, 2 * c - 1, 2 * c, 2 * c + 1]
				);
			}
		);
	});

	it('{a b c; 1 c b} = (−1)^{s+1} 2[b(b+1) + c(c+1) − a(a+1)] / [2b(2b+1)(2b+2)2c(2c+1)(2c+2)]^{1/2}', () => {
		each(
			(tb, tc) => [2, tc, tb],
			(a, b, c) => {
				const s = a + b + c;
				const x = b * (b + 1) + c * (c + 1) - a * (a + 1); // a multiple of 1/2 whenever a + b + c is an integer
				return closedForm(sgn(s + 1) * Math.sign(x), [2 * x, 2 * x], [2 * b, 2 * b + 1, 2 * b + 2, 2 * c, 2 * c + 1, 2 * c + 2]);
			}
		);
	});

	it('{1 1 1; 1 1 1} = 1/6 (the last form with a = b = c = 1)', () => {
		expect(wigner6j(2, 2, 2, 2, 2, 2)).toEqual(exactSqrt(1, 1n, 36n));
		expect(wigner6jFloat(2, 2, 2, 2, 2, 2)).toBeCloseTo(1 / 6, 15);
	});
});

/** A random 6j argument list (doubled, j ≤ 5) whose four triads hold. */
const sixJArgs = fc
	.tuple(fc.integer({ min: 0, max: 10 }), fc.integer({ min: 0, max: 10 }), fc.integer({ min: 0, max: 10 }), fc.nat(), fc.nat(), fc.nat())
	.map(([a, b, dd, i, k, l]) => {
		const c = triadRange(a, b)[i % (Math.min(a, b) + 1)];
		const es = triadRange(dd, c);
		const e = es[k % es.length];
		const fs = triadRange(a, e).filter((f) => isTriad(dd, b, f));
		return fs.length === 0 ? null : ([a, b, c, dd, e, fs[l % fs.length]] as [number, number, number, number, number, number]);
	})
	.filter((x): x is [number, number, number, number, number, number] => x !== null);

describe('6j symmetries and identities', () => {
	it('has the 24 tetrahedral symmetries: any column permutation, and swapping upper and lower entries in two columns (Edmonds 1957 §6.3)', () => {
		fc.assert(
			fc.property(sixJArgs, ([a, b, c, dd, e, f]) => {
				const x = wigner6j(a, b, c, dd, e, f);
				const cols: [number, number][] = [
					[a, dd],
					[b, e],
					[c, f]
				];
				const perms = [
					[0, 1, 2],
					[0, 2, 1],
					[1, 0, 2],
					[1, 2, 0],
					[2, 0, 1],
					[2, 1, 0]
				];
				const flips = [
					[false, false, false],
					[true, true, false],
					[true, false, true],
					[false, true, true]
				];
				for (const p of perms) {
					for (const fl of flips) {
						const col = p.map((k, i) => (fl[i] ? [cols[k][1], cols[k][0]] : cols[k]));
						expect(wigner6j(col[0][0], col[1][0], col[2][0], col[0][1], col[1][1], col[2][1])).toEqual(x);
					}
				}
			}),
			{ numRuns: 100 }
		);
	});

	it('equals the recoupling overlap computed from CG coefficients: ⟨(j1j2)j12, j3; J|j1, (j2j3)j23; J⟩ = (−1)^{j1+j2+j3+J} [(2j12+1)(2j23+1)]^{1/2} {j1 j2 j12; j3 J j23} (Edmonds 1957 eq. 6.1.5)', () => {
		fc.assert(
			fc.property(sixJArgs, ([t1, t2, t12, t3, tJ, t23]) => {
				// {j1 j2 j12; j3 J j23}: triads (j1 j2 j12), (j1 J j23), (j3 j2 j23), (j3 J j12).
				const tM = tJ % 2; // M = 0 or 1/2
				let overlap = 0;
				for (const m1 of projections(t1)) {
					for (const m2 of projections(t2)) {
						const m3 = tM - m1 - m2;
						if (Math.abs(m3) > t3 || Math.abs(m1 + m2) > t12 || Math.abs(m2 + m3) > t23) continue;
						overlap +=
							clebschGordanFloat(t1, m1, t2, m2, t12, m1 + m2) *
							clebschGordanFloat(t12, m1 + m2, t3, m3, tJ, tM) *
							clebschGordanFloat(t2, m2, t3, m3, t23, m2 + m3) *
							clebschGordanFloat(t1, m1, t23, m2 + m3, tJ, tM);
					}
				}
				const expected = sgn((t1 + t2 + t3 + tJ) / 2) * Math.sqrt((t12 + 1) * (t23 + 1)) * wigner6jFloat(t1, t2, t12, t3, tJ, t23);
				expect(Math.abs(overlap - expected)).toBeLessThan(FLOAT_TOLERANCE);
			}),
			{ numRuns: 150 }
		);
	});

	it('orthogonality Σ_x (2x+1)(2f+1){a b x; c d f}{a b x; c d f} = 1 exactly (Edmonds 1957 eq. 6.2.9)', () => {
		fc.assert(
			fc.property(sixJArgs, ([a, b, , c, dd, f]) => {
				// {a b x; c d f} with f fixed: triads (a d f) and (c b f) must hold for a nonzero sum.
				if (!isTriad(a, dd, f) || !isTriad(c, b, f)) return;
				let total: Rational = { num: 0n, den: 1n };
				for (const x of triadRange(a, b)) {
					total = rationalAdd(total, rationalMultiply(rational(BigInt(x + 1), 1n), square(wigner6j(a, b, x, c, dd, f))));
				}
				expect(rationalMultiply(total, rational(BigInt(f + 1), 1n))).toEqual({ num: 1n, den: 1n });
			}),
			{ numRuns: 150 }
		);
	});

	it('orthogonality Σ_x (2x+1)(2f+1){a b x; c d f}{a b x; c d g} = δ_fg (floats, Edmonds 1957 eq. 6.2.9)', () => {
		for (const [a, b, c, dd] of [
			[2, 2, 2, 2],
			[3, 5, 4, 2],
			[4, 6, 6, 4],
			[5, 3, 7, 5]
		]) {
			for (const f of triadRange(a, dd)) {
				for (const g of triadRange(a, dd)) {
					if (!isTriad(c, b, f) || !isTriad(c, b, g)) continue;
					let total = 0;
					for (const x of triadRange(a, b)) total += (x + 1) * wigner6jFloat(a, b, x, c, dd, f) * wigner6jFloat(a, b, x, c, dd, g);
					expect(Math.abs((f + 1) * total - (f === g ? 1 : 0))).toBeLessThan(FLOAT_TOLERANCE);
				}
			}
		}
	});

	it('Racah sum rule Σ_x (−1)^{p+q+x}(2x+1){a b x; c d p}{a b x; d c q} = {a c q; b d p} (Racah 1942; Edmonds 1957 §6.2, equation number from memory)', () => {
		fc.assert(
			fc.property(sixJArgs, fc.nat(), ([a, b, , c, dd, p], k) => {
				const qs = triadRange(a, c).filter((q) => isTriad(b, dd, q));
				if (qs.length === 0) return;
				const q = qs[k % qs.length];
				let total = 0;
				for (const x of triadRange(a, b)) {
					total += sgn((p + q + x) / 2) * (x + 1) * wigner6jFloat(a, b, x, c, dd, p) * wigner6jFloat(a, b, x, dd, c, q);
				}
				expect(Math.abs(total - wigner6jFloat(a, c, q, b, dd, p))).toBeLessThan(FLOAT_TOLERANCE);
			}),
			{ numRuns: 150 }
		);
	});

	it('Biedenharn–Elliott identity Σ_x (−1)^{S+x}(2x+1){a b x; c d p}{c d x; e f q}{e f x; b a r} = {p q r; e a d}{p q r; f b c}, S = a+b+c+d+e+f+p+q+r (Edmonds 1957 eq. 6.2.12, number from memory)', () => {
		const small = fc.integer({ min: 0, max: 6 });
		fc.assert(
			fc.property(fc.tuple(small, small, small, small, small, small, small, small, small), ([a, b, c, dd, e, f, p, q, r]) => {
				const parity = (a + b + c + dd + e + f + p + q + r) / 2;
				if (!Number.isInteger(parity)) return; // S must be an integer for a valid coupling scheme
				let total = 0;
				for (let x = 0; x <= 12; x++) {
					total +=
						sgn(parity + x / 2) *
						(x + 1) *
						wigner6jFloat(a, b, x, c, dd, p) *
						wigner6jFloat(c, dd, x, e, f, q) *
						wigner6jFloat(e, f, x, b, a, r);
				}
				const rhs = wigner6jFloat(p, q, r, e, a, dd) * wigner6jFloat(p, q, r, f, b, c);
				expect(Math.abs(total - rhs)).toBeLessThan(FLOAT_TOLERANCE);
			}),
			{ numRuns: 400 }
		);
	});
});

// ------------------------------------------------------------------ 9j

/** A random 9j argument list (doubled, j ≤ 2, or ≤ 3 for the upper entries) with all rows and columns triads. */
const nineJArgs = fc
	.tuple(
		fc.integer({ min: 0, max: 4 }),
		fc.integer({ min: 0, max: 4 }),
		fc.integer({ min: 0, max: 4 }),
		fc.integer({ min: 0, max: 4 }),
		fc.array(fc.nat(), { minLength: 5, maxLength: 5 })
	)
	.map(([t1, t2, t4, t5, [i, k, l, m, n]]) => {
		const pick = (xs: number[], s: number) => (xs.length === 0 ? null : xs[s % xs.length]);
		const t3 = pick(triadRange(t1, t2), i);
		const t6 = pick(triadRange(t4, t5), k);
		const t7 = pick(triadRange(t1, t4), l);
		const t8 = pick(triadRange(t2, t5), m);
		if (t3 === null || t6 === null || t7 === null || t8 === null) return null;
		const t9 = pick(
			triadRange(t3, t6).filter((t) => isTriad(t7, t8, t)),
			n
		);
		return t9 === null ? null : ([t1, t2, t3, t4, t5, t6, t7, t8, t9] as number[]);
	})
	.filter((x): x is number[] => x !== null);

const nine = (a: number[]) => wigner9j(a[0], a[1], a[2], a[3], a[4], a[5], a[6], a[7], a[8]);

describe('9j symbols', () => {
	it('with a zero reduces to a 6j: {a b e; c d e; f f 0} = (−1)^{b+c+e+f} [(2e+1)(2f+1)]^{−1/2} {a b e; d c f} (Edmonds 1957 eq. 6.4.14)', () => {
		let checked = 0;
		for (let a = 0; a <= 6; a++)
			for (let b = 0; b <= 6; b++)
				for (const e of triadRange(a, b))
					for (let c = 0; c <= 6; c++)
						for (const dd of triadRange(c, e))
							for (const f of triadRange(a, c)) {
								const got = wigner9j(a, b, e, c, dd, e, f, f, 0);
								if (!isTriad(b, dd, f)) {
									expect(got).toEqual(EXACT_ZERO);
									continue;
								}
								const six = wigner6j(a, b, e, dd, c, f);
								const expected = exactSqrt(sgn((b + c + e + f) / 2) * six.sign, six.num, six.den * BigInt((e + 1) * (f + 1)));
								expect(got).toEqual(expected);
								checked++;
							}
		expect(checked).toBeGreaterThan(500);
	});

	it('{1 1 1; 1 1 1; 1 1 0} = (1/3){1 1 1; 1 1 1} = 1/18 (Edmonds 1957 eq. 6.4.14 with the 6j of Table 5)', () => {
		expect(wigner9j(2, 2, 2, 2, 2, 2, 2, 2, 0)).toEqual(exactSqrt(1, 1n, 324n));
	});

	it('vanishes when two rows are equal and the nine j sum to an odd number: {1 1 1; 1 1 1; 1 1 1} = 0 (Edmonds 1957 eq. 6.4.7 symmetry)', () => {
		expect(wigner9j(2, 2, 2, 2, 2, 2, 2, 2, 2)).toEqual(EXACT_ZERO);
	});

	it('is unchanged by reflection in either diagonal and gains (−1)^{Σj} under an odd row or column permutation (Edmonds 1957 eqs. 6.4.6–6.4.8, numbers from memory)', () => {
		fc.assert(
			fc.property(nineJArgs, (a) => {
				const x = nine(a);
				const p = sgn(a.reduce((s, t) => s + t, 0) / 2);
				const odd = (y: ExactSqrt) => (p === 1 ? y : { ...y, sign: (-y.sign || 0) as -1 | 0 | 1 });
				const [a1, a2, a3, a4, a5, a6, a7, a8, a9] = a;
				expect(nine([a1, a4, a7, a2, a5, a8, a3, a6, a9])).toEqual(x); // transpose
				expect(nine([a9, a6, a3, a8, a5, a2, a7, a4, a1])).toEqual(x); // anti-diagonal reflection
				expect(nine([a4, a5, a6, a7, a8, a9, a1, a2, a3])).toEqual(x); // cyclic rows
				expect(nine([a2, a3, a1, a5, a6, a4, a8, a9, a7])).toEqual(x); // cyclic columns
				expect(odd(nine([a4, a5, a6, a1, a2, a3, a7, a8, a9]))).toEqual(x); // swap rows 1, 2
				expect(odd(nine([a3, a2, a1, a6, a5, a4, a9, a8, a7]))).toEqual(x); // swap columns 1, 3
			}),
			{ numRuns: 200 }
		);
	});

	it('equals the LS–jj style recoupling overlap from CG coefficients: ⟨(j1j2)j12,(j3j4)j34; J|(j1j3)j13,(j2j4)j24; J⟩ = [(2j12+1)(2j34+1)(2j13+1)(2j24+1)]^{1/2} {j1 j2 j12; j3 j4 j34; j13 j24 J} (Edmonds 1957 eq. 6.4.2)', () => {
		fc.assert(
			fc.property(nineJArgs, (a) => {
				const [t1, t2, t12, t3, t4, t34, t13, t24, tJ] = a;
				const tM = tJ % 2;
				let overlap = 0;
				for (const m1 of projections(t1))
					for (const m2 of projections(t2))
						for (const m3 of projections(t3)) {
							const m4 = tM - m1 - m2 - m3;
							if (Math.abs(m4) > t4) continue;
							if (Math.abs(m1 + m2) > t12 || Math.abs(m3 + m4) > t34 || Math.abs(m1 + m3) > t13 || Math.abs(m2 + m4) > t24) continue;
							overlap +=
								clebschGordanFloat(t1, m1, t2, m2, t12, m1 + m2) *
								clebschGordanFloat(t3, m3, t4, m4, t34, m3 + m4) *
								clebschGordanFloat(t12, m1 + m2, t34, m3 + m4, tJ, tM) *
								clebschGordanFloat(t1, m1, t3, m3, t13, m1 + m3) *
								clebschGordanFloat(t2, m2, t4, m4, t24, m2 + m4) *
								clebschGordanFloat(t13, m1 + m3, t24, m2 + m4, tJ, tM);
						}
				const expected = Math.sqrt((t12 + 1) * (t34 + 1) * (t13 + 1) * (t24 + 1)) * exactToNumber(nine(a));
				expect(Math.abs(overlap - expected)).toBeLessThan(FLOAT_TOLERANCE);
			}),
			{ numRuns: 150 }
		);
	});

	it('orthogonality Σ_{j13,j24} (2j12+1)(2j34+1)(2j13+1)(2j24+1){…j12…j34…}² = 1 exactly (Edmonds 1957 eq. 6.4.6, number from memory)', () => {
		for (const [t1, t2, t3, t4, tJ] of [
			[1, 1, 1, 1, 2],
			[2, 1, 2, 1, 2],
			[2, 1, 4, 1, 4],
			[3, 2, 4, 3, 5],
			[4, 4, 2, 2, 4]
		]) {
			for (const t12 of triadRange(t1, t2)) {
				for (const t34 of triadRange(t3, t4)) {
					if (!isTriad(t12, t34, tJ)) continue;
					let total: Rational = { num: 0n, den: 1n };
					for (const t13 of triadRange(t1, t3))
						for (const t24 of triadRange(t2, t4)) {
							const w = BigInt((t12 + 1) * (t34 + 1) * (t13 + 1) * (t24 + 1));
							total = rationalAdd(total, rationalMultiply(rational(w, 1n), square(wigner9j(t1, t2, t12, t3, t4, t34, t13, t24, tJ))));
						}
					expect(total).toEqual({ num: 1n, den: 1n });
				}
			}
		}
	});

	it('sp configuration, J = 1: the LS–jj transformation between ¹P₁, ³P₁ and (1/2,1/2)₁, (1/2,3/2)₁ has squared entries 1/3 and 2/3 (Cowan 1981 ch. 4 LS–jj transformation for sp; from memory)', () => {
		// ⟨(l1 s1)j1, (l2 s2)j2; J | (l1 l2)L, (s1 s2)S; J⟩ = [(2j1+1)(2j2+1)(2L+1)(2S+1)]^{1/2} {l1 s1 j1; l2 s2 j2; L S J}
		const squares: string[] = [];
		for (const tj2 of [1, 3])
			for (const tS of [0, 2]) {
				const x = wigner9j(0, 1, 1, 2, 1, tj2, 2, tS, 2);
				const r = rationalMultiply(square(x), rational(BigInt(2 * (tj2 + 1) * 3 * (tS + 1)), 1n));
				squares.push(`${r.num}/${r.den}`);
			}
		expect(squares.sort()).toEqual(['1/3', '1/3', '2/3', '2/3']);
	});

	it('is orthogonal: Σ_{j7 j8} (2j7+1)(2j8+1)(2j3+1)(2j6+1) {j1 j2 j3; j4 j5 j6; j7 j8 j9}{j1 j2 j3′; j4 j5 j6′; j7 j8 j9} = δ_{j3 j3′} δ_{j6 j6′} (Edmonds 1957 eq. 6.4.15)', () => {
		fc.assert(
			fc.property(nineJArgs, (a) => {
				const [t1, t2, t3, t4, t5, t6, , , t9] = a;
				for (const u3 of triadRange(t1, t2))
					for (const u6 of triadRange(t4, t5)) {
						let total = 0;
						for (const t7 of triadRange(t1, t4))
							for (const t8 of triadRange(t2, t5))
								total +=
									(t7 + 1) *
									(t8 + 1) *
									Math.sqrt((t3 + 1) * (t6 + 1) * (u3 + 1) * (u6 + 1)) *
									wigner9jFloat(t1, t2, t3, t4, t5, t6, t7, t8, t9) *
									wigner9jFloat(t1, t2, u3, t4, t5, u6, t7, t8, t9);
						const expected = u3 === t3 && u6 === t6 ? 1 : 0;
						expect(Math.abs(total - expected)).toBeLessThan(1e-9);
					}
			}),
			{ numRuns: 100 }
		);
	});
});
