/**
 * The closed subshells a notation leaves unwritten, and the checks built on them: does a
 * configuration hold as many electrons as the species (Z − charge), and are two notations the
 * same configuration.
 *
 * People write only the outer part of a configuration: "2p2" for O III means 1s2 2s2 2p2, "4f3"
 * for Nd IV means [Xe] 4f3, "6s2 6p2" for Pb I means [Xe] 4f14 5d10 6s2 6p2. The rule used here
 * (common practice, no source; the filling orders are the Madelung order and the tabulated ground
 * configurations of elements.ts):
 *
 * 1. Let f be the written subshell that fills first in the Madelung (n + l, then n) order. If the
 *    notation starts at 1s (written out or through a core such as [Ar]), nothing is implied.
 * 2. Candidates: with a species, the closed subshells of its ground configuration; without one,
 *    every subshell that fills before f in the Madelung order (all closed).
 * 3. A candidate not written in the notation is implied when it belongs to the largest noble-gas
 *    core of the candidates, or has n ≤ n(f) — so 6s is not assumed under 4f3 (Nd IV is [Xe] 4f3),
 *    and the 4s² of Ca I is not assumed under the excited 3d 4p, but 2s² is under O III 2p².
 */
import type { Configuration, Subshell } from './types';
import { NOBLE_GAS_CORES, CORE_NAMES, bySubshellOrder, configurationOf, formatConfiguration, subshellCapacity } from './parse';
import { groundConfiguration, speciesLabel, type Species } from './elements';

const madelungBefore = (a: { n: number; l: number }, b: { n: number; l: number }) =>
	a.n + a.l < b.n + b.l || (a.n + a.l === b.n + b.l && a.n < b.n);

/** Every subshell that fills before `f` in the Madelung order, full. */
function filledBefore(f: { n: number; l: number }): Subshell[] {
	const list: Subshell[] = [];
	for (let n = 1; n <= f.n + f.l; n++)
		for (let l = 0; l < n; l++) if (madelungBefore({ n, l }, f)) list.push({ n, l, occupancy: subshellCapacity(l) });
	return list;
}

/** The largest noble-gas core all of whose subshells are in the list (closed). */
function coreWithin(list: readonly Subshell[]): readonly Subshell[] {
	let best: readonly Subshell[] = [];
	for (const name of CORE_NAMES) {
		const core = NOBLE_GAS_CORES[name];
		if (core.every((c) => list.some((s) => s.n === c.n && s.l === c.l && s.occupancy === c.occupancy))) best = core;
		else break;
	}
	return best;
}

/**
 * The closed subshells that a written configuration implies but does not write (rule in the module
 * comment), sorted by n then l. Pass the species when it is known. Throws SpeciesError only for a
 * species that is not valid.
 * @example impliedClosedSubshells(parseConfiguration('2p2')) // [1s2, 2s2]
 */
export function impliedClosedSubshells(cfg: Configuration, species: Species | null = null): Subshell[] {
	const written = cfg.subshells;
	if (written.length === 0) return [];
	const f = written.reduce((a, s) => (madelungBefore(s, a) ? s : a));
	if (f.n === 1 && f.l === 0) return [];
	const candidates = species
		? groundConfiguration(species).configuration.subshells.filter((s) => s.occupancy === subshellCapacity(s.l))
		: filledBefore(f);
	const core = coreWithin(candidates);
	const isWritten = (s: Subshell) => written.some((w) => w.n === s.n && w.l === s.l);
	return candidates
		.filter((s) => !isWritten(s) && (core.some((c) => c.n === s.n && c.l === s.l) || s.n <= f.n))
		.map((s) => ({ ...s }))
		.sort(bySubshellOrder);
}

/**
 * The configuration with its implied closed subshells added.
 * @example formatConfiguration(completeConfiguration(parseConfiguration('2p2'))) // '1s2 2s2 2p2'
 */
export function completeConfiguration(cfg: Configuration, species: Species | null = null): Configuration {
	return configurationOf([...cfg.subshells, ...impliedClosedSubshells(cfg, species)]);
}

/**
 * Whether two written configurations are the same configuration: equal subshell by subshell after
 * expanding cores, sorting, and adding the implied closed subshells (with each side's species when
 * known). So "2p2", "1s2 2s2 2p2", "[He] 2s2 2p2" and "2s2.2p2" are the same; "2p2" and "2p4" are not,
 * nor are "[Ar] 4s" and "[Ar] 3d10 4s".
 * @example sameConfiguration(parseConfiguration('3d6 4s'), parseConfiguration('[Ar] 4s1 3d6')) // true
 */
export function sameConfiguration(
	a: Configuration,
	b: Configuration,
	speciesA: Species | null = null,
	speciesB: Species | null = null
): boolean {
	const x = completeConfiguration(a, speciesA).subshells;
	const y = completeConfiguration(b, speciesB).subshells;
	return x.length === y.length && x.every((s, i) => s.n === y[i].n && s.l === y[i].l && s.occupancy === y[i].occupancy);
}

/** The electron count of a configuration against its species. */
export interface ElectronCheck {
	/** Electrons written plus implied. */
	counted: number;
	/** Z − charge. */
	expected: number;
	/** The implied closed subshells, e.g. "1s2 2s2" ('' when none). */
	assumed: string;
	/** null when the counts agree; otherwise a warning that says what was assumed. */
	warning: string | null;
}

/**
 * Counts the electrons of a written configuration, with the closed subshells it implies, against
 * Z − charge of the species (a neutral atom of atomic number Z has Z electrons; general fact).
 * Never throws for a valid species and configuration: a disagreement is a warning, not an error.
 * @example checkElectrons(parseSpecies('O III'), parseConfiguration('2p4')).warning // 'O III has 6 electrons …'
 */
export function checkElectrons(species: Species, cfg: Configuration): ElectronCheck {
	const implied = impliedClosedSubshells(cfg, species);
	const assumed = implied.length ? formatConfiguration(implied) : '';
	const counted = cfg.electrons + implied.reduce((a, s) => a + s.occupancy, 0);
	const expected = species.Z - species.charge;
	const label = speciesLabel(species);
	const written = formatConfiguration(cfg, { compactCore: true });
	const warning =
		counted === expected
			? null
			: `${label} has ${expected} electron${expected === 1 ? '' : 's'} (Z = ${species.Z}, charge ${species.charge}), but ${written} holds ${counted}` +
				(assumed ? ` with the closed subshells it implies (${assumed} assumed)` : '') +
				`. Check the species and the configuration; write the inner subshells out (as in ${formatConfiguration(completeConfiguration(cfg, species), { compactCore: true })}) to state exactly which are filled.`;
	return { counted, expected, assumed, warning };
}
