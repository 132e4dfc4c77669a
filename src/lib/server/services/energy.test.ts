import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { computeEnergies, computeFit, computeSweep, API_LIMITS, REPEATED_LIMITS } from './energy';
import { checkDeterminantBudget } from '../../physics/determinants';
import { parseConfiguration } from '../../physics/parse';

const d2 = {
	config: '3d2',
	parameters: {
		Eav: 0,
		F: [
			{ k: 2, a: '3d', b: '3d', value: 60000 },
			{ k: 4, a: '3d', b: '3d', value: 40000 }
		],
		zeta: [{ shell: '3d', value: 80 }]
	}
};

describe('POST /api/v1/energies (service)', () => {
	it('answers the 9 levels of 3d2 sorted by energy, ³F₂ lowest (Hund), with g and components', () => {
		const r = computeEnergies(d2);
		expect(r.levels).toHaveLength(9);
		expect(r.levels[0]).toMatchObject({ J: '2', label: '3F', parity: 'even' });
		expect(r.levels[0].g).toBeCloseTo(2 / 3, 2); // ³F₂ LS value 2/3 (Landé formula), slightly mixed
		for (let i = 1; i < r.levels.length; i++) expect(r.levels[i].energy).toBeGreaterThanOrEqual(r.levels[i - 1].energy);
		expect(r.levels[0].components[0]).toMatchObject({ term: '3F' });
		expect(r.limits).toEqual(API_LIMITS);
	});
	it('counts missing integrals as 0', () => {
		const r = computeEnergies({ config: '3d2' });
		expect(new Set(r.levels.map((l) => l.energy))).toEqual(new Set([0]));
	});
	it('names an impossible integral (400 through api())', () => {
		expect(() => computeEnergies({ ...d2, parameters: { G: [{ k: 1, a: '3d', b: '4s', value: 1 }] } })).toThrow(RangeError);
		expect(() => computeEnergies({ ...d2, parameters: { F: [{ k: 3, a: '3d', b: '3d', value: 1 }] } })).toThrow(
			/F\^3\(3d,3d\) cannot occur/
		);
	});
	it('refuses bad shapes with a message naming the field', () => {
		const bad = (body: unknown) => {
			try {
				computeEnergies(body);
			} catch (e) {
				return e instanceof ZodError ? e.issues[0].message : (e as Error).message;
			}
			return 'no error';
		};
		expect(bad({ config: '' })).toMatch(/config must not be empty/);
		expect(bad({ config: '3d2', parameters: { F: [{ k: 2, a: '3d', b: '3d', value: 'x' }] } })).toMatch(/F: value must be a number/);
		expect(bad({ config: '3d2', gs: 'other' })).toMatch(/gs must be "exact"/);
	});
	it('refuses configurations over the request budget, stating the limit', () => {
		// 4f⁷ 5d 6s: 3432 × 10 × 2 = 68 640 determinants (binomial counts), over the 40 000 allowed.
		expect(() => computeEnergies({ config: '4f7 5d 6s' })).toThrow(
			new RegExp(`at most ${API_LIMITS.maxBlock}|at most ${API_LIMITS.maxTotal}`)
		);
	});
	it('admits 4f7 5d (34 320 determinants, 3 106 in the central block) within the budget', () => {
		// C(14,7) × C(10,1) = 3432 × 10 = 34 320 (binomial counts); the block holds one state per level.
		expect(checkDeterminantBudget(parseConfiguration('4f7 5d'), API_LIMITS)).toMatchObject({ total: 34320, block: 3106 });
	});
});

describe('POST /api/v1/energies/sweep and /api/v1/fit (service)', () => {
	it('sweeps and fits only smaller configurations, stating the limit (they solve the levels many times)', () => {
		// 4f⁵ 5d: C(14,5) × 10 = 20 020 determinants, over the 12 000 a sweep or fit may take; 4f⁴ 5d (10 010) is within.
		expect(() => computeSweep({ config: '4f5 5d' })).toThrow(new RegExp(`at most ${REPEATED_LIMITS.maxTotal}`));
		expect(() => computeFit({ config: '4f5 5d', vary: ['Eav'], observed: [{ J: '1/2', energy: 0 }] })).toThrow(
			new RegExp(`at most ${REPEATED_LIMITS.maxTotal}`)
		);
		expect(checkDeterminantBudget(parseConfiguration('4f4 5d'), REPEATED_LIMITS).total).toBe(10010);
	});
	it('sweeps with the default 61 points', () => {
		expect(computeSweep(d2).t).toHaveLength(61);
		expect(() => computeSweep({ ...d2, points: 500 })).toThrow(/points must be from 2 to 201/);
	});
	it('fits E_av to invented levels and refuses too few levels', () => {
		const levels = computeEnergies(d2).levels;
		const observed = levels.slice(0, 3).map((l) => ({ J: l.J, energy: l.energy + 100 }));
		const r = computeFit({ ...d2, vary: ['Eav'], observed });
		expect(r.parameters.find((p) => p.id === 'Eav')!.value).toBeCloseTo(100, 6);
		expect(() => computeFit({ ...d2, vary: ['Eav', 'F2(3d,3d)'], observed: observed.slice(0, 1) })).toThrow(
			/needs at least as many observed levels/
		);
	});
});
