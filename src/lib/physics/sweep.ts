/**
 * The levels of one configuration along a path from pure LS to pure jj coupling:
 *   H(t) = E_av + (1 − t)·H_Coulomb(F^k, G^k) + t·H_spin–orbit(ζ),  t = 0 … 1,
 * so t = 0 is the LS limit (ζ → 0) and t = 1 the jj limit (F^k, G^k → 0) for the given parameters
 * (the classic picture of the change from LS to jj coupling, drawn in Condon & Shortley 1935,
 * ch. XI, for configurations such as p s). Levels of the same J never cross (von Neumann & Wigner 1929,
 * non-crossing rule), so the k-th lowest level of each J at every point is one continuous curve.
 */
import type { Configuration, Subshell } from './types';
import { energyStructure, jjWeight } from './energy-structure';
import { resolveParameters, type EnergyParameterInput } from './slater-parameters';
import { lsComposition, solveRaw, MODEL_ENERGY_CAUTION } from './levels-ic';
import { asSubshells, parseConfiguration } from './parse';
import { halfString } from './half';

/** Allowed number of points of a sweep. */
export const SWEEP_POINTS = { min: 2, max: 201, default: 61 } as const;

export interface SweepCurve {
	twoJ: number;
	J: string;
	/** 1 for the lowest level of this J, 2 for the next … */
	rank: number;
	/** cm⁻¹ at each t. */
	energies: number[];
	/** Leading LS term at t = 0. */
	lsLabel: string;
	/** Leading jj group label at t = 1 (empty when the configuration has no spin–orbit parameter). */
	jjLabel: string;
}

export interface SweepResult {
	config: string;
	parity: 'even' | 'odd';
	t: number[];
	curves: SweepCurve[];
	note: string;
	caution: string;
}

/**
 * The LS→jj sweep at `points` evenly spaced t (default 61). Throws like `intermediateLevels`, and
 * RangeError when points is not an integer from 2 to 201.
 * @example couplingSweep('2p 3s', params, { points: 3 }).t // [0, 0.5, 1]
 */
export function couplingSweep(
	cfg: string | Configuration | readonly Subshell[],
	input: EnergyParameterInput,
	options: { points?: number; limits?: { maxBlock?: number; maxTotal?: number } } = {}
): SweepResult {
	const points = options.points ?? SWEEP_POINTS.default;
	if (!Number.isInteger(points) || points < SWEEP_POINTS.min || points > SWEEP_POINTS.max) {
		throw new RangeError(
			`points = ${points} is not allowed: a sweep takes an integer from ${SWEEP_POINTS.min} to ${SWEEP_POINTS.max} points`
		);
	}
	const all = asSubshells(typeof cfg === 'string' ? parseConfiguration(cfg) : cfg);
	const structure = energyStructure(all, options.limits);
	const { Eav, values } = resolveParameters(structure.set, all, input);
	const isZeta = structure.params.map((p) => p.kind === 'zeta');
	const t: number[] = [];
	const curves = new Map<string, SweepCurve>();
	for (let i = 0; i < points; i++) {
		const ti = i / (points - 1);
		t.push(ti);
		const scaled = Float64Array.from(values, (v, p) => v * (isZeta[p] ? ti : 1 - ti));
		const raw = solveRaw(structure, Eav, scaled);
		const rankByJ = new Map<number, number>();
		for (const r of raw) {
			const twoJ = structure.spaces[r.space].twoJ;
			const rank = (rankByJ.get(twoJ) ?? 0) + 1;
			rankByJ.set(twoJ, rank);
			const key = `${twoJ}:${rank}`;
			let c = curves.get(key);
			if (!c) curves.set(key, (c = { twoJ, J: halfString(twoJ), rank, energies: [], lsLabel: '', jjLabel: '' }));
			c.energies.push(r.energy);
			if (i === 0) c.lsLabel = lsComposition(structure, r)[0]?.term ?? '';
			if (i === points - 1) {
				const sp = structure.spaces[r.space];
				let best = { label: '', w: -1 };
				for (const entry of sp.jj) {
					const w = jjWeight(entry, r.vector);
					const cls = entry.cls;
					if (w > best.w) best = { label: structure.jjClasses[cls].label, w };
				}
				c.jjLabel = best.label;
			}
		}
	}
	return {
		config: structure.config,
		parity: structure.parity,
		t,
		curves: [...curves.values()].sort((a, b) => a.twoJ - b.twoJ || a.rank - b.rank),
		note: 'H(t) = E_av + (1 − t)·(F^k, G^k terms) + t·(ζ terms): t = 0 is pure LS coupling, t = 1 pure jj coupling; curves of one J do not cross.',
		caution: MODEL_ENERGY_CAUTION
	};
}
