/**
 * Starting parameter sets for the Energy solver. Each literature set says where its numbers come
 * from; they are starting points for a fit, not results. "Typical magnitudes" fills any
 * configuration with round numbers of the usual size (common practice, no source).
 */
import { slaterFromRacah } from '$lib/physics/slater-parameters';

export interface ParameterPreset {
	id: string;
	name: string;
	note: string;
	/** The configuration the set was derived for (open subshells as the engine writes them); it is chosen by itself only there. */
	config: string;
	/** Exact set of parameter ids the preset is meant for. */
	ids: string[];
	values: Record<string, number>;
}

const d = (shell: string, B: number, C: number, zeta: number) => {
	const { F2, F4 } = slaterFromRacah(B, C);
	return { [`F2(${shell},${shell})`]: Math.round(F2), [`F4(${shell},${shell})`]: Math.round(F4), [`zeta(${shell})`]: zeta };
};

export const LITERATURE_PRESETS: ParameterPreset[] = [
	{
		id: 'c1-2p2',
		config: '2p2',
		name: 'C I 2p²',
		note: 'Derived here from the C I term energies ¹D₂ ≈ 10 193 cm⁻¹ (= 6F₂ above ³P) and the ³P intervals ≈ 16 and 27 cm⁻¹, quoted from memory of the standard level tables.',
		ids: ['F2(2p,2p)', 'zeta(2p)'],
		values: { 'F2(2p,2p)': 42500, 'zeta(2p)': 27 }
	},
	{
		id: 'v3-3d2',
		config: '3d2',
		name: 'V³⁺ free ion 3d²',
		note: 'Free-ion Racah B = 861, C = 4165 and ζ = 209 cm⁻¹ as tabulated in ligand-field texts (e.g. Figgis & Hitchman 2000), quoted from memory.',
		ids: ['F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)'],
		values: d('3d', 861, 4165, 209)
	},
	{
		id: 'ni2-3d8',
		config: '3d8',
		name: 'Ni²⁺ free ion 3d⁸',
		note: 'Free-ion Racah B = 1041, C = 4831 and ζ = 649 cm⁻¹ (ligand-field tables, e.g. Lever 1984), quoted from memory.',
		ids: ['F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)'],
		values: d('3d', 1041, 4831, 649)
	},
	{
		id: 'pr3-4f2',
		config: '4f2',
		name: 'Pr³⁺ 4f² (in LaF₃)',
		note: 'Crystal-field-free part of the Pr³⁺:LaF₃ parameters of Carnall, Goodman, Rajnak & Rana (J. Chem. Phys. 90, 3443, 1989), rounded, quoted from memory.',
		ids: ['F2(4f,4f)', 'F4(4f,4f)', 'F6(4f,4f)', 'zeta(4f)'],
		values: { 'F2(4f,4f)': 68955, 'F4(4f,4f)': 50505, 'F6(4f,4f)': 33098, 'zeta(4f)': 751 }
	},
	{
		id: 'nd3-4f3',
		config: '4f3',
		name: 'Nd³⁺ 4f³ (in LaF₃)',
		note: 'Crystal-field-free part of the Nd³⁺:LaF₃ parameters of Carnall, Goodman, Rajnak & Rana (1989), rounded, quoted from memory.',
		ids: ['F2(4f,4f)', 'F4(4f,4f)', 'F6(4f,4f)', 'zeta(4f)'],
		values: { 'F2(4f,4f)': 73018, 'F4(4f,4f)': 52789, 'F6(4f,4f)': 35757, 'zeta(4f)': 884 }
	}
];

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
