import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { couplingTable, ketLabel, MAX_J_COUPLING_TABLE } from './basis';
import { exactSqrt, exactToNumber, rational, rationalAdd, type Rational } from './exact';

/** Agreement expected for float inner products of table rows (a few dozen terms). */
const FLOAT_TOLERANCE = 1e-13;

function sumOfSquares(coefficients: { coefficient: { num: bigint; den: bigint } }[]): Rational {
	return coefficients.reduce<Rational>((s, c) => rationalAdd(s, rational(c.coefficient.num, c.coefficient.den)), { num: 0n, den: 1n });
}

describe('couplingTable', () => {
	it('l = 1 ⊗ s = 1/2: |3/2 1/2⟩ = sqrt(1/3)|1, −1/2⟩ + sqrt(2/3)|0, 1/2⟩ and |1/2 1/2⟩ = sqrt(2/3)|1, −1/2⟩ − sqrt(1/3)|0, 1/2⟩ (PDG Clebsch–Gordan table, 1 × 1/2; Condon & Shortley 1935 ch. 3)', () => {
		const t = couplingTable(2, 1);
		expect(t.rows.map((r) => [r.twoJ, r.twoM])).toEqual([
			[3, 3],
			[3, 1],
			[3, -1],
			[3, -3],
			[1, 1],
			[1, -1]
		]);
		expect(t.rows[1].components).toEqual([
			{ tm1: 2, tm2: -1, coefficient: exactSqrt(1, 1n, 3n) },
			{ tm1: 0, tm2: 1, coefficient: exactSqrt(1, 2n, 3n) }
		]);
		expect(t.rows[4].components).toEqual([
			{ tm1: 2, tm2: -1, coefficient: exactSqrt(1, 2n, 3n) },
			{ tm1: 0, tm2: 1, coefficient: exactSqrt(-1, 1n, 3n) }
		]);
		expect(t.rows[0].components).toEqual([{ tm1: 2, tm2: 1, coefficient: exactSqrt(1, 1n, 1n) }]);
	});

	it('1/2 ⊗ 1/2 inverse: |1/2, −1/2⟩ = sqrt(1/2)|1 0⟩ + sqrt(1/2)|0 0⟩ and |−1/2, 1/2⟩ = sqrt(1/2)|1 0⟩ − sqrt(1/2)|0 0⟩ (PDG table, 1/2 × 1/2)', () => {
		const t = couplingTable(1, 1);
		expect(t.inverse.map((r) => [r.tm1, r.tm2])).toEqual([
			[1, 1],
			[1, -1],
			[-1, 1],
			[-1, -1]
		]);
		expect(t.inverse[1].components).toEqual([
			{ twoJ: 2, twoM: 0, coefficient: exactSqrt(1, 1n, 2n) },
			{ twoJ: 0, twoM: 0, coefficient: exactSqrt(1, 1n, 2n) }
		]);
		expect(t.inverse[2].components).toEqual([
			{ twoJ: 2, twoM: 0, coefficient: exactSqrt(1, 1n, 2n) },
			{ twoJ: 0, twoM: 0, coefficient: exactSqrt(-1, 1n, 2n) }
		]);
	});

	it('1 ⊗ 1: |1 0⟩ = sqrt(1/2)|1, −1⟩ − sqrt(1/2)|−1, 1⟩, the |0, 0⟩ coefficient being zero and left out (PDG table, 1 × 1)', () => {
		const row = couplingTable(2, 2).rows.find((r) => r.twoJ === 2 && r.twoM === 0);
		expect(row?.components).toEqual([
			{ tm1: 2, tm2: -2, coefficient: exactSqrt(1, 1n, 2n) },
			{ tm1: -2, tm2: 2, coefficient: exactSqrt(-1, 1n, 2n) }
		]);
	});

	it('is orthonormal and complete, and the inverse is the transpose (property over j1, j2 ≤ 4; exact norms, float cross terms)', () => {
		fc.assert(
			fc.property(fc.integer({ min: 0, max: 8 }), fc.integer({ min: 0, max: 8 }), (tj1, tj2) => {
				const t = couplingTable(tj1, tj2);
				expect(t.rows.length).toBe((tj1 + 1) * (tj2 + 1));
				expect(t.inverse.length).toBe((tj1 + 1) * (tj2 + 1));
				for (const r of t.rows) expect(sumOfSquares(r.components)).toEqual({ num: 1n, den: 1n });
				for (const r of t.inverse) expect(sumOfSquares(r.components)).toEqual({ num: 1n, den: 1n });
				for (const a of t.rows) {
					for (const b of t.rows) {
						if (a === b || a.twoM !== b.twoM) continue;
						let dot = 0;
						for (const ca of a.components) {
							const cb = b.components.find((c) => c.tm1 === ca.tm1);
							if (cb) dot += exactToNumber(ca.coefficient) * exactToNumber(cb.coefficient);
						}
						expect(Math.abs(dot)).toBeLessThan(FLOAT_TOLERANCE);
					}
				}
				for (const u of t.inverse) {
					for (const c of u.components) {
						const row = t.rows.find((r) => r.twoJ === c.twoJ && r.twoM === c.twoM);
						expect(row?.components.find((x) => x.tm1 === u.tm1 && x.tm2 === u.tm2)?.coefficient).toEqual(c.coefficient);
					}
				}
			}),
			{ numRuns: 40 }
		);
	});

	it(`refuses j above ${MAX_J_COUPLING_TABLE} and names the argument`, () => {
		expect(() => couplingTable(2 * MAX_J_COUPLING_TABLE + 1, 1)).toThrow(
			`couplingTable: j1 must be given as twice its value, an integer from 0 to ${2 * MAX_J_COUPLING_TABLE}`
		);
		expect(() => couplingTable(1, -1)).toThrow(/j2 must be/);
		expect(() => couplingTable(1, 0.5)).toThrow(/got 0.5/);
		expect(couplingTable(2 * MAX_J_COUPLING_TABLE, 2 * MAX_J_COUPLING_TABLE).rows.length).toBe(441);
	});

	it('writes kets as |3/2, −1/2⟩ style labels', () => {
		expect(ketLabel(3, -1)).toBe('|3/2, -1/2⟩');
		expect(ketLabel(4, 0)).toBe('|2, 0⟩');
	});
});
