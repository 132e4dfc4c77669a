/**
 * The Energy solver's parameter ids for a configuration, worked out in the page from the pure engine
 * (the same `radialParameters` the server resolves against), so a picture that only needs the ids
 * (the Coupling bridge's computed curves) does not first ask the server for every level.
 */
import { orbitalSet } from '$lib/physics/determinants';
import { formatConfiguration, parseConfiguration } from '$lib/physics/parse';
import { radialParameters } from '$lib/physics/slater-parameters';

/**
 * `config` as the engine writes it (what `startingPreset` matches) and its parameter ids, in the
 * engine's order; null when the text is not a configuration (the server's answer then says why).
 * @example solverParameterIds('3d2') // { config: '3d2', ids: ['F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)'] }
 */
export function solverParameterIds(text: string): { config: string; ids: string[] } | null {
	try {
		const parsed = parseConfiguration(text);
		return { config: formatConfiguration(parsed.subshells), ids: radialParameters(orbitalSet(parsed.subshells)).map((p) => p.id) };
	} catch {
		return null;
	}
}
