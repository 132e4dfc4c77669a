/**
 * Intermediate-coupling levels against published term energies and general facts of the field.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { intermediateLevels, landeFromComposition, MODEL_ENERGY_CAUTION, type IcLevel } from './levels-ic';
import { landeG } from './lande';
import { levelCountsByJ, termsOf } from './terms';
import { parseConfiguration } from './parse';
import { determinantCounts } from './determinants';
import { slaterFromRacah } from './slater-parameters';
import { GS_FREE_ELECTRON } from './lande';

/** Rounding of the eigen solver, relative to the parameter scale (common practice, no source). */
const CM = 1e-7;

const F = (k: number, a: string, value: number, b = a) => ({ k, a, b, value });
const byLabel = (levels: IcLevel[], label: string, J: string) => {
	const hit = levels.find((l) => l.label === label && l.J === J);
	if (!hit) throw new Error(`no level ${label} J=${J}`);
	return hit;
};

describe('p² without spin–orbit (Condon & Shortley 1935, ch. VII: ³P = F0 − 5F2, ¹D = F0 + F2, ¹S = F0 + 10F2, F2 = F²/25)', () => {
	const F2 = 1234.5; // invented
	const Eav = 5000; // invented
	// E_av of p²: (9·(F0 − 5F2) + 5·(F0 + F2) + 1·(F0 + 10F2))/15 = F0 − 2F2, so F0 = E_av + 2F2
	const F0 = Eav + 2 * F2;
	const { levels } = intermediateLevels('2p2', { Eav, F: [F(2, '2p', 25 * F2)] });
	it('³P₀,₁,₂ at F0 − 5F2', () => {
		for (const J of ['0', '1', '2']) expect(byLabel(levels, '3P', J).energy).toBeCloseTo(F0 - 5 * F2, 6);
	});
	it('¹D₂ at F0 + F2', () => expect(byLabel(levels, '1D', '2').energy).toBeCloseTo(F0 + F2, 6));
	it('¹S₀ at F0 + 10F2', () => expect(byLabel(levels, '1S', '0').energy).toBeCloseTo(F0 + 10 * F2, 6));
	it('gives 5 levels, the lowest at relative energy 0', () => {
		expect(levels).toHaveLength(5);
		expect(levels[0].relative).toBe(0);
	});
});

describe("d² against Racah's A, B, C (Racah 1942, Phys. Rev. 62, 438; Griffith 1961, Table A20)", () => {
	// ³F = A − 8B, ³P = A + 7B, ¹D = A − 3B + 2C, ¹G = A + 4B + 2C, ¹S = A + 14B + 7C
	const B = 900; // invented, near Ti²⁺-like values
	const C = 3400;
	const Eav = 0;
	// weights 21, 9, 5, 9, 1 of 45: E_av = A − 14B/9 + 7C/9
	const A = Eav + (14 * B) / 9 - (7 * C) / 9;
	const { F2, F4 } = slaterFromRacah(B, C);
	const { levels } = intermediateLevels('3d2', { Eav, F: [F(2, '3d', F2), F(4, '3d', F4)] });
	const expected: [string, string, number][] = [
		['3F', '2', A - 8 * B],
		['3P', '0', A + 7 * B],
		['1D', '2', A - 3 * B + 2 * C],
		['1G', '4', A + 4 * B + 2 * C],
		['1S', '0', A + 14 * B + 7 * C]
	];
	for (const [label, J, value] of expected) {
		it(`${label} at ${value.toFixed(1)} cm⁻¹`, () => expect(byLabel(levels, label, J).energy).toBeCloseTo(value, 6));
	}
});

