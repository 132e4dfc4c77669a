/**
 * Ritz wavenumbers: the line between two levels has σ = E_upper − E_lower (Ritz combination
 * principle, Ritz 1908), with the standard uncertainty of a difference of independent values,
 * u(σ) = √(u_upper² + u_lower²) (GUM, JCGM 100:2008, eq. 10 for uncorrelated inputs).
 * Energies and wavenumbers in cm⁻¹; wavelengths in Å, in vacuum and in standard air (./airvac.ts).
 */
import { AIR_WAVELENGTH_LIMIT_A, ANGSTROM_PER_CM, listedWavelength, vacuumToAir, type Medium } from './airvac';

/** A predicted line from two level energies. */
export interface RitzLine {
	/** σ = E_upper − E_lower, cm⁻¹. */
	wavenumber: number;
	/** u(σ), cm⁻¹; null when neither level has an uncertainty. */
	uncertainty: number | null;
	/** λ_vac = 10⁸/σ, Å. */
	vacuumA: number;
	/** u(λ_vac) = λ² u(σ)/10⁸, Å; null without an uncertainty. */
	vacuumUncertaintyA: number | null;
	/** λ_air, Å (Morton 2000 index); null below 2000 Å, where wavelengths are given in vacuum. */
	airA: number | null;
	/** The wavelength a line list quotes: air from 2000 Å up, vacuum below. */
	listed: { value: number; medium: Medium };
}

/**
 * u(σ) = √(u₁² + u₂²) of a Ritz difference; null when both are missing (unknown), a missing one counts as 0.
 * Throws RangeError for a negative or non-finite uncertainty.
 * @example ritzUncertainty(0.03, 0.04) // 0.05
 */
export function ritzUncertainty(lower: number | null | undefined, upper: number | null | undefined): number | null {
	for (const u of [lower, upper]) {
		if (u !== null && u !== undefined && (!Number.isFinite(u) || u < 0))
			throw new RangeError(`a level uncertainty must be a number ≥ 0 (cm⁻¹), got ${u}`);
	}
	if ((lower ?? null) === null && (upper ?? null) === null) return null;
	return Math.hypot(lower ?? 0, upper ?? 0);
}

/**
 * The Ritz line between a lower and an upper level (energies in cm⁻¹, optional uncertainties).
 * Throws RangeError when an energy is not finite or when E_upper ≤ E_lower (no emission line).
 * @example ritzLine(82259.16, 97492.3).airA // ≈ 6562.8 Å (Balmer Hα)
 */
export function ritzLine(
	lowerEnergy: number,
	upperEnergy: number,
	lowerUncertainty?: number | null,
	upperUncertainty?: number | null
): RitzLine {
	if (!Number.isFinite(lowerEnergy) || !Number.isFinite(upperEnergy)) {
		throw new RangeError(`level energies must be finite numbers of cm⁻¹, got ${lowerEnergy} and ${upperEnergy}`);
	}
	const sigma = upperEnergy - lowerEnergy;
	if (!(sigma > 0)) throw new RangeError(`the upper level (${upperEnergy} cm⁻¹) must lie above the lower one (${lowerEnergy} cm⁻¹)`);
	const u = ritzUncertainty(lowerUncertainty, upperUncertainty);
	const vacuumA = ANGSTROM_PER_CM / sigma;
	return {
		wavenumber: sigma,
		uncertainty: u,
		vacuumA,
		vacuumUncertaintyA: u === null ? null : (vacuumA * vacuumA * u) / ANGSTROM_PER_CM,
		airA: vacuumA >= AIR_WAVELENGTH_LIMIT_A ? vacuumToAir(vacuumA) : null,
		listed: listedWavelength(vacuumA)
	};
}
