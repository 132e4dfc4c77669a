/**
 * The Energy solver's parameters as the Builder keeps them between its tabs, one set per configuration:
 * the solver is unmounted when another tab is shown, so without this a return to it (or the Coupling
 * bridge's computed curves) would start from the preset again. A configuration not kept yet starts from
 * its preset (the solver's own choice, presets.ts).
 */
import type { EnergyParametersBody } from '$lib/api/types';
import { parametersBody } from './parameters';

/** What the solver's form holds for one configuration, and what it started from. */
export interface SolverSet {
	/** The parameter ids the engine named for the configuration (a set for other ids does not apply). */
	ids: string[];
	presetId: string;
	values: Record<string, number>;
	Eav: number;
	/** F^k and G^k scaling in percent. */
	scale: number;
	/** The chosen preset's values and E_av as the form started from them, to tell an edited set. */
	start: { values: Record<string, number>; Eav: number };
}

/** True when the set differs from the preset it started from (a value, E_av, or the scaling). */
export function isEdited(set: SolverSet): boolean {
	if (set.scale !== 100 || set.Eav !== set.start.Eav) return true;
	return set.ids.some((id) => set.values[id] !== set.start.values[id]);
}

/** The set as the API takes it (F^k, G^k scaled). */
export function solverBody(set: SolverSet): EnergyParametersBody {
	return parametersBody(set.values, set.Eav, set.scale / 100);
}

/** The trimmed configuration text is the key, as the solver and the bridge both send it. */
const keyOf = (config: string) => config.trim();

export class SolverParameters {
	#sets = $state<Record<string, SolverSet>>({});

	/** The set kept for `config` with exactly these parameter ids (`ids` omitted: any), else null. */
	get(config: string, ids?: readonly string[]): SolverSet | null {
		const set = this.#sets[keyOf(config)];
		if (!set) return null;
		if (ids && set.ids.join('|') !== ids.join('|')) return null;
		return set;
	}

	/** Keeps a copy, so later edits of the caller's objects do not leak in. */
	keep(config: string, set: SolverSet): void {
		const copy = $state.snapshot(set) as SolverSet;
		this.#sets[keyOf(config)] = copy;
	}

	forget(config: string): void {
		delete this.#sets[keyOf(config)];
	}
}