describe('two open subshells (Condon & Shortley 1935, ch. VII tables of sp and pp′)', () => {
	it('2p 3s: ¹P − ³P = 2G¹/3 (sp: ³P = F0 − G1, ¹P = F0 + G1, G1 = G¹/3)', () => {
		const G1 = 4321; // invented
		const { levels } = intermediateLevels('2p 3s', { G: [{ k: 1, a: '2p', b: '3s', value: G1 }] });
		expect(byLabel(levels, '1P°', '1').energy - byLabel(levels, '3P°', '1').energy).toBeCloseTo((2 * G1) / 3, 6);
	});
	it('2p 3p: the six terms of pp′ with F2 = F²/25, G0 = G⁰, G2 = G²/25, up to one common shift', () => {
		// ¹S = F0 + 10F2 + G0 + 10G2, ³S = F0 + 10F2 − G0 − 10G2, ¹P = F0 − 5F2 − G0 + 5G2,
		// ³P = F0 − 5F2 + G0 − 5G2, ¹D = F0 + F2 + G0 + G2, ³D = F0 + F2 − G0 − G2 (table quoted from memory)
		const [F2, G0, G2] = [110, 95, 12]; // invented
		const { levels } = intermediateLevels('2p 3p', {
			F: [F(2, '2p', 25 * F2, '3p')],
			G: [
				{ k: 0, a: '2p', b: '3p', value: G0 },
				{ k: 2, a: '2p', b: '3p', value: 25 * G2 }
			]
		});
		const table: [string, string, number][] = [
			['1S', '0', 10 * F2 + G0 + 10 * G2],
			['3S', '1', 10 * F2 - G0 - 10 * G2],
			['1P', '1', -5 * F2 - G0 + 5 * G2],
			['3P', '2', -5 * F2 + G0 - 5 * G2],
			['1D', '2', F2 + G0 + G2],
			['3D', '3', F2 - G0 - G2]
		];
		const shift = byLabel(levels, '1S', '0').energy - table[0][2];
		for (const [label, J, v] of table) expect(byLabel(levels, label, J).energy - shift).toBeCloseTo(v, 6);
	});
});

describe('spin–orbit', () => {
	it('one electron: the l ± ½ splitting is ζ(2l + 1)/2, ²D₅/₂ above ²D₃/₂ (Condon & Shortley 1935, §5⁴)', () => {
		const zeta = 250; // invented
		const { levels } = intermediateLevels('3d', { zeta: [{ shell: '3d', value: zeta }] });
		expect(levels.map((l) => l.J)).toEqual(['3/2', '5/2']);
		expect(levels[1].energy - levels[0].energy).toBeCloseTo((zeta * 5) / 2, 9);
		// centre of gravity: 4·E(3/2) + 6·E(5/2) = 0 with E_av = 0, so E(5/2) = ζl/2 = ζ
		expect(levels[1].energy).toBeCloseTo(zeta, 9);
	});

	it('Landé interval rule inside d² ³F at small ζ: E(J) − E(J−1) ∝ J (Landé 1923, first order in ζ)', () => {
		const { F2, F4 } = slaterFromRacah(900, 3400);
		const zeta = 0.5; // tiny against B: second-order shifts ~ ζ²/B
		const { levels } = intermediateLevels('3d2', { F: [F(2, '3d', F2), F(4, '3d', F4)], zeta: [{ shell: '3d', value: zeta }] });
		const e = (J: string) => byLabel(levels, '3F', J).energy;
		const a4 = (e('4') - e('3')) / 4;
		const a3 = (e('3') - e('2')) / 3;
		expect(a4 / a3).toBeCloseTo(1, 3);
		// A = ζ/(2S) for the highest-multiplicity term of a less than half-filled shell (from memory, Hund's third rule)
		expect(a4).toBeCloseTo(zeta / 2, 3);
	});

	it('F = G = 0: p² levels sit at the jj energies ζΣ⟨l·s⟩: (½)² −2ζ, (½)(3/2) −ζ/2, (3/2)² +ζ (Condon & Shortley 1935, §5⁴)', () => {
		const zeta = 300; // invented
		const { levels } = intermediateLevels('2p2', { zeta: [{ shell: '2p', value: zeta }] });
		const byJj = new Map<string, Set<number>>();
		for (const l of levels) {
			expect(l.jj[0].percent).toBeCloseTo(100, 8);
			const key = l.jj[0].label;
			byJj.set(key, (byJj.get(key) ?? new Set()).add(Math.round(l.energy * 1e6) / 1e6));
		}
		expect(byJj.get('2p_{1/2}^2')).toEqual(new Set([-2 * zeta]));
		expect(byJj.get('2p_{1/2} 2p_{3/2}')).toEqual(new Set([-zeta / 2]));
		expect(byJj.get('2p_{3/2}^2')).toEqual(new Set([zeta]));
	});

	it('F = G = 0 with two subshells: 2p 3d levels are sums of one-electron ζ⟨l·s⟩ (p: −ζ or ζ/2; d: −3ζ/2 or ζ)', () => {
		const [zp, zd] = [400, 60]; // invented
		const { levels } = intermediateLevels('2p 3d', {
			zeta: [
				{ shell: '2p', value: zp },
				{ shell: '3d', value: zd }
			]
		});
		const allowed = [-zp - 1.5 * zd, -zp + zd, zp / 2 - 1.5 * zd, zp / 2 + zd];
		for (const l of levels) expect(allowed.some((a) => Math.abs(a - l.energy) < CM * 1e3)).toBe(true);
		// (2J+1)-weighted count at each energy = product of the j-group degeneracies: 2·4, 2·6, 4·4, 4·6
		const weight = (e: number) => levels.filter((l) => Math.abs(l.energy - e) < 1e-4).reduce((a, l) => a + l.twoJ + 1, 0);
		expect(allowed.map(weight)).toEqual([8, 12, 16, 24]);
	});
});

