/**
 * Starting parameter sets for the Energy solver. Each literature set says where its numbers come
 * from; they are starting points for a fit, not results. "Typical magnitudes" fills any
 * configuration with round numbers of the usual size (common practice, no source).
 */
import { slaterFromRacah } from '$lib/physics/slater-parameters';
import stored from './literature-presets.json';

export interface ParameterPreset {
	id: string;
	name: string;
	note: string;
	/** The configuration the set was derived for (open subshells as the engine writes them); it is chosen by itself only there. */
	config: string;
	/** Exact set of parameter ids the preset is meant for. */
	ids: string[];
	values: Record<string, number>;
	/** Where the set comes from, shown beside its name (default: literature); 'saved' sets give missing ids 0, not a typical value. */
	source?: 'literature' | 'saved';
}

/**
 * The literature sets themselves live in literature-presets.json (data, with each set's source in
 * its note). A d^n set is written there as Racah's B and C with ζ, and turned into F², F⁴ here by
 * the engine's own conversion (F² = 49B + 7C, F⁴ = 63C/5; Racah 1942).
 */
interface StoredPreset {
	id: string;
	config: string;
	name: string;
	note: string;
	values?: Record<string, number>;
	racah?: { shell: string; B: number; C: number; zeta: number };
}

function fromRacah({ shell, B, C, zeta }: NonNullable<StoredPreset['racah']>): Record<string, number> {
	const { F2, F4 } = slaterFromRacah(B, C);
	return { [`F2(${shell},${shell})`]: Math.round(F2), [`F4(${shell},${shell})`]: Math.round(F4), [`zeta(${shell})`]: zeta };
}

export const LITERATURE_PRESETS: ParameterPreset[] = (stored as StoredPreset[]).map(({ racah, values, ...rest }) => {
	const all = racah ? fromRacah(racah) : (values ?? {});
	return { ...rest, ids: Object.keys(all), values: all };
});

/** Round numbers of the usual size for any parameter id (cm⁻¹; common practice, no source). */
export function typicalValue(id: string): number {
	const fg = /^([FG])(\d+)\((\d+)([a-z]),(\d+)([a-z])\)$/.exec(id);
	if (fg) {
		const k = Number(fg[2]);
		const same = fg[3] === fg[5] && fg[4] === fg[6];
		if (fg[1] === 'F' && same) return Math.round(80000 * Math.pow(0.65, k / 2 - 1));
		if (fg[1] === 'F') return Math.round(20000 * Math.pow(0.6, k / 2 - 1));
		return Math.round(10000 / (k + 1));
	}
	const z = /^zeta\(\d+([a-z])\)$/.exec(id);
	if (z) return { p: 500, d: 500, f: 1000 }[z[1]] ?? 300;
	return 0;
}

/** The presets that fit a configuration's parameter ids (same set of ids). */
export function presetsFor(ids: readonly string[]): ParameterPreset[] {
	const key = [...ids].sort().join('|');
	return LITERATURE_PRESETS.filter((p) => [...p.ids].sort().join('|') === key);
}

/** The name the Energy solver gives its round-number start (the form's "typical" choice). */
export const TYPICAL_NAME = 'Typical magnitudes (no particular ion)';

/** "[Ne] 2p2" or "2p2  3s" → "2p2" / "2p2 3s": the open subshells as the presets' `config` names them. */
function openPart(config: string): string {
	return config
		.replace(/\[[A-Za-z]+\]/g, '')
		.replace(/\s+/g, ' ')
		.trim();
}

/**
 * The literature set the Energy solver starts from by itself for a configuration: one of `presets`
 * derived for exactly this configuration (typed `asked`, or as the engine wrote it, `engine`), else
 * null (typical magnitudes). 3d³ does not start from the V³⁺ 3d² values; they stay in the list.
 */
export function startingPreset(presets: readonly ParameterPreset[], asked: string, engine: string): ParameterPreset | null {
	const open = openPart(asked);
	return presets.find((p) => p.config === open || p.config === engine) ?? null;
}

/**
 * The form's values for `ids` from a preset: its own value, else a typical one (a saved set gives a
 * missing id 0, as the engine reads it). `null` gives typical magnitudes throughout.
 */
export function presetValues(ids: readonly string[], preset: ParameterPreset | null): Record<string, number> {
	const own = preset?.source === 'saved';
	return Object.fromEntries(ids.map((p) => [p, preset?.values[p] ?? (own ? 0 : typicalValue(p))]));
}
