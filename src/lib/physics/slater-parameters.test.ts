import { describe, expect, it } from 'vitest';
import { condonShortleyDenominator, racahFromSlater, radialParameters, resolveParameters, slaterFromRacah } from './slater-parameters';
import { orbitalSet, determinantBlock } from './determinants';
import { averageCoefficients, parameterMatrices } from './hamiltonian';
import { parseConfiguration } from './parse';

describe('radial parameters of a configuration (Cowan 1981, §13-1)', () => {
	it('3d2 has F², F⁴ and ζ(3d)', () => {
		expect(radialParameters(orbitalSet(parseConfiguration('3d2'))).map((p) => p.id)).toEqual(['F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)']);
	});
	it('4f 5d has F², F⁴ (f–d) and G¹, G³, G⁵ besides the two ζ', () => {
		expect(radialParameters(orbitalSet(parseConfiguration('4f 5d'))).map((p) => p.id)).toEqual([
			'zeta(4f)',
			'zeta(5d)',
			'F2(4f,5d)',
			'F4(4f,5d)',
			'G1(4f,5d)',
			'G3(4f,5d)',
			'G5(4f,5d)'
		]);
	});
	it('a missing integral counts as 0 and the order of a, b does not matter', () => {
		const set = orbitalSet(parseConfiguration('2p 3d'));
		const all = parseConfiguration('2p 3d').subshells;
		const r = resolveParameters(set, all, { G: [{ k: 1, a: '3d', b: '2p', value: 7 }] });
		const ids = radialParameters(set).map((p) => p.id);
		expect(r.values[ids.indexOf('G1(2p,3d)')]).toBe(7);
		expect(Array.from(r.values).filter((v) => v !== 0)).toEqual([7]);
	});
	it('refuses F^0 (part of E_av) and duplicates', () => {
		const cfg = parseConfiguration('3d2');
		const set = orbitalSet(cfg);
		expect(() => resolveParameters(set, cfg.subshells, { F: [{ k: 0, a: '3d', b: '3d', value: 1 }] })).toThrow(/F\^0.*Eav/);
		expect(() =>
			resolveParameters(set, cfg.subshells, {
				F: [
					{ k: 2, a: '3d', b: '3d', value: 1 },
					{ k: 2, a: '3d', b: '3d', value: 2 }
				]
			})
		).toThrow(/given twice/);
	});
});

describe('conversions', () => {
	it("Racah's B, C ⇄ F², F⁴: B = F₂ − 5F₄, C = 35F₄, F₂ = F²/49, F₄ = F⁴/441 (Racah 1942)", () => {
		const { F2, F4 } = slaterFromRacah(1000, 4000);
		expect(F2).toBeCloseTo(49 * 1000 + 7 * 4000, 9);
		expect(F4).toBeCloseTo((63 * 4000) / 5, 9);
		const back = racahFromSlater(F2, F4);
		expect(back.B).toBeCloseTo(1000, 9);
		expect(back.C).toBeCloseTo(4000, 9);
	});
	it('D₂ = 25 for p, D₄ = 441 for d (Condon & Shortley 1935, §6⁸)', () => {
		expect(condonShortleyDenominator(1, 2)).toBe(25);
		expect(condonShortleyDenominator(2, 4)).toBe(441);
		expect(condonShortleyDenominator(5, 2)).toBeNull();
	});
});

describe('the E_av convention', () => {
	it('p²: the average coefficient of F² is −2/25 (E_av = F0 − 2F2, from the Condon & Shortley p² energies)', () => {
		const set = orbitalSet(parseConfiguration('2p2'));
		expect(averageCoefficients(set, radialParameters(set))[0]).toBeCloseTo(-2 / 25, 14);
	});
	it('the diagonal of every parameter matrix sums to N_det × its average over the whole configuration (all M_J)', () => {
		const cfg = parseConfiguration('2p 3d');
		const set = orbitalSet(cfg);
		const params = radialParameters(set);
		const avg = averageCoefficients(set, params);
		const sums = new Float64Array(params.length);
		let total = 0;
		for (let twoM = -12; twoM <= 12; twoM += 2) {
			const block = determinantBlock(set, twoM);
			total += block.size;
			const m = parameterMatrices(set, block, params);
			for (let e = 0; e < m.rows.length; e++) if (m.rows[e] === m.cols[e]) sums[m.param[e]] += m.coef[e];
		}
		expect(total).toBe(60);
		params.forEach((_, p) => expect(sums[p]).toBeCloseTo(total * avg[p], 9));
	});
});