describe('g-factors, compositions and the trace', () => {
	it('g tends to the exact LS Landé values (lande.ts) as ζ → 0, in d³', () => {
		const { F2, F4 } = slaterFromRacah(800, 3200);
		const { levels } = intermediateLevels('3d3', { F: [F(2, '3d', F2), F(4, '3d', F4)], zeta: [{ shell: '3d', value: 1e-3 }] });
		for (const l of levels) {
			const c = l.components[0];
			if (c.percent < 99.999) continue; // the two ²D terms mix through the Coulomb term itself
			const exact = landeG(c.twoS, c.L, l.twoJ)!.valueOf();
			expect(l.g!).toBeCloseTo(exact, 6);
		}
	});

	it('g with the free-electron g_s: ⁶S₅/₂ of 3d⁵ has g = g_s (Landé formula with L = 0)', () => {
		const { F2, F4 } = slaterFromRacah(900, 3500);
		const { levels } = intermediateLevels('3d5', { F: [F(2, '3d', F2), F(4, '3d', F4)] }, { gs: GS_FREE_ELECTRON });
		expect(levels[0].label).toBe('6S');
		expect(levels[0].g).toBeCloseTo(GS_FREE_ELECTRON, 12);
		expect(landeFromComposition(0, [])).toBeNull();
	});

	it('the number of levels of each J equals the LS count (terms.ts), for 3d3, 4f3, 2p 3d, 4f 5d 6s', () => {
		for (const cfg of ['3d3', '4f3', '2p 3d', '4f 5d 6s']) {
			const { levels } = intermediateLevels(cfg, {});
			const counts = new Map<number, number>();
			for (const l of levels) counts.set(l.twoJ, (counts.get(l.twoJ) ?? 0) + 1);
			const expected = levelCountsByJ(parseConfiguration(cfg));
			expect(Object.fromEntries(counts)).toEqual(Object.fromEntries(expected));
		}
	});

	it('d³ resolves the two ²D terms by seniority (Racah 1943: v = 1 and v = 3)', () => {
		const { levels } = intermediateLevels('3d3', { F: [F(2, '3d', 60000), F(4, '3d', 40000)] });
		const dTerms = new Set(levels.flatMap((l) => l.components.filter((c) => c.term === '2D').map((c) => c.seniority)));
		expect(dTerms).toEqual(new Set([1, 3]));
		expect(levels.filter((l) => l.label.startsWith('2D (v=')).length).toBe(4);
		expect(termsOf(parseConfiguration('3d3')).find((t) => t.twoS === 1 && t.L === 2)?.count).toBe(2);
	});

	it('property: compositions sum to 100 % and Σ(2J+1)E = N_det·E_av, for random parameters (fast-check)', () => {
		const configs = ['2p2', '3d2', '2p 3d', '3d3', '4f2'];
		fc.assert(
			fc.property(
				fc.constantFrom(...configs),
				fc.double({ min: -5e4, max: 5e4, noNaN: true }),
				fc.double({ min: 0, max: 9e4, noNaN: true }),
				fc.double({ min: 0, max: 5e3, noNaN: true }),
				(cfg, Eav, f2, zeta) => {
					const parsed = parseConfiguration(cfg);
					const open = parsed.subshells.map((s) => `${s.n}${'spdf'[s.l]}`);
					const input = {
						Eav,
						F: parsed.subshells.filter((s) => s.occupancy >= 2).map((s) => F(2, `${s.n}${'spdf'[s.l]}`, f2)),
						zeta: open.map((shell) => ({ shell, value: zeta }))
					};
					const { levels } = intermediateLevels(cfg, input);
					let weighted = 0;
					for (const l of levels) {
						const sum = l.components.reduce((a, c) => a + c.percent, 0);
						expect(sum).toBeCloseTo(100, 6);
						expect(l.jj.reduce((a, c) => a + c.percent, 0)).toBeCloseTo(100, 6);
						weighted += (l.twoJ + 1) * l.energy;
					}
					const total = determinantCounts(parsed).total;
					expect(Math.abs(weighted - total * Eav)).toBeLessThan(CM * total * (Math.abs(Eav) + f2 + zeta + 1));
				}
			),
			{ numRuns: 25 }
		);
	});

	it('carries the model caution and names the 4f³ ground level ⁴I°₉/₂ (Hund; Dieke 1968 for Nd³⁺)', () => {
		const r = intermediateLevels('4f3', {
			F: [F(2, '4f', 70000), F(4, '4f', 50000), F(6, '4f', 36000)],
			zeta: [{ shell: '4f', value: 880 }]
		});
		expect(r.caution).toBe(MODEL_ENERGY_CAUTION);
		expect(r.levels[0].label).toBe('4I°');
		expect(r.levels[0].J).toBe('9/2');
	});
});

