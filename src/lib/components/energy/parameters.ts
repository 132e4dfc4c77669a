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
