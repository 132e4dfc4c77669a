/**
 * Wavelengths in standard air and in vacuum, and the spectroscopic units Å, nm, μm and cm⁻¹.
 *
 * Refractive index of standard air (dry air, 1 atm, 15 °C, 0.045 % CO₂ by volume), in the
 * Edlén-type form adopted by Morton (2000, ApJS 130, 403) from Birch & Downs (1994, Metrologia
 * 31, 315), the IAU standard for vacuum ↔ air conversion:
 *
 *   n − 1 = 8.34254·10⁻⁵ + 2.406147·10⁻² / (130 − s²) + 1.5998·10⁻⁴ / (38.9 − s²),
 *   s = 10⁴ / λ_vac (λ_vac in Å, so s is in μm⁻¹).
 *
 * λ_air = λ_vac / n(λ_vac). The inverse has no closed form in this parametrisation, so
 * `airToVacuum` iterates λ_vac ← λ_air · n(λ_vac) to AIR_TO_VACUUM_TOLERANCE_A.
 *
 * By convention (Morton 2000; the usual practice of line lists) wavelengths below 2000 Å are
 * given in vacuum; the conversions refuse them rather than return a number nobody quotes.
 * Wavenumbers σ (cm⁻¹) are always vacuum quantities: σ = 10⁸ / λ_vac(Å).
 */

/** Constant term of (n − 1), Morton (2000) / Birch & Downs (1994). */
export const MORTON_A = 8.34254e-5;
/** Numerator of the first dispersion term of (n − 1), μm⁻². */
export const MORTON_B = 2.406147e-2;
/** Pole of the first dispersion term, μm⁻². */
export const MORTON_B_POLE = 130;
/** Numerator of the second dispersion term of (n − 1), μm⁻². */
export const MORTON_C = 1.5998e-4;
/** Pole of the second dispersion term, μm⁻². */
export const MORTON_C_POLE = 38.9;

/** Below this vacuum wavelength (Å) wavelengths are quoted in vacuum by convention. */
export const AIR_WAVELENGTH_LIMIT_A = 2000;
/** `airToVacuum` stops when two successive vacuum wavelengths differ by less than this (Å). */
export const AIR_TO_VACUUM_TOLERANCE_A = 1e-6;
/** More iterations than the fixed point ever needs (each step gains about six digits). */
const AIR_TO_VACUUM_MAX_ITERATIONS = 50;
/** Å per cm: σ(cm⁻¹) = ANGSTROM_PER_CM / λ_vac(Å). */
export const ANGSTROM_PER_CM = 1e8;

/** Wavelength or wavenumber units accepted by the conversions. */
export type SpectralUnit = 'A' | 'nm' | 'um' | 'cm-1';
/** Where a wavelength was measured (or is quoted). */
export type Medium = 'air' | 'vacuum';

export const SPECTRAL_UNITS: readonly SpectralUnit[] = ['A', 'nm', 'um', 'cm-1'];
export const MEDIA: readonly Medium[] = ['air', 'vacuum'];

function checkWavelength(where: string, name: string, value: number): void {
	if (!Number.isFinite(value) || value <= 0) {
		throw new RangeError(`${where}: ${name} must be a positive number of ångström, got ${value}`);
	}
}

/**
 * Refractive index n of standard air at the vacuum wavelength λ_vac (Å), Morton (2000) form above.
 * Throws RangeError when λ_vac is not positive or is below AIR_WAVELENGTH_LIMIT_A (2000 Å).
 * @example airRefractiveIndex(5000) // 1.000278…  (n − 1 = 2.7896·10⁻⁴)
 */
