import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { levelCountsByJ, levelLabel, levelsOf, statisticalWeight, termAndLevelCounts, termLabel, termSummary, termsOf } from './terms';
import { microstateTotal } from './microstates';
import { configurationOf, parseConfiguration } from './parse';

const summary = (text: string) => termSummary(termsOf(parseConfiguration(text)));

describe('terms of equivalent p and d electrons', () => {
	// Source for this block: Condon & Shortley (1935), ch. VII, table of the Russell–Saunders
	// terms of equivalent electrons; the same list in Cowan (1981), table of LS terms of l^N.
	it('p1 and p5 give 2P', () => {
		expect(summary('2p')).toBe('2P');
		expect(summary('2p5')).toBe('2P');
	});
	it('p2 gives 1S 1D 3P (and so does p4)', () => {
		expect(summary('2p2')).toBe('1S 1D 3P');
		expect(summary('2p4')).toBe('1S 1D 3P');
	});
	it('p3 gives 2P 2D 4S', () => {
		expect(summary('2p3')).toBe('2P 2D 4S');
	});
	it('d2 gives 1S 1D 1G 3P 3F', () => {
		expect(summary('3d2')).toBe('1S 1D 1G 3P 3F');
	});
	it('d3 gives 2P 2D(2) 2F 2G 2H 4P 4F', () => {
		expect(summary('3d3')).toBe('2P 2D(2) 2F 2G 2H 4P 4F');
	});
	it('d4 gives 1S(2) 1D(2) 1F 1G(2) 1I 3P(2) 3D 3F(2) 3G 3H 5D', () => {
		expect(summary('3d4')).toBe('1S(2) 1D(2) 1F 1G(2) 1I 3P(2) 3D 3F(2) 3G 3H 5D');
	});
	it('d5 gives 2S 2P 2D(3) 2F(2) 2G(2) 2H 2I 4P 4D 4F 4G 6S', () => {
		expect(summary('3d5')).toBe('2S 2P 2D(3) 2F(2) 2G(2) 2H 2I 4P 4D 4F 4G 6S');
	});
	it('d6 … d9 repeat d4 … d1 (electron–hole symmetry)', () => {
		for (let N = 1; N <= 4; N++) expect(summary(`3d${10 - N}`)).toBe(summary(`3d${N}`));
	});
	it('a closed subshell gives 1S only', () => {
		expect(summary('2p6')).toBe('1S');
		expect(summary('[Xe]')).toBe('1S');
	});
});

describe('terms of equivalent f electrons', () => {
	// Source: Cowan (1981) and Nielson & Koster (1963), terms of f^N; the counts of terms and of
	// levels per f^N are from memory of Cowan's table of f^N term and level numbers.
	it('f2 gives 1S 1D 1G 1I 3P 3F 3H', () => {
		expect(summary('4f2')).toBe('1S 1D 1G 1I 3P 3F 3H');
	});
	it('f3 gives 2P 2D(2) 2F(2) 2G(2) 2H(2) 2I 2K 2L 4S 4D 4F 4G 4I', () => {
		expect(summary('4f3')).toBe('2P 2D(2) 2F(2) 2G(2) 2H(2) 2I 2K 2L 4S 4D 4F 4G 4I');
	});
	it('f^n has 1, 7, 17, 47, 73, 119, 119 terms and 2, 13, 41, 107, 198, 295, 327 levels for n = 1 … 7', () => {
		const terms = [1, 7, 17, 47, 73, 119, 119];
		const levels = [2, 13, 41, 107, 198, 295, 327];
		for (let n = 1; n <= 7; n++) {
			const counts = termAndLevelCounts(termsOf(parseConfiguration(`4f${n}`)));
			expect(counts).toEqual({ terms: terms[n - 1], levels: levels[n - 1] });
			const hole = termAndLevelCounts(termsOf(parseConfiguration(`4f${14 - n}`)));
			expect(hole).toEqual(counts);
		}
	});
	it('f7 contains 8S once (the Gd³⁺ ground term)', () => {
		const t = termsOf(parseConfiguration('4f7')).find((x) => x.twoS === 7);
		expect(t).toMatchObject({ twoS: 7, L: 0, count: 1 });
	});
});

describe('terms of non-equivalent electrons', () => {
	// Source: vector coupling of two electrons, L = |l1−l2| … l1+l2, S = 0, 1 (Condon & Shortley
	// 1935; general textbook fact).
	it('2p 3p gives 1S 1P 1D 3S 3P 3D', () => {
		expect(summary('2p 3p')).toBe('1S 1P 1D 3S 3P 3D');
	});
	it('2p 3d gives 1P 1D 1F 3P 3D 3F', () => {
		expect(summary('2p 3d')).toBe('1P 1D 1F 3P 3D 3F');
	});
	it('3d 4s gives 1D 3D', () => {
		expect(summary('3d 4s')).toBe('1D 3D');
	});
	it('3d5 4s has 7S once and 5S once (both from 6S of d5 coupled to s)', () => {
		const t = termsOf(parseConfiguration('3d5 4s'));
		expect(t.find((x) => x.twoS === 6 && x.L === 0)?.count).toBe(1);
		expect(t.find((x) => x.twoS === 4 && x.L === 0)?.count).toBe(1);
	});
});

