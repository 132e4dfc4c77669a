import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MAX_JJ_LEVELS, assertLsJjAgree, jGroupJCounts, jGroupSeniorities, jjLevelCountsByJ, jjLevels } from './jj';
import { ConfigurationError, parseConfiguration } from './parse';
import { levelCountsByJ } from './terms';
import type { Subshell } from './types';

const cfg = parseConfiguration;

/** "0:2 1:1 2:2" from a 2J → count map, J written as a half-integer string. */
function countsText(m: Map<number, number>): string {
	return [...m].map(([twoJ, n]) => `${twoJ % 2 === 0 ? twoJ / 2 : `${twoJ}/2`}:${n}`).join(' ');
}

/** The J values of j^k with repeats, as half-integer strings ("2", "3/2"). */
function groupJs(twoJsub: number, k: number): string[] {
	const out: string[] = [];
	for (const [twoJ, n] of jGroupJCounts(twoJsub, k)) for (let i = 0; i < n; i++) out.push(twoJ % 2 === 0 ? `${twoJ / 2}` : `${twoJ}/2`);
	return out;
}

function binomial(n: number, k: number): number {
	let r = 1;
	for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
	return Math.round(r);
}

describe('J values of j^k equivalent electrons', () => {
	it('a single j electron, a closed j-subshell and an empty one: j; 0; 0', () => {
		expect(groupJs(5, 1)).toEqual(['5/2']);
		expect(groupJs(5, 6)).toEqual(['0']);
		expect(groupJs(7, 0)).toEqual(['0']);
	});
	it('(3/2)^2 → 0, 2 and (3/2)^3 → 3/2 (Condon & Shortley 1935 ch. 10, jj coupling of p²/p³; also the hole rule)', () => {
		expect(groupJs(3, 2)).toEqual(['0', '2']);
		expect(groupJs(3, 3)).toEqual(['3/2']);
	});
	it('(5/2)^2 → 0, 2, 4 and (5/2)^3 → 3/2, 5/2, 9/2 (de-Shalit & Talmi 1963, table of jⁿ states; from memory)', () => {
		expect(groupJs(5, 2)).toEqual(['0', '2', '4']);
		expect(groupJs(5, 3)).toEqual(['3/2', '5/2', '9/2']);
	});
	it('(7/2)^2 → 0, 2, 4, 6; (7/2)^3 → 3/2, 5/2, 7/2, 9/2, 11/2, 15/2; (7/2)^4 → 0, 2, 2, 4, 4, 5, 6, 8 (standard jⁿ table, de-Shalit & Talmi 1963; from memory)', () => {
		expect(groupJs(7, 2)).toEqual(['0', '2', '4', '6']);
		expect(groupJs(7, 3)).toEqual(['3/2', '5/2', '7/2', '9/2', '11/2', '15/2']);
		expect(groupJs(7, 4)).toEqual(['0', '2', '2', '4', '4', '5', '6', '8']);
	});
	it('(9/2)^3 → 3/2, 5/2, 7/2, 9/2 (twice), 11/2, 13/2, 15/2, 17/2, 21/2 (standard jⁿ table, from memory; no 19/2 since M = 19/2 is reached in one way only, as M = 21/2)', () => {
		expect(groupJs(9, 3)).toEqual(['3/2', '5/2', '7/2', '9/2', '9/2', '11/2', '13/2', '15/2', '17/2', '21/2']);
	});
	it('splits (7/2)^4 by seniority: v=0: 0; v=2: 2, 4, 6; v=4: 2, 4, 5, 8 (de-Shalit & Talmi 1963; from memory)', () => {
		const bySeniority = (v: number) =>
			jGroupSeniorities(7, 4)
				.filter((g) => g.seniority === v)
				.map((g) => g.twoJ / 2);
		expect(bySeniority(0)).toEqual([0]);
		expect(bySeniority(2)).toEqual([2, 4, 6]);
		expect(bySeniority(4)).toEqual([2, 4, 5, 8]);
	});
	it('(9/2)^4 has two seniority-4 states each of J = 4 and J = 6 (the known repeated states of the g9/2 shell, de-Shalit & Talmi 1963; from memory)', () => {
		const v4 = jGroupSeniorities(9, 4).filter((g) => g.seniority === 4);
		expect(v4.find((g) => g.twoJ === 8)?.count).toBe(2);
		expect(v4.find((g) => g.twoJ === 12)?.count).toBe(2);
	});
	it('has the state count C(2j+1, k) and the same J values for k and 2j+1−k electrons (property; Pauli principle and particle–hole symmetry)', () => {
		fc.assert(
			fc.property(fc.integer({ min: 0, max: 8 }), fc.nat(), (i, kk) => {
				const twoJsub = 2 * i + 1;
				const k = kk % (twoJsub + 2);
				let states = 0;
				for (const [twoJ, n] of jGroupJCounts(twoJsub, k)) states += n * (twoJ + 1);
				expect(states).toBe(binomial(twoJsub + 1, k));
				expect(jGroupJCounts(twoJsub, twoJsub + 1 - k)).toEqual(jGroupJCounts(twoJsub, k));
				let bySeniority = 0;
				for (const g of jGroupSeniorities(twoJsub, k)) bySeniority += g.count * (g.twoJ + 1);
				expect(bySeniority).toBe(states);
			}),
			{ numRuns: 100 }
		);
	});
	it('names the bad argument', () => {
		expect(() => jGroupJCounts(4, 1)).toThrow('jGroupJCounts: twoJsub must be twice a half-integer j (1, 3, 5, …), got 4');
		expect(() => jGroupJCounts(3, 5)).toThrow('k must be an integer from 0 to 4 for j = 3/2, got 5');
	});
});

