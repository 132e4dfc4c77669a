/**
 * The Energy solver form's values as the API's parameter lists (EnergyParametersBody in $lib/api/types).
 */
import type { EnergyParametersBody } from '$lib/api/types';

/** Turns { "F2(3d,3d)": 60000, "zeta(3d)": 80 } into the API's lists; F and G values are multiplied by `scale`. */
export function parametersBody(values: Record<string, number>, Eav: number, scale = 1): EnergyParametersBody {
	const body: Required<EnergyParametersBody> = { Eav, F: [], G: [], zeta: [] };
	for (const [id, value] of Object.entries(values)) {
		if (!Number.isFinite(value)) continue;
		const fg = /^([FG])(\d+)\(([^,]+),([^)]+)\)$/.exec(id);
		const z = /^zeta\(([^)]+)\)$/.exec(id);
		if (fg) body[fg[1] as 'F' | 'G'].push({ k: Number(fg[2]), a: fg[3], b: fg[4], value: value * scale });
		else if (z) body.zeta.push({ shell: z[1], value });
	}
	return body;
}

/**
 * The API's lists as the form's values, the inverse of `parametersBody` (unscaled):
 * { F: [{ k: 2, a: '3d', b: '3d', value: 60000 }] } → { values: { 'F2(3d,3d)': 60000 }, Eav: 0 }.
 */
export function parametersValues(body: EnergyParametersBody): { values: Record<string, number>; Eav: number } {
	const values: Record<string, number> = {};
	for (const kind of ['F', 'G'] as const) for (const p of body[kind] ?? []) values[`${kind}${p.k}(${p.a},${p.b})`] = p.value;
	for (const z of body.zeta ?? []) values[`zeta(${z.shell})`] = z.value;
	return { values, Eav: body.Eav ?? 0 };
}

/** An annotated level as the fit's default list needs it. */
export interface NotedLevel {
	J: string;
	term: string;
	annotation: { observedEnergy: number | null; uncertainty: number | null; status: string } | null;
}

/**
 * The entry's annotated energies as the fit's observed list, one "J energy uncertainty term" per line
 * (disputed notes left out, as the server does; a missing uncertainty counts as 1 cm⁻¹, the engine's default).
 */
export function observedText(levels: readonly NotedLevel[]): string {
	return levels
		.flatMap((l) => {
			const a = l.annotation;
			if (!a || a.observedEnergy === null || a.status === 'disputed') return [];
			return [`${l.J} ${a.observedEnergy} ${a.uncertainty && a.uncertainty > 0 ? a.uncertainty : 1} ${l.term}`];
		})
		.join('\n');
}