describe('levels and weights', () => {
	it('4F has levels J = 3/2, 5/2, 7/2, 9/2 with weights 4, 6, 8, 10', () => {
		// J = |L−S| … L+S (vector model, general fact).
		expect(levelsOf({ twoS: 3, L: 3 })).toEqual([
			{ twoJ: 3, weight: 4 },
			{ twoJ: 5, weight: 6 },
			{ twoJ: 7, weight: 8 },
			{ twoJ: 9, weight: 10 }
		]);
	});
	it('the statistical weight (2S+1)(2L+1) equals Σ(2J+1): 3P is 9, 4F is 28', () => {
		expect(statisticalWeight({ twoS: 2, L: 1 })).toBe(9);
		expect(statisticalWeight({ twoS: 3, L: 3 })).toBe(28);
		for (let twoS = 0; twoS <= 8; twoS++) {
			for (let L = 0; L <= 8; L++) {
				const sum = levelsOf({ twoS, L }).reduce((a, v) => a + v.weight, 0);
				expect(sum).toBe(statisticalWeight({ twoS, L }));
			}
		}
	});
	it('p2 has levels 1S0, 1D2, 3P0, 3P1, 3P2: two with J = 0, one with J = 1, two with J = 2', () => {
		expect([...levelCountsByJ(parseConfiguration('2p2')).entries()]).toEqual([
			[0, 2],
			[2, 1],
			[4, 2]
		]);
	});
	it('labels: 4F, 4F°, 4F3/2, 3P°2', () => {
		expect(termLabel({ twoS: 3, L: 3 })).toBe('4F');
		expect(termLabel({ twoS: 3, L: 3 }, { parity: 'odd' })).toBe('4F°');
		expect(levelLabel({ twoS: 3, L: 3 }, 3)).toBe('4F3/2');
		expect(levelLabel({ twoS: 2, L: 1 }, 4, { parity: 'odd' })).toBe('3P°2');
		expect(() => levelLabel({ twoS: 2, L: 1 }, 6)).toThrow(/not a level of 3P/);
	});
	it('a negative 2S is refused', () => {
		expect(() => levelsOf({ twoS: -1, L: 0 })).toThrow(/2S must be a non-negative integer/);
	});
});

describe('invariants on random configurations', () => {
	const subshellArb = fc
		.integer({ min: 1, max: 9 })
		.chain((n) =>
			fc
				.integer({ min: 0, max: Math.min(n - 1, 4) })
				.chain((l) => fc.integer({ min: 1, max: 4 * l + 2 }).map((occupancy) => ({ n, l, occupancy })))
		);
	const configArb = fc.uniqueArray(subshellArb, { minLength: 1, maxLength: 4, selector: (s) => `${s.n},${s.l}` });

	it('Σ statistical weight × count equals the number of microstates', () => {
		fc.assert(
			fc.property(configArb, (subshells) => {
				const cfg = configurationOf(subshells);
				const sum = termsOf(cfg).reduce((a, t) => a + BigInt(statisticalWeight(t) * t.count), 0n);
				expect(sum).toBe(microstateTotal(cfg));
			}),
			{ numRuns: 150 }
		);
	});

	it('levelCountsByJ (from the M_J distribution) equals the levels of the term list', () => {
		fc.assert(
			fc.property(configArb, (subshells) => {
				const cfg = configurationOf(subshells);
				const fromTerms = new Map<number, number>();
				for (const t of termsOf(cfg)) for (const v of levelsOf(t)) fromTerms.set(v.twoJ, (fromTerms.get(v.twoJ) ?? 0) + t.count);
				const expected = [...fromTerms.entries()].sort((a, b) => a[0] - b[0]);
				expect([...levelCountsByJ(cfg).entries()]).toEqual(expected);
			}),
			{ numRuns: 150 }
		);
	});

	it('terms are sorted by multiplicity then L, each occurring at least once', () => {
		fc.assert(
			fc.property(configArb, (subshells) => {
				const terms = termsOf(subshells);
				for (let i = 1; i < terms.length; i++) {
					const a = terms[i - 1];
					const b = terms[i];
					expect(a.twoS < b.twoS || (a.twoS === b.twoS && a.L < b.L)).toBe(true);
				}
				expect(terms.every((t) => t.count >= 1)).toBe(true);
			}),
			{ numRuns: 100 }
		);
	});
});
