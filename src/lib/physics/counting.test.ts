import { describe, expect, it } from 'vitest';
import { levelsFromProjections, subsetSumRows, toSafeNumber } from './counting';

describe('shared counting', () => {
	it('two of the m_l = −1, 0, 1 of a p orbital sum to −1, 0, 1 once each; three to 0 once (general fact, by hand)', () => {
		const { rows, offsets } = subsetSumRows([-1, 0, 1]);
		expect(rows[2]).toEqual([1, 1, 1]);
		expect(offsets[2]).toBe(1);
		expect(rows[3]).toEqual([1]);
	});

	it('k-subsets of the 2l+1 values number C(2l+1, k) (binomial theorem)', () => {
		const { rows } = subsetSumRows([-3, -2, -1, 0, 1, 2, 3]);
		const C7 = [1, 7, 21, 35, 35, 21, 7, 1];
		expect(rows.map((r) => r.reduce((a, b) => a + b, 0))).toEqual(C7);
	});

	it('(3/2)²: doubled m = −3, −1, 1, 3 give J = 0 and J = 2 (the j² states of equivalent electrons, de-Shalit & Talmi 1963)', () => {
		const { rows, offsets } = subsetSumRows([-3, -1, 1, 3]);
		const byTwoM = new Map(rows[2].map((n, i) => [i - offsets[2], n] as [number, number]).filter(([, n]) => n > 0));
		expect([...levelsFromProjections(byTwoM)]).toEqual([
			[0, 1],
			[4, 1]
		]);
	});

	it('refuses a set that is not symmetric about 0', () => {
		expect(() => subsetSumRows([0, 1, 2])).toThrow(/symmetric about 0/);
	});

	it('reports counts above 2^53 as an error naming the quantity', () => {
		expect(toSafeNumber(5n, 'x')).toBe(5);
		expect(() => toSafeNumber(2n ** 60n, 'the number of 2D terms')).toThrow(/the number of 2D terms is 1152921504606846976/);
	});
});
