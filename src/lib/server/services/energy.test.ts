import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { computeEnergies, computeFit, computeSweep, API_LIMITS } from './energy';

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
		expect(() => computeEnergies({ config: '4f6 5d' })).toThrow(
			new RegExp(`at most ${API_LIMITS.maxBlock}|at most ${API_LIMITS.maxTotal}`)
		);
	});
});

describe('POST /api/v1/energies/sweep and /api/v1/fit (service)', () => {
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
