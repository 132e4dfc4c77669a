import { describe, expect, it } from 'vitest';
import { fitParameters, type ObservedLevel } from './fit';
import { intermediateLevels } from './levels-ic';
import { slaterFromRacah } from './slater-parameters';

// Invented "true" parameters of a d² ion; synthetic levels are computed from them.
const truth = { Eav: 21000, ...slaterFromRacah(860, 3200), zeta: 120 };
const input = (p: { Eav: number; F2: number; F4: number; zeta: number }) => ({
	Eav: p.Eav,
	F: [
		{ k: 2, a: '3d', b: '3d', value: p.F2 },
		{ k: 4, a: '3d', b: '3d', value: p.F4 }
	],
	zeta: [{ shell: '3d', value: p.zeta }]
});
const synthetic = intermediateLevels('3d2', input(truth)).levels;
// Invented noise of a few cm⁻¹ (fixed numbers, not random, so the test is repeatable).
const NOISE = [1.8, -2.3, 0.7, -1.1, 2.9, -0.4, 1.5, -2.7, 0.2];
const observed: ObservedLevel[] = synthetic.map((l, i) => ({ J: l.J, energy: l.energy + NOISE[i], uncertainty: 2 }));
const start = { Eav: 20000, F2: truth.F2 * 0.9, F4: truth.F4 * 1.1, zeta: 90 };
const vary = ['Eav', 'F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)'];

describe('least-squares fit (Levenberg–Marquardt on ⟨ψ|∂H/∂P|ψ⟩)', () => {
	it('recovers the parameters of noise-free synthetic levels exactly', () => {
		const exact = synthetic.map((l) => ({ J: l.J, energy: l.energy, assign: l.label }));
		const r = fitParameters('3d2', { parameters: input(start), vary, observed: exact });
		const value = (id: string) => r.parameters.find((p) => p.id === id)!.value;
		expect(value('Eav')).toBeCloseTo(truth.Eav, 4);
		expect(value('F2(3d,3d)')).toBeCloseTo(truth.F2, 3);
		expect(value('F4(3d,3d)')).toBeCloseTo(truth.F4, 3);
		expect(value('zeta(3d)')).toBeCloseTo(truth.zeta, 4);
		expect(r.rms).toBeLessThan(1e-6);
		expect(r.converged).toBe(true);
	});

	it('with noise, recovers every parameter within 3 of its reported standard uncertainties', () => {
		const r = fitParameters('3d2', { parameters: input(start), vary, observed });
		expect(r.degreesOfFreedom).toBe(9 - 4);
		const want: Record<string, number> = { Eav: truth.Eav, 'F2(3d,3d)': truth.F2, 'F4(3d,3d)': truth.F4, 'zeta(3d)': truth.zeta };
		for (const [id, v] of Object.entries(want)) {
			const p = r.parameters.find((x) => x.id === id)!;
			expect(p.status).toBe('varied');
			expect(p.sigma).toBeGreaterThan(0);
			expect(Math.abs(p.value - v)).toBeLessThan(3 * p.sigma!);
		}
		// residuals are obs − calc and the rms is their root mean square
		const rms = Math.sqrt(r.residuals.reduce((a, x) => a + (x.observed - x.calculated) ** 2, 0) / r.residuals.length);
		expect(r.rms).toBeCloseTo(rms, 12);
		expect(r.rms).toBeGreaterThan(0.5);
		expect(r.rms).toBeLessThan(3);
	});

	it('holds a linked ratio and a bound, and leaves fixed parameters alone', () => {
		const r = fitParameters('3d2', {
			parameters: input(start),
			vary: ['Eav', 'F2(3d,3d)', 'zeta(3d)'],
			links: [{ id: 'F4(3d,3d)', to: 'F2(3d,3d)', ratio: truth.F4 / truth.F2 }],
			bounds: [{ id: 'zeta(3d)', max: 100 }],
			observed
		});
		const p = Object.fromEntries(r.parameters.map((x) => [x.id, x]));
		expect(p['F4(3d,3d)'].status).toBe('linked');
		expect(p['F4(3d,3d)'].value / p['F2(3d,3d)'].value).toBeCloseTo(truth.F4 / truth.F2, 12);
		// without a ratio, the starting ratio is held
		const held = fitParameters('3d2', {
			parameters: input(start),
			vary: ['Eav', 'F2(3d,3d)'],
			links: [{ id: 'F4(3d,3d)', to: 'F2(3d,3d)' }],
			observed
		});
		const q = Object.fromEntries(held.parameters.map((x) => [x.id, x.value]));
		expect(q['F4(3d,3d)'] / q['F2(3d,3d)']).toBeCloseTo(start.F4 / start.F2, 12);
		expect(q['zeta(3d)']).toBe(start.zeta);
		expect(p['zeta(3d)'].value).toBeLessThanOrEqual(100);
		expect(p['zeta(3d)'].atBound).toBe(true);
	});

	it('refuses fewer observed levels than free parameters, saying so', () => {
		expect(() => fitParameters('3d2', { parameters: input(start), vary, observed: observed.slice(0, 3) })).toThrow(
			/3 observed levels and 4 free parameters: it needs at least as many observed levels as free parameters/
		);
	});

	it('names bad ids, links and assignments', () => {
		expect(() => fitParameters('3d2', { parameters: input(start), vary: ['F3(3d,3d)'], observed })).toThrow(/F\^3\(3d,3d\) cannot occur/);
		expect(() =>
			fitParameters('3d2', { parameters: input(start), vary: ['Eav'], links: [{ id: 'F4(3d,3d)', to: 'F2(3d,3d)' }], observed })
		).toThrow(/not varied/);
		expect(() => fitParameters('3d2', { parameters: input(start), vary: ['Eav'], observed: [{ J: '7', energy: 0 }] })).toThrow(
			/no level with J = 7/
		);
		expect(() =>
			fitParameters('3d2', { parameters: input(start), vary: ['Eav'], observed: [{ J: '2', energy: 0, assign: '5D' }] })
		).toThrow(/has the term 5D/);
	});
});