export function airRefractiveIndex(vacuumA: number): number {
	checkWavelength('airRefractiveIndex', 'the vacuum wavelength', vacuumA);
	if (vacuumA < AIR_WAVELENGTH_LIMIT_A) {
		throw new RangeError(
			`airRefractiveIndex: ${vacuumA} Å is below ${AIR_WAVELENGTH_LIMIT_A} Å, where wavelengths are given in vacuum by convention; no air value is defined`
		);
	}
	const s2 = (1e4 / vacuumA) ** 2;
	return 1 + MORTON_A + MORTON_B / (MORTON_B_POLE - s2) + MORTON_C / (MORTON_C_POLE - s2);
}

/**
 * Air wavelength (Å) of a vacuum wavelength (Å): λ_air = λ_vac / n(λ_vac) (Morton 2000).
 * Throws RangeError below 2000 Å (vacuum by convention) or for a non-positive value.
 * @example vacuumToAir(6564.61) // 6562.79 (Balmer Hα)
 */
export function vacuumToAir(vacuumA: number): number {
	return vacuumA / airRefractiveIndex(vacuumA);
}

/** The smallest air wavelength (Å) with a vacuum counterpart ≥ 2000 Å: vacuumToAir(2000) ≈ 1999.35 Å. */
export const AIR_WAVELENGTH_MIN_A = vacuumToAir(AIR_WAVELENGTH_LIMIT_A);

/**
 * Vacuum wavelength (Å) of an air wavelength (Å), by the fixed-point iteration
 * λ_vac ← λ_air · n(λ_vac) from λ_vac = λ_air until the step is below 10⁻⁶ Å (Morton 2000 index).
 * Throws RangeError when λ_air is not positive or below AIR_WAVELENGTH_MIN_A (≈ 1999.35 Å,
 * the air image of 2000 Å vacuum).
 * @example airToVacuum(5889.95) // 5891.58 (Na D₂)
 */
export function airToVacuum(airA: number): number {
	checkWavelength('airToVacuum', 'the air wavelength', airA);
	if (airA < AIR_WAVELENGTH_MIN_A - AIR_TO_VACUUM_TOLERANCE_A) {
		throw new RangeError(
			`airToVacuum: ${airA} Å is below ${AIR_WAVELENGTH_MIN_A.toFixed(2)} Å (2000 Å in vacuum); wavelengths there are given in vacuum by convention`
		);
	}
	let vacuum = airA;
	for (let i = 0; i < AIR_TO_VACUUM_MAX_ITERATIONS; i++) {
		// Near the 2000 Å boundary an intermediate step may fall just below it: use the formula there too.
		const s2 = (1e4 / Math.max(vacuum, AIR_WAVELENGTH_LIMIT_A)) ** 2;
		const n = 1 + MORTON_A + MORTON_B / (MORTON_B_POLE - s2) + MORTON_C / (MORTON_C_POLE - s2);
		const next = airA * n;
		if (Math.abs(next - vacuum) < AIR_TO_VACUUM_TOLERANCE_A) return next;
		vacuum = next;
	}
	throw new RangeError(`airToVacuum: no convergence for ${airA} Å`);
}

/**
 * A value in the given unit as a vacuum wavelength in Å. Å, nm and μm are lengths in `medium`;
 * cm⁻¹ is a wavenumber and always refers to vacuum (the medium is ignored for it).
 * Throws RangeError for a non-positive value, an unknown unit or medium, or an air wavelength below 2000 Å.
 * @example toVacuumAngstrom(656.28, 'nm', 'air') // 6564.61…
 */
export function toVacuumAngstrom(value: number, unit: SpectralUnit, medium: Medium): number {
	if (!Number.isFinite(value) || value <= 0) throw new RangeError(`the wavelength or wavenumber must be a positive number, got ${value}`);
	checkUnit(unit);
	if (unit === 'cm-1') return ANGSTROM_PER_CM / value;
	if (medium !== 'air' && medium !== 'vacuum') throw new RangeError(`medium must be "air" or "vacuum", got "${String(medium)}"`);
	const angstrom = unit === 'A' ? value : unit === 'nm' ? value * 10 : value * 1e4;
	return medium === 'air' ? airToVacuum(angstrom) : angstrom;
}