describe('jj levels of configurations', () => {
	it('p²: (1/2)² J = 0; (1/2, 3/2) J = 1, 2; (3/2)² J = 0, 2 — J counts 0:2 1:1 2:2, as LS ¹S₀ ³P₀,₁,₂ ¹D₂ (Condon & Shortley 1935 ch. 10; Cowan 1981 ch. 4)', () => {
		const levels = jjLevels(cfg('2p2'));
		expect(levels.map((l) => l.label)).toEqual([
			'2p1/2^2 (0)_0',
			'2p1/2 2p3/2 (1/2, 3/2)_1',
			'2p1/2 2p3/2 (1/2, 3/2)_2',
			'2p3/2^2 (0)_0',
			'2p3/2^2 (2)_2'
		]);
		expect(countsText(jjLevelCountsByJ(cfg('2p2')))).toBe('0:2 1:1 2:2');
		expect(countsText(levelCountsByJ(cfg('2p2')))).toBe('0:2 1:1 2:2');
	});

	it('np n′p: 10 levels, J counts 0:2 1:4 2:3 3:1, as the LS terms ¹S ¹P ¹D ³S ³P ³D of two inequivalent p electrons (Condon & Shortley 1935; Cowan 1981 ch. 4)', () => {
		const levels = jjLevels(cfg('2p 3p'));
		expect(levels).toHaveLength(10);
		expect(countsText(jjLevelCountsByJ(cfg('2p 3p')))).toBe('0:2 1:4 2:3 3:1');
		expect(levels.filter((l) => l.subshellLabel === '2p3/2 3p3/2').map((l) => l.twoJ / 2)).toEqual([0, 1, 2, 3]);
	});

	it('d²: (3/2)² 0, 2; (3/2, 5/2) 1–4; (5/2)² 0, 2, 4 — J counts 0:2 1:1 2:3 3:1 4:2, as LS ¹S ¹D ¹G ³P ³F (Condon & Shortley 1935; Cowan 1981 ch. 4)', () => {
		expect(jjLevels(cfg('3d2'))).toHaveLength(9);
		expect(countsText(jjLevelCountsByJ(cfg('3d2')))).toBe('0:2 1:1 2:3 3:1 4:2');
	});

	it('p⁵s: 2p1/2² 2p3/2³ 3s gives (3/2, 1/2)_1,2 and 2p1/2 2p3/2⁴ 3s gives (1/2, 1/2)_0,1 (the familiar jj structure of the np⁵(n+1)s levels of the rare gases, Cowan 1981 ch. 4; common practice)', () => {
		expect(jjLevels(cfg('2p5 3s')).map((l) => l.label)).toEqual([
			'2p1/2^2 2p3/2^3 3s1/2 (3/2, 1/2)_1',
			'2p1/2^2 2p3/2^3 3s1/2 (3/2, 1/2)_2',
			'2p1/2 2p3/2^4 3s1/2 (1/2, 1/2)_0',
			'2p1/2 2p3/2^4 3s1/2 (1/2, 1/2)_1'
		]);
	});

	it('couples three open groups in order and records the running J: 2p 3d 4f', () => {
		const levels = jjLevels(cfg('2p 3d 4f'));
		const first = levels[0];
		expect(first.label).toBe('2p1/2 3d3/2 4f5/2 ((1/2, 3/2)_1, 5/2)_3/2');
		expect(first.intermediates).toEqual([2]);
		expect(first.parts.map((p) => [p.twoJsub, p.twoJgroup])).toEqual([
			[1, 1],
			[3, 3],
			[5, 5]
		]);
		expect(levels.at(-1)?.label).toBe('2p3/2 3d5/2 4f7/2 ((3/2, 5/2)_4, 7/2)_15/2');
		// Every level's intermediate J must couple the first two group J values (triangle rule).
		for (const l of levels) {
			const [a, b] = l.parts.map((p) => p.twoJgroup);
			const j12 = l.intermediates[0];
			expect(j12 >= Math.abs(a - b) && j12 <= a + b).toBe(true);
		}
	});

	it('gives structured label pieces for rendering sub- and superscripts, and leaves closed nl subshells out', () => {
		const l = jjLevels(cfg('1s2 2s2 2p2'))[0];
		expect(l.labelPieces).toEqual([{ n: 2, letter: 'p', j: '1/2', occupancy: 2 }]);
		expect(l.parts).toEqual([{ n: 2, l: 1, twoJsub: 1, occupancy: 2, twoJgroup: 0, seniority: 0, copy: 1, closed: true }]);
	});

	it('marks group J values that repeat in a j^k group with their seniority: 4f7/2^4 J = 2 occurs as v = 2 and v = 4', () => {
		const labels = jjLevels(cfg('4f4'))
			.filter((l) => l.subshellLabel === '4f7/2^4')
			.map((l) => l.couplingLabel);
		expect(labels).toEqual(['(0)_0', '(2[v=2])_2', '(2[v=4])_2', '(4[v=2])_4', '(4[v=4])_4', '(5)_5', '(6)_6', '(8)_8']);
	});

	it('a configuration of closed subshells has one level J = 0', () => {
		const levels = jjLevels(cfg('1s2 2s2 2p6'));
		expect(levels).toHaveLength(1);
		expect(levels[0]).toMatchObject({ twoJ: 0, couplingLabel: '(0)_0', parts: [] });
		expect(countsText(jjLevelCountsByJ(cfg('[Ar]')))).toBe('0:1');
	});

	it(`refuses to list more than ${MAX_JJ_LEVELS} levels, saying how many there are, but still counts them`, () => {
		expect(() => jjLevels(cfg('4f7 5d4 6p3'))).toThrow(`this configuration has 1157624 jj levels; at most ${MAX_JJ_LEVELS} can be listed`);
		let total = 0;
		for (const n of jjLevelCountsByJ(cfg('4f7 5d4 6p3')).values()) total += n;
		expect(total).toBe(1157624);
		expect(jjLevelCountsByJ(cfg('4f7 5d4 6p3'))).toEqual(levelCountsByJ(cfg('4f7 5d4 6p3')));
	});

	it('rejects an impossible subshell with the parser’s ConfigurationError', () => {
		expect(() => jjLevels([{ n: 2, l: 1, occupancy: 7 }])).toThrow(ConfigurationError);
		expect(() => jjLevelCountsByJ([{ n: 2, l: 2, occupancy: 1 }])).toThrow(/l must be smaller than n/);
	});
});

