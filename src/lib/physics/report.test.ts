import { parseConfiguration } from './parse';
import { describe, expect, it } from 'vitest';
import { termSheet } from './report';
import { BudgetError } from './budget';

describe('Term sheet', () => {
	it('3d5 4s: 504 microstates = Σ count·(2S+1)(2L+1), Hund level ⁷S₃ flagged as heuristic', () => {
		// 504 = C(10,5)·C(2,1) = 252·2 (combinatorics). ⁷S₃ is the ground level of neutral Cr,
		// 3d⁵4s (NIST/CRC periodic table of ground levels); two open subshells, so not rigorous.
		const s = termSheet(parseConfiguration('3d5 4s'));
		expect(s.microstates).toBe('504');
		expect(s.weightSum).toBe('504');
		expect(s.hund).toMatchObject({ level: '7S3', rigorous: false });
		expect(s.configuration.parity).toBe('even');
	});

	it('2p2 lists ¹S ¹D ³P with exact Landé g (g(³P₁) = 3/2, g(³P₂) = 3/2, J = 0 undefined)', () => {
		// Terms of p²: Condon & Shortley (1935) ch. VII table of equivalent-electron terms.
		// g(³P₁) = g(³P₂) = 3/2: Landé formula with g_s = 2 (Condon & Shortley, Zeeman effect chapter).
		const s = termSheet(parseConfiguration('1s2 2s2 2p2'));
		expect(s.terms.map((t) => t.label).sort()).toEqual(['1D', '1S', '3P']);
		const p = s.terms.find((t) => t.label === '3P')!;
		expect(p.levels).toEqual([
			{ J: '0', g: null, gDecimal: null, weight: 1 },
			{ J: '1', g: '3/2', gDecimal: 1.5, weight: 3 },
			{ J: '2', g: '3/2', gDecimal: 1.5, weight: 5 }
		]);
		expect(s.hund).toMatchObject({ level: '3P0', rigorous: true });
	});

	it('the p² (M_L, M_S) grid has 3 states at M_L = 0, M_S = 0 and 1 at M_L = 2', () => {
		// Diagonal-sum table of p² (Condon & Shortley 1935, ch. VII): (1⁺,−1⁻), (1⁻,−1⁺), (0⁺,0⁻) give
		// M_L = 0, M_S = 0; only (1⁺,1⁻) gives M_L = 2.
		const { grid } = termSheet(parseConfiguration('2p2'));
		const at = (ML: number, MS: string) => grid.counts[grid.ML.indexOf(ML)][grid.MS.indexOf(MS)];
		expect(at(0, '0')).toBe('3');
		expect(at(2, '0')).toBe('1');
		expect(at(2, '1')).toBe('0');
		expect(at(1, '1')).toBe('1');
	});

	it('d3 gives ²D twice with seniorities 1 and 3', () => {
		// Racah (1943); Condon & Shortley (1935) table of d³ terms: ²D occurs twice (v = 1 and v = 3).
		const d = termSheet(parseConfiguration('3d3')).terms.find((t) => t.label === '2D')!;
		expect(d.count).toBe('2');
		expect(d.seniorities).toEqual([
			{ seniority: 1, count: '1' },
			{ seniority: 3, count: '1' }
		]);
		expect(d.seniority).toBeNull();
	});

	it('free-electron g_s gives g(²S₁/₂) = 2.00231930436 for 4s', () => {
		// CODATA 2018 free-electron g-factor magnitude 2.002 319 304 362 56.
		const s = termSheet(parseConfiguration('4s'), { gs: 'free' });
		expect(s.terms[0].levels[0].gDecimal).toBeCloseTo(2.00231930436256, 12);
		expect(s.terms[0].levels[0].g).toBe('2');
	});

	it('odd configurations say so: 2p 3d is odd', () => {
		// Parity (−1)^Σl: l = 1 + 2 = 3, odd (Condon & Shortley; general fact).
		expect(termSheet(parseConfiguration('2p 3d')).configuration.parity).toBe('odd');
	});

	it('d3 counts 8 terms and 19 levels (Condon & Shortley 1935, table of d³ terms: 2P 2D(2) 2F 2G 2H 4P 4F)', () => {
		const s = termSheet(parseConfiguration('3d3'));
		expect(s.termCount).toBe('8');
		expect(s.levelCount).toBe('19');
	});

	it('every count is an exact decimal string, also above 2^53', () => {
		// C(14,7)·C(18,5)·C(22,5)·C(26,3)·C(10,3)·C(6,1) = 1 449 604 113 205 248 000 (combinatorics),
		// far above 2^53 ≈ 9.0·10^15.
		const s = termSheet(parseConfiguration('4f7 5g5 6h5 7i3 6d3 7p'));
		expect(s.microstates).toBe('1449604113205248000');
		expect(s.weightSum).toBe(s.microstates);
		const digits = /^\d+$/;
		for (const v of [s.termCount, s.levelCount, ...s.terms.map((t) => t.count), ...s.grid.counts.flat()]) expect(v).toMatch(digits);
		// The level total is above 2^53, where a float would have rounded it.
		expect(BigInt(s.levelCount) > BigInt(Number.MAX_SAFE_INTEGER)).toBe(true);
	});
});