describe('bad input', () => {
	it('names an impossible integral', () => {
		expect(() => intermediateLevels('3d2', { F: [F(3, '3d', 1)] })).toThrow(/F\^3\(3d,3d\) cannot occur.*2, 4/);
		expect(() => intermediateLevels('3d2', { F: [F(2, '4f', 1)] })).toThrow(/4f is not a subshell of the configuration/);
		expect(() => intermediateLevels('1s2 2p2', { G: [{ k: 1, a: '1s', b: '2p', value: 1 }] })).toThrow(/1s is a closed subshell/);
		expect(() => intermediateLevels('3d 4s', { zeta: [{ shell: '4s', value: 1 }] })).toThrow(/s subshell has no spin–orbit/);
		expect(() => intermediateLevels('3d 4s', { F: [F(2, '3d', 1)] })).toThrow(/3d holds one electron/);
		expect(() => intermediateLevels('3d 4s', { G: [{ k: 1, a: '3d', b: '4s', value: 1 }] })).toThrow(/k must be one of 2/);
	});
	it('refuses configurations over the block budget, stating the limit, before any work', () => {
		expect(() => intermediateLevels('4f7 5d', {})).toThrow(/3106 determinants.*at most 1200/);
	});
	it('refuses a closed-shell configuration', () => expect(() => intermediateLevels('2p6', {})).toThrow(/no open subshell/));
});