describe('LS and jj give the same levels of each J', () => {
	it('assertLsJjAgree names the first J where the counts differ', () => {
		expect(() =>
			assertLsJjAgree(
				new Map([
					[0, 2],
					[2, 1]
				]),
				new Map([
					[0, 2],
					[2, 2]
				])
			)
		).toThrow('LS and jj coupling disagree at J = 1: LS gives 1 level, jj gives 2');
		expect(() => assertLsJjAgree(new Map([[3, 1]]), new Map())).toThrow('at J = 3/2: LS gives 1 level, jj gives 0');
		expect(() => assertLsJjAgree(levelCountsByJ(cfg('3d3')), jjLevelCountsByJ(cfg('3d3')))).not.toThrow();
	});

	it('for d³ … f⁷ and mixed configurations (Condon & Shortley 1935 ch. 10; Cowan 1981 ch. 4: the J multiplicities do not depend on the coupling scheme)', () => {
		for (const text of ['3d3', '3d5', '4f3', '4f7', '3d5 4s', '3d7 4s 4p', '4f6 5d 6s', '5g3', '2p4 3p2']) {
			assertLsJjAgree(levelCountsByJ(cfg(text)), jjLevelCountsByJ(cfg(text)));
		}
	});

	const subshellList = fc
		.uniqueArray(fc.record({ l: fc.integer({ min: 0, max: 3 }), slot: fc.integer({ min: 0, max: 3 }), fill: fc.nat() }), {
			minLength: 1,
			maxLength: 3,
			selector: (s) => `${s.l},${s.slot}`
		})
		.map((list) => list.map(({ l, slot, fill }) => ({ n: l + 1 + slot, l, occupancy: 1 + (fill % (4 * l + 2)) }) satisfies Subshell));

	it('for random configurations of up to three s, p, d, f subshells (property, against levelCountsByJ of ./terms.ts)', () => {
		fc.assert(
			fc.property(subshellList, (subshells) => {
				expect(jjLevelCountsByJ(subshells)).toEqual(levelCountsByJ(subshells));
			}),
			{ numRuns: 120 }
		);
	});

	it('the listed levels match the counts, and Σ(2J+1) over levels is the number of microstates Π C(2(2l+1), N) (property)', () => {
		fc.assert(
			fc.property(subshellList, (subshells) => {
				const counts = jjLevelCountsByJ(subshells);
				let total = 0;
				for (const n of counts.values()) total += n;
				fc.pre(total <= 3000);
				const levels = jjLevels(subshells);
				const listed = new Map<number, number>();
				let weight = 0;
				for (const l of levels) {
					listed.set(l.twoJ, (listed.get(l.twoJ) ?? 0) + 1);
					weight += l.twoJ + 1;
				}
				expect(new Map([...listed].sort((a, b) => a[0] - b[0]))).toEqual(counts);
				expect(weight).toBe(subshells.reduce((p, s) => p * binomial(4 * s.l + 2, s.occupancy), 1));
				// Labels are unique within a configuration.
				expect(new Set(levels.map((l) => l.label)).size).toBe(levels.length);
			}),
			{ numRuns: 80 }
		);
	});
});
