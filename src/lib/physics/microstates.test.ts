import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	MAX_GRID_WORK,
	binomial,
	countAt,
	decomposeGrid,
	gridTotal,
	maxMLOf,
	microstateGrid,
	microstateTotal,
	mjCounts,
	subshellGrid
} from './microstates';
import { configurationOf, parseConfiguration } from './parse';
import type { Subshell } from './types';

/** Random configurations of 1–4 distinct subshells with l ≤ 4 (built with fast-check). */
const subshellArb = fc
	.integer({ min: 1, max: 9 })
	.chain((n) =>
		fc
			.integer({ min: 0, max: Math.min(n - 1, 4) })
			.chain((l) => fc.integer({ min: 1, max: 4 * l + 2 }).map((occupancy) => ({ n, l, occupancy })))
	);
const configArb = fc.uniqueArray(subshellArb, { minLength: 1, maxLength: 4, selector: (s) => `${s.n},${s.l}` });

describe('binomial coefficients', () => {
	it('C(10, 5) = 252, C(14, 7) = 3432, C(6, 0) = 1, C(6, 7) = 0', () => {
		// General fact (Pascal's triangle).
		expect(binomial(10, 5)).toBe(252n);
		expect(binomial(14, 7)).toBe(3432n);
		expect(binomial(6, 0)).toBe(1n);
		expect(binomial(6, 7)).toBe(0n);
	});

	it('C(66, 33) is exact beyond 2^53', () => {
		// 7 219 428 434 016 265 740 (general fact; checked by Pascal's rule below).
		expect(binomial(66, 33)).toBe(7219428434016265740n);
		expect(binomial(66, 33)).toBe(binomial(65, 32) + binomial(65, 33));
	});
});

describe('microstate totals', () => {
	it('3d5 4s has 504 microstates (252 × 2)', () => {
		// C(10,5) · C(2,1) = 252 · 2 (Condon & Shortley 1935, counting of determinants).
		expect(microstateTotal(parseConfiguration('3d5 4s'))).toBe(504n);
	});

	it('p2 has 15, d2 45, f7 3432, and closed shells only 1', () => {
		// C(6,2) = 15, C(10,2) = 45, C(14,7) = 3432 (general fact).
		expect(microstateTotal(parseConfiguration('2p2'))).toBe(15n);
		expect(microstateTotal(parseConfiguration('3d2'))).toBe(45n);
		expect(microstateTotal(parseConfiguration('4f7'))).toBe(3432n);
		expect(microstateTotal(parseConfiguration('[Xe]'))).toBe(1n);
	});

	it('the grid sums to the product of binomials on random configurations', () => {
		fc.assert(
			fc.property(configArb, (subshells) => {
				const cfg = configurationOf(subshells);
				let product = 1n;
				for (const s of subshells) product *= binomial(4 * s.l + 2, s.occupancy);
				expect(microstateTotal(cfg)).toBe(product);
				expect(gridTotal(microstateGrid(cfg))).toBe(product);
			}),
			{ numRuns: 150 }
		);
	});

	it('counts beyond 2^53 stay exact (5g9 6h11 7i13: 48620 · 705432 · 10400600)', () => {
		// C(18,9) = 48620, C(22,11) = 705432, C(26,13) = 10400600 (general fact).
		const cfg = parseConfiguration('5g9 6h11 7i13');
		const expected = 48620n * 705432n * 10400600n;
		expect(expected > BigInt(Number.MAX_SAFE_INTEGER)).toBe(true);
		expect(gridTotal(microstateGrid(cfg))).toBe(expected);
	});
});

