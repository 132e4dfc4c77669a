import { describe, expect, it } from 'vitest';
import { termSheet } from './report';

describe('Term sheet', () => {
	it('3d5 4s: 504 microstates = Σ count·(2S+1)(2L+1), Hund level ⁷S₃ flagged as heuristic', () => {
		// 504 = C(10,5)·C(2,1) = 252·2 (combinatorics). ⁷S₃ is the ground level of neutral Cr,
		// 3d⁵4s (NIST/CRC periodic table of ground levels); two open subshells, so not rigorous.
		const s = termSheet('3d5 4s');
		expect(s.microstates).toBe(504);
		expect(s.weightSum).toBe(504);
		expect(s.hund).toMatchObject({ level: '7S3', rigorous: false });
		expect(s.configuration.parity).toBe('even');
	});

	it('2p2 lists ¹S ¹D ³P with exact Landé g (g(³P₁) = 3/2, g(³P₂) = 3/2, J = 0 undefined)', () => {
		// Terms of p²: Condon & Shortley (1935) ch. VII table of equivalent-electron terms.
		// g(³P₁) = g(³P₂) = 3/2: Landé formula with g_s = 2 (Condon & Shortley, Zeeman effect chapter).
		const s = termSheet('1s2 2s2 2p2');
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
		const { grid } = termSheet('2p2');
		const at = (ML: number, MS: string) => grid.counts[grid.ML.indexOf(ML)][grid.MS.indexOf(MS)];
		expect(at(0, '0')).toBe(3);
		expect(at(2, '0')).toBe(1);
		expect(at(2, '1')).toBe(0);
		expect(at(1, '1')).toBe(1);
	});

	it('d3 gives ²D twice with seniorities 1 and 3', () => {
		// Racah (1943); Condon & Shortley (1935) table of d³ terms: ²D occurs twice (v = 1 and v = 3).
		const d = termSheet('3d3').terms.find((t) => t.label === '2D')!;
		expect(d.count).toBe(2);
		expect([...d.seniorities!].sort()).toEqual([1, 3]);
		expect(d.seniority).toBeNull();
	});

	it('free-electron g_s gives g(²S₁/₂) = 2.00231930436 for 4s', () => {
		// CODATA 2018 free-electron g-factor magnitude 2.002 319 304 362 56.
		const s = termSheet('4s', { gs: 'free' });
		expect(s.terms[0].levels[0].gDecimal).toBeCloseTo(2.00231930436256, 12);
		expect(s.terms[0].levels[0].g).toBe('2');
	});

	it('odd configurations say so: 2p 3d is odd', () => {
		// Parity (−1)^Σl: l = 1 + 2 = 3, odd (Condon & Shortley; general fact).
		expect(termSheet('2p 3d').configuration.parity).toBe('odd');
	});

	it('reports very large counts as exact decimal strings', () => {
		// C(14,7)·C(18,9)·C(22,11)·C(26,13)... only the type is checked here; the totals are
		// checked against binomial products in microstates.test.ts.
		const s = termSheet('4f7 5g5 6h5');
		expect(typeof s.microstates === 'number' || /^\d+$/.test(String(s.microstates))).toBe(true);
		expect(String(s.microstates)).toBe(String(s.weightSum));
	});
});

describe('Term sheet labels and parentage', () => {
	it('3d6 4s: every term has its parentage, ⁶D on ⁵D; the lowest level is named as a heuristic', () => {
		// Fe II a⁶D 3d⁶(⁵D)4s, ground level a⁶D₉/₂ (NIST ASD, from memory); two open subshells.
		const s = termSheet('3d6 4s');
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
				label: '3d⁶(⁵D)4s ⁶D'
			}
		]);
		expect(s.terms.every((t) => t.parentage!.length === t.count)).toBe(true);
		expect(s.parentageStatus).toMatchObject({ listed: true, occurrences: 24 });
		expect(s.hund).toMatchObject({ display: '⁶D₉/₂', kind: 'lowest', phrase: "lowest level by Hund's rules (heuristic)" });
	});

	it('odd configurations mark every display label with °: 2p3 gives ⁴S° ²D° ²P°', () => {
		// p³ terms ²P ²D ⁴S (Condon & Shortley 1935), odd parity; N I ground ⁴S°₃/₂ (NIST ASD).
		const s = termSheet('2p3');
		expect(s.terms.map((t) => t.display)).toEqual(['²P°', '²D°', '⁴S°']);
		expect(s.hund).toMatchObject({ display: '⁴S°₃/₂', kind: 'ground' });
	});

	it('typed parents mark the occurrences built on them', () => {
		const s = termSheet('3d6(5D) 4s');
		const on = s.terms.flatMap((t) => t.parentage!.filter((p) => p.onTypedParents).map((p) => p.label));
		expect(on.sort()).toEqual(['3d⁶(⁵D)4s ⁴D', '3d⁶(⁵D)4s ⁶D']);
	});

	it('over the parentage limit the field is left out and the status says why', () => {
		const s = termSheet('4f6 5d4');
		expect(s.terms[0]).not.toHaveProperty('parentage');
		expect(s.parentageStatus.listed).toBe(false);
		expect(s.parentageStatus.omitted).toMatch(/at most 5000 term occurrences; this configuration has 16792/);
	});
});