/**
 * A vacuum wavelength (Å) expressed in the unit and medium asked for (cm⁻¹ ignores the medium).
 * Throws RangeError like `vacuumToAir` for air below 2000 Å, and for an unknown unit.
 * @example fromVacuumAngstrom(5000, 'cm-1', 'vacuum') // 20000
 */
export function fromVacuumAngstrom(vacuumA: number, unit: SpectralUnit, medium: Medium): number {
	checkWavelength('fromVacuumAngstrom', 'the vacuum wavelength', vacuumA);
	checkUnit(unit);
	if (unit === 'cm-1') return ANGSTROM_PER_CM / vacuumA;
	const angstrom = medium === 'air' ? vacuumToAir(vacuumA) : vacuumA;
	return unit === 'A' ? angstrom : unit === 'nm' ? angstrom / 10 : angstrom / 1e4;
}

/**
 * Wavenumber (cm⁻¹) of a vacuum wavelength (Å): σ = 10⁸/λ_vac. Throws RangeError for λ ≤ 0.
 * @example wavenumberOf(5000) // 20000
 */
export function wavenumberOf(vacuumA: number): number {
	checkWavelength('wavenumberOf', 'the vacuum wavelength', vacuumA);
	return ANGSTROM_PER_CM / vacuumA;
}

/**
 * Vacuum wavelength (Å) of a wavenumber (cm⁻¹): λ_vac = 10⁸/σ. Throws RangeError for σ ≤ 0.
 * @example vacuumWavelengthOf(20000) // 5000
 */
export function vacuumWavelengthOf(wavenumber: number): number {
	if (!Number.isFinite(wavenumber) || wavenumber <= 0)
		throw new RangeError(`the wavenumber must be a positive number of cm⁻¹, got ${wavenumber}`);
	return ANGSTROM_PER_CM / wavenumber;
}

/**
 * The wavelength a line list would quote for a vacuum wavelength: in air from 2000 Å up,
 * in vacuum below (the convention of Morton 2000 and of most line lists).
 * @example listedWavelength(1215.67) // { value: 1215.67, medium: 'vacuum' }
 */
export function listedWavelength(vacuumA: number): { value: number; medium: Medium } {
	checkWavelength('listedWavelength', 'the vacuum wavelength', vacuumA);
	return vacuumA < AIR_WAVELENGTH_LIMIT_A ? { value: vacuumA, medium: 'vacuum' } : { value: vacuumToAir(vacuumA), medium: 'air' };
}

/**
 * Converts an uncertainty in a wavelength unit to cm⁻¹ at the given vacuum wavelength:
 * |dσ| = 10⁸ dλ / λ² (dλ in Å; the air/vacuum difference of dλ is below 3·10⁻⁴ relative and ignored).
 * For cm⁻¹ the value is returned as is. Throws RangeError for a negative uncertainty.
 * @example uncertaintyToWavenumber(0.01, 'A', 5000) // 0.04 cm⁻¹
 */
export function uncertaintyToWavenumber(uncertainty: number, unit: SpectralUnit, vacuumA: number): number {
	if (!Number.isFinite(uncertainty) || uncertainty < 0) throw new RangeError(`the uncertainty must be a number ≥ 0, got ${uncertainty}`);
	checkUnit(unit);
	if (unit === 'cm-1') return uncertainty;
	const dA = unit === 'A' ? uncertainty : unit === 'nm' ? uncertainty * 10 : uncertainty * 1e4;
	return (ANGSTROM_PER_CM * dA) / (vacuumA * vacuumA);
}

function checkUnit(unit: string): void {
	if (!(SPECTRAL_UNITS as readonly string[]).includes(unit)) {
		throw new RangeError(`unit must be one of A (ångström), nm, um (micrometre) or cm-1, got "${unit}"`);
	}
}