describe('the p2 grid', () => {
	it('matches the textbook p² table: 1 at (2,0); 1, 2, 1 at M_L = 1; 1, 3, 1 at M_L = 0', () => {
		// The (M_L, M_S) table of p² drawn in Condon & Shortley (1935) ch. 7 and in most
		// textbooks (e.g. Cowan 1981): 15 determinants.
		const g = microstateGrid(parseConfiguration('2p2'));
		expect(g.maxML).toBe(2);
		expect(g.minML).toBe(-2);
		expect(g.maxTwoMS).toBe(2);
		const row = (ML: number) => [2, 0, -2].map((twoMS) => countAt(g, ML, twoMS));
		expect(row(2)).toEqual([0n, 1n, 0n]);
		expect(row(1)).toEqual([1n, 2n, 1n]);
		expect(row(0)).toEqual([1n, 3n, 1n]);
		expect(row(-1)).toEqual([1n, 2n, 1n]);
		expect(row(-2)).toEqual([0n, 1n, 0n]);
	});

	it('countAt is 0 outside the grid and for 2M_S of the wrong parity', () => {
		const g = subshellGrid(1, 2);
		expect(countAt(g, 3, 0)).toBe(0n);
		expect(countAt(g, 0, 1)).toBe(0n);
		expect(countAt(g, 0, 4)).toBe(0n);
		expect(countAt(g, 0.5, 0)).toBe(0n);
	});

	it('decomposes into 1S 1D 3P', () => {
		// Condon & Shortley (1935) ch. 7; general textbook fact.
		expect(decomposeGrid(subshellGrid(1, 2)).map((t) => [t.twoS + 1, t.L, t.count])).toEqual([
			[1, 0, 1n],
			[1, 2, 1n],
			[3, 1, 1n]
		]);
	});
});

describe('grid shape', () => {
	it('largest M_L of d3 is 5, of f7 12, of f14 0', () => {
		// Pauli principle: fill m_l = l twice, then l − 1 … (general fact).
		expect(maxMLOf(2, 3)).toBe(5);
		expect(maxMLOf(3, 7)).toBe(12);
		expect(maxMLOf(3, 14)).toBe(0);
	});

	it('grids are symmetric under M_L → −M_L and M_S → −M_S (random configurations)', () => {
		fc.assert(
			fc.property(configArb, (subshells) => {
				const g = microstateGrid(subshells);
				for (let ML = g.minML; ML <= g.maxML; ML++) {
					for (let twoMS = -g.maxTwoMS; twoMS <= g.maxTwoMS; twoMS += 2) {
						const v = countAt(g, ML, twoMS);
						expect(countAt(g, -ML, twoMS)).toBe(v);
						expect(countAt(g, ML, -twoMS)).toBe(v);
					}
				}
			}),
			{ numRuns: 100 }
		);
	});

	it('l^N and l^(4l+2−N) have the same grid (electron–hole symmetry)', () => {
		// Condon & Shortley (1935): a subshell with N electrons and one with N holes have the same terms.
		for (const [l, N] of [
			[1, 2],
			[2, 3],
			[3, 5],
			[4, 2]
		]) {
			expect(subshellGrid(l, 4 * l + 2 - N).counts).toEqual(subshellGrid(l, N).counts);
		}
	});

	it('the convolution of two subshells equals the sum over pairs of their cells', () => {
		// Independent check of the 2-D convolution: direct double sum over the two grids.
		const a = subshellGrid(2, 3);
		const b = subshellGrid(1, 2);
		const g = microstateGrid([
			{ n: 3, l: 2, occupancy: 3 },
			{ n: 4, l: 1, occupancy: 2 }
		] as Subshell[]);
		for (let ML = g.minML; ML <= g.maxML; ML++) {
			for (let twoMS = -g.maxTwoMS; twoMS <= g.maxTwoMS; twoMS += 2) {
				let sum = 0n;
				for (let m1 = a.minML; m1 <= a.maxML; m1++)
					for (let s1 = -a.maxTwoMS; s1 <= a.maxTwoMS; s1 += 2) sum += countAt(a, m1, s1) * countAt(b, ML - m1, twoMS - s1);
				expect(countAt(g, ML, twoMS)).toBe(sum);
			}
		}
	});

	it('M_J counts of a single s electron are one state each at M_J = ±1/2', () => {
		const mj = mjCounts(subshellGrid(0, 1));
		expect([...mj.entries()]).toEqual([
			[-1, 1n],
			[1, 1n]
		]);
	});

	it('subshellGrid refuses N above 2(2l+1)', () => {
		expect(() => subshellGrid(1, 7)).toThrow(/from 0 to 6/);
	});

	it(`refuses configurations whose grid would need more than ${MAX_GRID_WORK.toExponential(0)} operations`, () => {
		expect(() => microstateGrid(parseConfiguration('7i13 8i13 9i13 10i13 11i13 12i13'))).toThrow(
			/counting work of this configuration .* over the limit of 4\.0e\+8/
		);
	});
});
