import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ritzLine, ritzUncertainty } from './ritz';

describe('Ritz combination σ = E_upper − E_lower', () => {
	it('Hα from the hydrogen n = 2 and n = 3 centroids (82 259.16 and 97 492.30 cm⁻¹, from memory) is 6564.6 Å vacuum, 6562.8 Å air', () => {
		const line = ritzLine(82259.16, 97492.3);
		expect(line.wavenumber).toBeCloseTo(15233.14, 6);
		expect(line.vacuumA).toBeCloseTo(6564.6, 0);
		expect(line.airA!).toBeCloseTo(6562.8, 0);
		expect(line.listed.medium).toBe('air');
	});
	it('below 2000 Å only the vacuum wavelength is given (Lyman α: 0 → 82 259 cm⁻¹, 1215.67 Å, from memory)', () => {
		const line = ritzLine(0, 82259.16);
		expect(line.vacuumA).toBeCloseTo(1215.67, 1);
		expect(line.airA).toBeNull();
		expect(line.listed).toEqual({ value: line.vacuumA, medium: 'vacuum' });
	});
	it('uncertainties of the two levels add in quadrature (GUM eq. 10): 0.03 and 0.04 give 0.05 cm⁻¹', () => {
		expect(ritzUncertainty(0.03, 0.04)).toBeCloseTo(0.05, 15);
		expect(ritzUncertainty(null, 0.04)).toBe(0.04);
		expect(ritzUncertainty(undefined, null)).toBeNull();
		const line = ritzLine(0, 20000, 0.03, 0.04);
		// u(λ) = λ² u(σ)/10⁸ = 5000² × 0.05 / 10⁸ = 0.0125 Å
		expect(line.vacuumUncertaintyA).toBeCloseTo(0.0125, 12);
	});
	it('refuses an upper level below the lower one, saying which is which', () => {
		expect(() => ritzLine(100, 50)).toThrow(/upper level \(50 cm⁻¹\) must lie above the lower one \(100 cm⁻¹\)/);
		expect(() => ritzUncertainty(-1, 0)).toThrow(/≥ 0/);
	});
	it('σ · λ_vac = 10⁸ for every pair of levels (property)', () => {
		fc.assert(
			fc.property(fc.double({ min: 0, max: 1e5, noNaN: true }), fc.double({ min: 1, max: 1e5, noNaN: true }), (lo, gap) => {
				const line = ritzLine(lo, lo + gap);
				return Math.abs(line.wavenumber * line.vacuumA - 1e8) < 1e-4;
			})
		);
	});
});
