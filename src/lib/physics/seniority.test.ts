import { describe, expect, it } from 'vitest';
import { seniorityTable, senioritiesOf } from './seniority';
import { termsOf } from './terms';
import { parseConfiguration } from './parse';

/** Seniority counts written out one per occurrence: [{ v: 3, count: 2 }] → [3, 3]. */
function perOccurrence(list: { seniority: number; count: number }[]): number[] {
	return list.flatMap((s) => Array<number>(s.count).fill(s.seniority));
}

/** "2D:1,3" style summary of a seniority table (one seniority per occurrence, as the tables print them). */
function table(l: number, N: number): string {
	return seniorityTable(l, N)
		.map((t) => `${t.twoS + 1}${'SPDFGHIKLMNOQ'[t.L]}:${perOccurrence(t.seniorities).join(',')}`)
		.join(' ');
}

describe('Racah seniority of d^N terms', () => {
	// Source for this block: Racah, Phys. Rev. 63, 367 (1943); the seniority labels of the d^N
	// terms in Nielson & Koster (1963) and Condon & Shortley (1935) ch. VII (terms of d^N that
	// first appear in d^v carry seniority v).
	it('d1: 2D has seniority 1', () => {
		expect(table(2, 1)).toBe('2D:1');
	});
	it('d2: 1S has seniority 0, 1D 1G 3P 3F seniority 2', () => {
		expect(table(2, 2)).toBe('1S:0 1D:2 1G:2 3P:2 3F:2');
	});
	it('d3: 2D occurs with v = 1 and v = 3, all other terms v = 3', () => {
		expect(table(2, 3)).toBe('2P:3 2D:1,3 2F:3 2G:3 2H:3 4P:3 4F:3');
	});
	it('d4: 1S (0, 4), 1D 1G 3P 3F (2, 4), the rest 4', () => {
		expect(table(2, 4)).toBe('1S:0,4 1D:2,4 1F:4 1G:2,4 1I:4 3P:2,4 3D:4 3F:2,4 3G:4 3H:4 5D:4');
	});
	it('d5: 2D (1, 3, 5), 2F and 2G (3, 5), 4P and 4F 3, 4D 4G 6S 2S 2I 5', () => {
		expect(table(2, 5)).toBe('2S:5 2P:3 2D:1,3,5 2F:3,5 2G:3,5 2H:3 2I:5 4P:3 4D:5 4F:3 4G:5 6S:5');
	});
	it('d7 has the seniorities of d3 (holes)', () => {
		expect(table(2, 7)).toBe(table(2, 3));
	});
});

describe('Racah seniority of f^N terms', () => {
	// Source: Nielson & Koster (1963) tables of f^N; Racah, Phys. Rev. 76, 1352 (1949).
	it('f3: 2F occurs with v = 1 and v = 3; 2D twice with v = 3; 4S has v = 3', () => {
		expect(senioritiesOf(3, 3, 1, 3)).toEqual([
			{ seniority: 1, count: 1 },
			{ seniority: 3, count: 1 }
		]);
		expect(senioritiesOf(3, 3, 1, 2)).toEqual([{ seniority: 3, count: 2 }]);
		expect(senioritiesOf(3, 3, 3, 0)).toEqual([{ seniority: 3, count: 1 }]);
	});
	it('f2: 1S v = 0, the others v = 2', () => {
		expect(table(3, 2)).toBe('1S:0 1D:2 1G:2 1I:2 3P:2 3F:2 3H:2');
	});
	it('f7: 8S has seniority 7, and the 2F of f1 survives in f7 with seniority 1', () => {
		// Racah (1943): a term of l^v reappears in l^(v+2), l^(v+4), … with the same seniority.
		expect(senioritiesOf(3, 7, 7, 0)).toEqual([{ seniority: 7, count: 1 }]);
		expect(senioritiesOf(3, 7, 1, 3)[0].seniority).toBe(1);
	});
	it('a term absent from the configuration has no seniorities', () => {
		expect(senioritiesOf(2, 2, 2, 2)).toEqual([]);
	});
});

describe('seniorities attached by termsOf', () => {
	it('[Ar] 3d3 4s2 (one open subshell) carries the d3 seniorities', () => {
		const d = termsOf(parseConfiguration('[Ar] 3d3 4s2')).find((t) => t.twoS === 1 && t.L === 2);
		expect(perOccurrence(d?.seniorities ?? [])).toEqual([1, 3]);
	});
	it('3d5 4s (two open subshells) has none', () => {
		expect(termsOf(parseConfiguration('3d5 4s')).every((t) => t.seniorities === null)).toBe(true);
	});
	it('closed shells only: 1S with seniority 0', () => {
		expect(termsOf(parseConfiguration('[Ne]'))).toEqual([{ twoS: 0, L: 0, count: 1, seniorities: [{ seniority: 0, count: 1 }] }]);
	});
	it('every term of f^N has seniority counts adding up to its occurrences, each v ≤ N′ and of the parity of N', () => {
		for (let N = 1; N <= 14; N++) {
			const top = Math.min(N, 14 - N);
			for (const t of termsOf(parseConfiguration(`4f${N}`))) {
				expect(perOccurrence(t.seniorities ?? [])).toHaveLength(t.count);
				for (const v of perOccurrence(t.seniorities ?? [])) {
					expect(v).toBeLessThanOrEqual(top);
					expect((top - v) % 2).toBe(0);
				}
			}
		}
	});
});

describe('seniority of large subshells, as counts', () => {
	// Regression: 12o23 and 10m19 once listed one seniority per occurrence (10⁸ entries for one
	// term) and ran the server out of memory. Counts keep the table as small as the term list.
	it('10m19 (l = 9): every term has at most 10 seniority counts, adding up to its occurrences', () => {
		for (const t of seniorityTable(9, 19)) {
			expect(t.seniorities.length).toBeLessThanOrEqual(10); // v = 1, 3, …, 19
			expect(t.seniorities.every((s) => s.count > 0 && s.seniority % 2 === 1)).toBe(true);
		}
	});
	it('d5 holes: d5 ²D occurs three times, once each with v = 1, 3, 5 (Racah 1943)', () => {
		expect(senioritiesOf(2, 5, 1, 2)).toEqual([
			{ seniority: 1, count: 1 },
			{ seniority: 3, count: 1 },
			{ seniority: 5, count: 1 }
		]);
	});
});
