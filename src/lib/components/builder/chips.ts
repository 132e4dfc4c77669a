/**
 * The chips of the Builder: what the Tray offers and what sits on the Rail.
 * Plain data and small pure helpers (no physics beyond the Pauli capacity, which comes from the engine).
 */
import { CORE_NAMES, NOBLE_GAS_CORES, subshellCapacity } from '$lib/physics/parse';
import { L_LETTERS } from '$lib/physics/letters';

/** One chip, in the Tray or on the Rail. svelte-dnd-action needs a unique `id` per chip. */
export interface Chip {
	id: string;
	/** "3d" for a subshell, "[Ar]" for a noble-gas core. Unique on the Rail. */
	key: string;
	kind: 'subshell' | 'core';
	n: number;
	l: number;
	/** Electrons: 1 … 2(2l+1) for a subshell; the fixed electron count of a core. */
	occupancy: number;
}

/** Subshells offered in the Tray, in n-then-l order. */
const TRAY_SUBSHELLS = '1s 2s 2p 3s 3p 3d 4s 4p 4d 4f 5s 5p 5d 5f 5g 6s 6p 6d 6f 6g 6h 7s 7p'.split(' ');

/** Letters shown before "more" is opened. */
const BASIC_LETTERS = 'spd';

export const subshellKey = (n: number, l: number) => `${n}${L_LETTERS[l]}`;
export const coreKey = (name: string) => `[${name}]`;

export interface TraySpec {
	key: string;
	kind: 'subshell' | 'core';
	n: number;
	l: number;
	occupancy: number;
	basic: boolean;
}

export const TRAY_SPECS: readonly TraySpec[] = TRAY_SUBSHELLS.map((k) => {
	const n = Number(k.slice(0, -1));
	const l = L_LETTERS.indexOf(k.slice(-1));
	return { key: k, kind: 'subshell' as const, n, l, occupancy: 1, basic: BASIC_LETTERS.includes(k.slice(-1)) };
});

export const CORE_SPECS: readonly TraySpec[] = CORE_NAMES.map((name) => ({
	key: coreKey(name),
	kind: 'core' as const,
	n: 0,
	l: 0,
	occupancy: NOBLE_GAS_CORES[name].reduce((a, s) => a + s.occupancy, 0),
	basic: true
}));

/** The Pauli limit of a chip: 2(2l+1) for a subshell (the engine's `subshellCapacity`). */
export const capacityOf = (chip: Pick<Chip, 'kind' | 'l' | 'occupancy'>) =>
	chip.kind === 'core' ? chip.occupancy : subshellCapacity(chip.l);

/** Core name of a core chip key: "[Ar]" → "Ar". */
export const coreName = (key: string) => key.slice(1, -1);

/** Whether the subshell n l is one of the closed subshells of the named core. */
export function inCore(core: string | null, n: number, l: number): boolean {
	if (!core) return false;
	return (NOBLE_GAS_CORES[core] ?? []).some((s) => s.n === n && s.l === l);
}

let seq = 0;
/** A fresh chip id (ids must be unique across the Tray and the Rail). */
export const freshId = (prefix: string) => `${prefix}-${(++seq).toString(36)}`;
