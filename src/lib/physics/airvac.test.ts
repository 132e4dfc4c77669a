import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	AIR_TO_VACUUM_TOLERANCE_A,
	AIR_WAVELENGTH_MIN_A,
	airRefractiveIndex,
	airToVacuum,
	fromVacuumAngstrom,
	listedWavelength,
	toVacuumAngstrom,
	uncertaintyToWavenumber,
	vacuumToAir,
	vacuumWavelengthOf,
	wavenumberOf
} from './airvac';

/** Agreement with values worked out by hand (30-digit `bc -l`) from the Morton (2000) formula. */
const HAND_TOLERANCE_A = 1e-9;
/** Wavelengths quoted in tables to 0.01 Å (from memory) agree to about one unit of the last digit. */
const TABLE_TOLERANCE_A = 0.015;

describe('refractive index of standard air, Morton (2000) form', () => {
	// Each value computed by hand with `bc -l` at 30 digits (written here to 16 digits) from
	// n − 1 = 8.34254e-5 + 2.406147e-2/(130 − s²) + 1.5998e-4/(38.9 − s²), s = 10⁴/λ_vac (Morton 2000, ApJS 130, 403).
	it.each([
		[2000, 0.0003240916096608428],
		[5000, 0.0002789734017737754],
		[10000, 0.0002741695314352335],
		[30000, 0.0002727963381327373]
	])('n − 1 at λ_vac = %d Å is %f', (lambda, nMinusOne) => {
		expect(airRefractiveIndex(lambda) - 1).toBeCloseTo(nMinusOne, 15);
	});

	it.each([
		[2000, 1999.352026783361],
		[5000, 4998.605522013399],
		[10000, 9997.259056168934],
		[30000, 29991.81834178242]
	])('vacuum %d Å is %f Å in air (hand computation from the same formula)', (vac, air) => {
		expect(Math.abs(vacuumToAir(vac) - air)).toBeLessThan(HAND_TOLERANCE_A);
		expect(Math.abs(airToVacuum(air) - vac)).toBeLessThan(AIR_TO_VACUUM_TOLERANCE_A);
	});
});

describe('lines known in both media (from memory: the usual solar / laboratory tables)', () => {
	it.each([
		['Balmer Hα', 6562.8, 6564.61],
		['Na D₂', 5889.95, 5891.58],
		['Na D₁', 5895.92, 5897.56]
	])('%s: %f Å air ↔ %f Å vacuum', (_name, air, vac) => {
		expect(Math.abs(airToVacuum(air) - vac)).toBeLessThan(TABLE_TOLERANCE_A);
		expect(Math.abs(vacuumToAir(vac) - air)).toBeLessThan(TABLE_TOLERANCE_A);
	});
});

describe('the 2000 Å convention', () => {
	it('Lyman α (1215.67 Å, from memory) is listed in vacuum, not converted', () => {
		expect(listedWavelength(1215.67)).toEqual({ value: 1215.67, medium: 'vacuum' });
		expect(() => vacuumToAir(1215.67)).toThrow(/2000 Å.*vacuum by convention/);
		expect(() => airToVacuum(1500)).toThrow(/vacuum by convention/);
	});
	it('Hα is listed in air', () => {
		const listed = listedWavelength(6564.61);
		expect(listed.medium).toBe('air');
		expect(listed.value).toBeCloseTo(6562.797, 3);
	});
	it('bad wavelengths say what is allowed', () => {
		expect(() => vacuumToAir(-5)).toThrow(/positive number of ångström/);
		expect(() => airToVacuum(Number.NaN)).toThrow(/positive/);
		expect(() => toVacuumAngstrom(5000, 'mm' as 'A', 'air')).toThrow(/A \(ångström\), nm, um/);
	});
});

describe('units: Å, nm, μm, cm⁻¹', () => {
	it('20 000 cm⁻¹ is 5000 Å = 500 nm = 0.5 μm in vacuum (σ = 10⁸/λ, definition)', () => {
		expect(vacuumWavelengthOf(20000)).toBe(5000);
		expect(wavenumberOf(5000)).toBe(20000);
		expect(fromVacuumAngstrom(5000, 'nm', 'vacuum')).toBe(500);
		expect(fromVacuumAngstrom(5000, 'um', 'vacuum')).toBe(0.5);
		expect(fromVacuumAngstrom(5000, 'cm-1', 'air')).toBe(20000);
		expect(toVacuumAngstrom(20000, 'cm-1', 'air')).toBe(5000);
		expect(toVacuumAngstrom(0.5, 'um', 'vacuum')).toBe(5000);
	});
	it('656.28 nm in air is Hα at 6564.61 Å vacuum (from memory)', () => {
		expect(toVacuumAngstrom(656.28, 'nm', 'air')).toBeCloseTo(6564.61, 1);
	});
	it('0.01 Å at 5000 Å is 0.04 cm⁻¹ (dσ = 10⁸ dλ/λ²)', () => {
		expect(uncertaintyToWavenumber(0.01, 'A', 5000)).toBeCloseTo(0.04, 12);
		expect(uncertaintyToWavenumber(0.001, 'nm', 5000)).toBeCloseTo(0.04, 12);
		expect(uncertaintyToWavenumber(0.3, 'cm-1', 5000)).toBe(0.3);
	});
});

describe('round trips (property tests)', () => {
	const airRange = fc.double({ min: AIR_WAVELENGTH_MIN_A, max: 1e6, noNaN: true });
	const vacRange = fc.double({ min: 2000, max: 1e6, noNaN: true });
	it('airToVacuum(vacuumToAir(λ)) = λ to 10⁻⁶ Å', () => {
		fc.assert(fc.property(vacRange, (v) => Math.abs(airToVacuum(vacuumToAir(v)) - v) < 2 * AIR_TO_VACUUM_TOLERANCE_A));
	});
	it('vacuumToAir(airToVacuum(λ)) = λ to 10⁻⁶ Å', () => {
		fc.assert(
			fc.property(airRange, (a) => {
				const v = airToVacuum(a);
				return v >= 2000 ? Math.abs(vacuumToAir(v) - a) < 2 * AIR_TO_VACUUM_TOLERANCE_A : true;
			})
		);
	});
	it('air wavelengths are shorter than vacuum ones (n > 1)', () => {
		fc.assert(fc.property(vacRange, (v) => vacuumToAir(v) < v));
	});
	it('every unit converts back to the same vacuum wavelength', () => {
		fc.assert(
			fc.property(
				vacRange,
				fc.constantFrom('A', 'nm', 'um', 'cm-1' as const),
				fc.constantFrom('air', 'vacuum' as const),
				(v, unit, medium) => {
					const back = toVacuumAngstrom(fromVacuumAngstrom(v, unit, medium), unit, medium);
					return Math.abs(back - v) < 1e-5;
				}
			)
		);
	});
});