describe('Term sheet budget', () => {
	// Regression: GET /api/v1/terms?config=12o23 once grew the heap past 4 GB. The budget is
	// checked before any work and the message states the limit.
	it('12o23 is refused before any work with a message that states the limit', () => {
		expect(() => termSheet(parseConfiguration('12o23'))).toThrow(BudgetError);
		expect(() => termSheet(parseConfiguration('12o23'))).toThrow(/over the limit of 15000/);
	});
	it('a budget error is a RangeError, which the API answers with 400', () => {
		expect(() => termSheet(parseConfiguration('12o23'))).toThrow(RangeError);
	});
	it('9l17 (l = 8, 17 electrons) fits the budget: seniorities as counts add up to each term count', () => {
		const s = termSheet(parseConfiguration('9l17'));
		for (const t of s.terms) {
			const sum = (t.seniorities ?? []).reduce((a, v) => a + BigInt(v.count), 0n);
			expect(sum).toBe(BigInt(t.count));
		}
		// C(34,17) = 2 333 606 220 microstates (combinatorics).
		expect(s.microstates).toBe('2333606220');
		expect(s.weightSum).toBe(s.microstates);
	});
});

describe('Term sheet labels and parentage', () => {
	it('3d6 4s: every term has its parentage, ⁶D on ⁵D; the lowest level is named as a heuristic', () => {
		// Fe II a⁶D 3d⁶(⁵D)4s, ground level a⁶D₉/₂ (NIST ASD, from memory); two open subshells.
		const s = termSheet(parseConfiguration('3d6 4s'));
		const sextet = s.terms.find((t) => t.label === '6D')!;
		expect(sextet.display).toBe('⁶D');
		expect(sextet.parentage).toEqual([
			{
				parents: [
					{ subshell: '3d6', S: '2', L: 2, seniority: 4 },
					{ subshell: '4s', S: '1/2', L: 0, seniority: 1 }
				],
				intermediates: [
					{ S: '2', L: 2 },
					{ S: '5/2', L: 2 }
				],
				label: '3d⁶(⁵D)4s ⁶D',
				parent: '3d⁶(⁵D)4s'
			}
		]);
		expect(s.terms.every((t) => t.parentage!.length === Number(t.count))).toBe(true);
		expect(s.parentageStatus).toMatchObject({ listed: true, occurrences: 24 });
		expect(s.hund).toMatchObject({ display: '⁶D₉/₂', kind: 'lowest', phrase: "lowest level by Hund's rules (heuristic)" });
	});

	it('odd configurations mark every display label with °: 2p3 gives ⁴S° ²D° ²P°', () => {
		// p³ terms ²P ²D ⁴S (Condon & Shortley 1935), odd parity; N I ground ⁴S°₃/₂ (NIST ASD).
		const s = termSheet(parseConfiguration('2p3'));
		expect(s.terms.map((t) => t.display)).toEqual(['²P°', '²D°', '⁴S°']);
		expect(s.hund).toMatchObject({ display: '⁴S°₃/₂', kind: 'ground' });
	});

	it('typed parents mark the occurrences built on them', () => {
		const s = termSheet(parseConfiguration('3d6(5D) 4s'));
		const on = s.terms.flatMap((t) => t.parentage!.filter((p) => p.onTypedParents).map((p) => p.label));
		expect(on.sort()).toEqual(['3d⁶(⁵D)4s ⁴D', '3d⁶(⁵D)4s ⁶D']);
	});

	it('over the parentage limit the field is left out and the status says why', () => {
		const s = termSheet(parseConfiguration('4f6 5d4'));
		expect(s.terms[0]).not.toHaveProperty('parentage');
		expect(s.parentageStatus.listed).toBe(false);
		expect(s.parentageStatus.omitted).toMatch(/at most 5000 term occurrences; this configuration has 16792/);
	});
});
