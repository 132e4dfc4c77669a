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

/** The session-storage key of the kept sets (one browser tab keeps them across reloads). */
export const SOLVER_STORAGE_KEY = 'termwright.solver-parameters';

/** A kept set read back from storage: the shape is checked, anything else is dropped. */
function isSolverSet(x: unknown): x is SolverSet {
	const s = x as SolverSet;
	const numbers = (r: unknown) => !!r && typeof r === 'object' && Object.values(r).every((v) => typeof v === 'number');
	return (
		!!s &&
		Array.isArray(s.ids) &&
		s.ids.every((id) => typeof id === 'string') &&
		typeof s.presetId === 'string' &&
		numbers(s.values) &&
		typeof s.Eav === 'number' &&
		typeof s.scale === 'number' &&
		!!s.start &&
		numbers(s.start.values) &&
		typeof s.start.Eav === 'number'
	);
}

export class SolverParameters {
	#sets = $state<Record<string, SolverSet>>({});
	#storage: Pick<Storage, 'getItem' | 'setItem'> | undefined;

	/**
	 * With `storage` (the Builder passes the tab's sessionStorage), the sets also survive a reload of
	 * the page; without it (server rendering, tests) they live as long as the page.
	 */
	constructor(storage?: Pick<Storage, 'getItem' | 'setItem'>) {
		this.#storage = storage;
		try {
			const saved = JSON.parse(storage?.getItem(SOLVER_STORAGE_KEY) ?? '{}') as Record<string, unknown>;
			for (const [config, set] of Object.entries(saved ?? {})) if (isSolverSet(set)) this.#sets[config] = set;
		} catch {
			// Unreadable storage starts empty: the solver starts from its presets.
		}
	}

	#save(): void {
		try {
			this.#storage?.setItem(SOLVER_STORAGE_KEY, JSON.stringify($state.snapshot(this.#sets)));
		} catch {
			// A full or blocked storage only costs the reload memory.
		}
	}

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
		this.#save();
	}

	forget(config: string): void {
		delete this.#sets[keyOf(config)];
		this.#save();
	}
}
