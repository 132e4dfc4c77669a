/**
 * Least-squares fit of E_av, Slater integrals and spin–orbit parameters to observed levels.
 *
 * Method: Levenberg–Marquardt (Levenberg 1944; Marquardt 1963) on analytic derivatives. H is
 * linear in the parameters, H = E_av + Σ_p P_p H_p, so by the Hellmann–Feynman theorem the
 * derivative of a level is ∂E/∂P_p = ⟨ψ|H_p|ψ⟩ (Cowan 1981, §16-2, the method used for level fits
 * since Racah's time). Derivatives are exact and cost nothing extra, which is why we use our own
 * small Levenberg–Marquardt loop (Gauss–Newton with a damping that makes it robust when the
 * eigenvectors still change a lot) instead of a generic fitter with numerical derivatives.
 * Observed levels are tied to computed levels of their J at every evaluation: by a fixed rank
 * within J (`assign` a number), or by the LS term they hold most of (`assign` a label such as
 * "3P" or "2D (v=3)"); without `assign`, the observed levels of each J in energy order take the
 * computed levels of that J in energy order. Terms follow the states through avoided crossings, where ranks and leading labels swap.
 * Uncertainties: the covariance (JᵀWJ)⁻¹ scaled by χ²/(N_obs − N_free) (common practice in
 * level fitting; Bevington & Robinson 2003, ch. 8).
 */
import type { Configuration, Subshell } from './types';
import { energyStructure, type EnergyStructure } from './energy-structure';
import { resolveParameters, type EnergyParameterInput } from './slater-parameters';
import { lsComposition, solveRaw, MODEL_ENERGY_CAUTION, type RawLevel } from './levels-ic';
import { asSubshells, parseConfiguration } from './parse';
import { halfString, parseHalf } from './half';

/** Largest number of observed levels in one fit. */
export const MAX_FIT_LEVELS = 2000;
/** Iteration limit of the Levenberg–Marquardt loop. */
export const MAX_FIT_ITERATIONS = 200;
/** Relative change of χ² below which the fit has converged (common practice, no source). */
export const FIT_CONVERGENCE = 1e-12;

export interface ObservedLevel {
	J: string;
	/** cm⁻¹, on the same scale as E_av. */
	energy: number;
	/** Standard uncertainty, cm⁻¹ (default 1: equal weights). */
	uncertainty?: number;
	/** The computed level it is: its leading LS label ("3F", "2D (v=3)") or its rank within J (1 = lowest). */
	assign?: string | number;
}

function twoJInClass(twoJ: number, c: { twoS: number; L: number }): boolean {
	return twoJ >= Math.abs(2 * c.L - c.twoS) && twoJ <= 2 * c.L + c.twoS && (twoJ - Math.abs(2 * c.L - c.twoS)) % 2 === 0;
}

export interface FitInput {
	/** Starting values (and the fixed values of everything not varied). */
	parameters: EnergyParameterInput;
	/** Ids to vary: "Eav", "F2(3d,3d)", "G1(2p,3s)", "zeta(3d)". */
	vary: string[];
	/** Parameter `id` held at `ratio` × `to` (ratio defaults to the starting ratio); `to` must be varied. */
	links?: { id: string; to: string; ratio?: number }[];
	bounds?: { id: string; min?: number; max?: number }[];
	observed: ObservedLevel[];
}

export interface FittedParameter {
	id: string;
	value: number;
	/** Standard uncertainty; null when fixed, or when there are no degrees of freedom. */
	sigma: number | null;
	status: 'varied' | 'fixed' | 'linked';
	linkedTo?: string;
	ratio?: number;
	atBound?: boolean;
}

export interface FitResidual {
	J: string;
	rank: number;
	label: string;
	observed: number;
	calculated: number;
	/** obs − calc, cm⁻¹ */
	residual: number;
}

export interface FitResult {
	config: string;
	parameters: FittedParameter[];
	residuals: FitResidual[];
	/** √(Σ(obs − calc)² / N_obs) */
	rms: number;
	/** √(Σ(obs − calc)² / dof), null for dof = 0 */
	standardDeviation: number | null;
	degreesOfFreedom: number;
	chiSquare: number;
	iterations: number;
	converged: boolean;
	method: string;
	caution: string;
}

interface Slot {
	id: string;
	/** -1 for E_av, else index into structure.params */
	index: number;
}

function slotOf(structure: EnergyStructure, all: readonly Subshell[], id: string, what: string): Slot {
	const text = String(id).trim();
	if (/^e_?av$/i.test(text)) return { id: 'Eav', index: -1 };
	const fg = /^([FG])\s*\^?\s*(\d+)\s*\(\s*([^,()]+?)\s*,\s*([^,()]+?)\s*\)$/.exec(text);
	const zeta = /^(?:zeta|ζ)\s*\(\s*([^()]+?)\s*\)$/i.exec(text);
	let probe: EnergyParameterInput;
	if (fg) probe = { [fg[1]]: [{ k: Number(fg[2]), a: fg[3], b: fg[4], value: 1 }] };
	else if (zeta) probe = { zeta: [{ shell: zeta[1], value: 1 }] };
	else throw new RangeError(`${what} "${text}" is not a parameter name: write Eav, F2(3d,3d), G1(2p,3s) or zeta(3d)`);
	const { values } = resolveParameters(structure.set, all, probe);
	const index = values.findIndex((v) => v === 1);
	return { id: structure.params[index].id, index };
}

/** Solves the small symmetric positive system A x = b by Gaussian elimination with pivoting; null when singular. */
function solve(A: number[][], b: number[]): number[] | null {
	const n = b.length;
	const M = A.map((row, i) => [...row, b[i]]);
	for (let c = 0; c < n; c++) {
		let p = c;
		for (let r = c + 1; r < n; r++) if (Math.abs(M[r][c]) > Math.abs(M[p][c])) p = r;
		if (Math.abs(M[p][c]) < 1e-300) return null;
		[M[c], M[p]] = [M[p], M[c]];
		for (let r = 0; r < n; r++) {
			if (r === c) continue;
			const f = M[r][c] / M[c][c];
			if (f !== 0) for (let k = c; k <= n; k++) M[r][k] -= f * M[c][k];
		}
	}
	return M.map((row, i) => row[n] / row[i]);
}

function inverse(A: number[][]): number[][] | null {
	const n = A.length;
	const cols: number[][] = [];
	for (let j = 0; j < n; j++) {
		const e = new Array(n).fill(0);
		e[j] = 1;
		const x = solve(A, e);
		if (!x) return null;
		cols.push(x);
	}
	return A.map((_, i) => cols.map((c) => c[i]));
}

function quadratic(P: Float64Array, v: Float64Array): number {
	const d = v.length;
	let s = 0;
	for (let a = 0; a < d; a++) {
		let t = 0;
		for (let b = 0; b < d; b++) t += P[a * d + b] * v[b];
		s += v[a] * t;
	}
	return s;
}

/**
 * Fits the varied parameters to the observed levels (see the file comment for the method).
 * Throws RangeError for: fewer observed levels than free parameters (the message says so), an
 * unknown or impossible parameter id, a link to a parameter that is not varied, a bad J or an
 * assignment that names no computed level, two observed levels on one computed level, bad bounds
 * or uncertainties, over MAX_FIT_LEVELS levels, or the budgets of the solver.
 * @example fitParameters('3d2', { parameters, vary: ['Eav', 'F2(3d,3d)'], observed }).rms // cm⁻¹
 */
export function fitParameters(
	cfg: string | Configuration | readonly Subshell[],
	input: FitInput,
	options: { limits?: { maxBlock?: number; maxTotal?: number } } = {}
): FitResult {
	const all = asSubshells(typeof cfg === 'string' ? parseConfiguration(cfg) : cfg);
	const structure = energyStructure(all, options.limits);
	const start = resolveParameters(structure.set, all, input.parameters);
	const observed = input.observed ?? [];
	if (observed.length > MAX_FIT_LEVELS)
		throw new RangeError(`A fit takes at most ${MAX_FIT_LEVELS} observed levels; ${observed.length} were given`);

	// Free, linked and fixed parameters.
	const free: Slot[] = [];
	for (const id of input.vary ?? []) {
		const s = slotOf(structure, all, id, 'vary:');
		if (free.some((f) => f.id === s.id)) throw new RangeError(`vary: ${s.id} is listed twice`);
		free.push(s);
	}
	const valueOf = (s: Slot, full: { Eav: number; values: Float64Array }) => (s.index < 0 ? full.Eav : full.values[s.index]);
	const links: { slot: Slot; to: number; ratio: number }[] = [];
	for (const l of input.links ?? []) {
		const slot = slotOf(structure, all, l.id, 'link:');
		const target = slotOf(structure, all, l.to, 'link:');
		const to = free.findIndex((f) => f.id === target.id);
		if (to < 0) throw new RangeError(`link: ${slot.id} is linked to ${target.id}, which is not varied; add ${target.id} to vary`);
		if (free.some((f) => f.id === slot.id))
			throw new RangeError(`link: ${slot.id} is varied; a linked parameter follows another and is not varied itself`);
		if (links.some((x) => x.slot.id === slot.id)) throw new RangeError(`link: ${slot.id} is linked twice`);
		let ratio = l.ratio;
		if (ratio === undefined) {
			const base = valueOf(target, start);
			if (base === 0) throw new RangeError(`link: ${target.id} starts at 0, so the ratio ${slot.id}/${target.id} must be given`);
			ratio = valueOf(slot, start) / base;
		}
		if (!Number.isFinite(ratio)) throw new RangeError(`link: the ratio of ${slot.id} to ${target.id} must be a finite number`);
		links.push({ slot, to, ratio });
	}
	const lo = free.map(() => -Infinity);
	const hi = free.map(() => Infinity);
	for (const b of input.bounds ?? []) {
		const s = slotOf(structure, all, b.id, 'bounds:');
		const i = free.findIndex((f) => f.id === s.id);
		if (i < 0) throw new RangeError(`bounds: ${s.id} is not varied, so it cannot have bounds`);
		if (b.min !== undefined) lo[i] = b.min;
		if (b.max !== undefined) hi[i] = b.max;
		if (!(lo[i] <= hi[i])) throw new RangeError(`bounds: the minimum of ${s.id} is above its maximum`);
	}
	if (free.length === 0) throw new RangeError('vary: choose at least one parameter to fit');
	if (observed.length < free.length) {
		throw new RangeError(
			`The fit has ${observed.length} observed level${observed.length === 1 ? '' : 's'} and ${free.length} free parameters: it needs at least as many observed levels as free parameters`
		);
	}

	const full = (x: number[]) => {
		const values = Float64Array.from(start.values);
		let Eav = start.Eav;
		const set = (s: Slot, v: number) => {
			if (s.index < 0) Eav = v;
			else values[s.index] = v;
		};
		free.forEach((s, i) => set(s, x[i]));
		for (const l of links) set(l.slot, l.ratio * x[l.to]);
		return { Eav, values };
	};
	const clamp = (x: number[]) => x.map((v, i) => Math.min(hi[i], Math.max(lo[i], v)));
	let x = clamp(free.map((s) => valueOf(s, start)));

	// Observed levels → (J space, rank), fixed from the starting parameters.
	const obs = observed.map((o, i) => {
		const twoJ = parseHalf(String(o.J));
		if (!Number.isFinite(o.energy)) throw new RangeError(`observed level ${i + 1}: the energy must be a finite number of cm⁻¹`);
		const sigma = o.uncertainty ?? 1;
		if (!Number.isFinite(sigma) || sigma <= 0)
			throw new RangeError(`observed level ${i + 1}: the uncertainty must be a positive number of cm⁻¹`);
		return { ...o, twoJ, sigma };
	});
	const startRaw = solveRaw(structure, full(x).Eav, full(x).values);
	const byJ = (raw: RawLevel[], twoJ: number) => raw.filter((r) => structure.spaces[r.space].twoJ === twoJ);
	// How each observed level finds its computed level at every evaluation: a fixed rank within J,
	// or the level of that J holding most of a named LS term (labels follow the states through
	// avoided crossings, where ranks and leading labels trade places).
	type Track = { mode: 'rank'; rank: number } | { mode: 'label'; classes: Set<number> };
	const classesFor = (want: string): Set<number> => {
		const norm = (t: string) => t.replace(/\s+/g, '').replace(/°/g, '').replace(/o$/, '');
		const m = /^(.*?)\(v=(\d+)\)$/.exec(norm(want));
		const term = m ? m[1] : norm(want);
		const v = m ? Number(m[2]) : null;
		const out = new Set<number>();
		structure.lsClasses.forEach((c, i) => {
			if (norm(termLabelOf(c)) === term && (v === null || c.seniority === v)) out.add(i);
		});
		return out;
	};
	const termLabelOf = (c: { twoS: number; L: number }) => `${c.twoS + 1}${'SPDFGHIKLMNOQRTUV'[c.L]}`;
	const usedRanks = new Set<string>();
	const track: Track[] = obs.map((o, i) => {
		const list = byJ(startRaw, o.twoJ);
		if (list.length === 0) throw new RangeError(`observed level ${i + 1}: the configuration has no level with J = ${halfString(o.twoJ)}`);
		if (typeof o.assign === 'number') {
			if (!Number.isInteger(o.assign) || o.assign < 1 || o.assign > list.length) {
				throw new RangeError(
					`observed level ${i + 1}: assign ${o.assign} must be a rank from 1 to ${list.length} among the levels with J = ${halfString(o.twoJ)}`
				);
			}
			const key = `${o.twoJ}:${o.assign}`;
			if (usedRanks.has(key))
				throw new RangeError(`observed level ${i + 1}: the computed level J = ${halfString(o.twoJ)} number ${o.assign} is assigned twice`);
			usedRanks.add(key);
			return { mode: 'rank', rank: o.assign };
		}
		if (typeof o.assign === 'string' && o.assign.trim() !== '') {
			const classes = classesFor(o.assign);
			const present = [...classes].some((c) => twoJInClass(o.twoJ, structure.lsClasses[c]));
			if (!present)
				throw new RangeError(`observed level ${i + 1}: no computed level with J = ${halfString(o.twoJ)} has the term ${o.assign}`);
			return { mode: 'label', classes };
		}
		return { mode: 'rank', rank: 0 }; // filled below
	});
	// No assignment: within each J, the unassigned observed levels in energy order take the free
	// computed ranks in order (the non-crossing rule keeps ranks meaningful while parameters move).
	const pending = obs.map((o, i) => ({ o, i })).filter(({ i }) => track[i].mode === 'rank' && (track[i] as { rank: number }).rank === 0);
	pending.sort((a, b) => a.o.twoJ - b.o.twoJ || a.o.energy - b.o.energy);
	for (const { o, i } of pending) {
		const count = byJ(startRaw, o.twoJ).length;
		let rank = 1;
		while (rank <= count && usedRanks.has(`${o.twoJ}:${rank}`)) rank++;
		if (rank > count)
			throw new RangeError(`observed level ${i + 1}: there are more observed than computed levels with J = ${halfString(o.twoJ)}`);
		usedRanks.add(`${o.twoJ}:${rank}`);
		track[i] = { mode: 'rank', rank };
	}
	const classWeight = (lev: RawLevel, classes: Set<number>) => {
		const sp = structure.spaces[lev.space];
		let w = 0;
		for (let a = 0; a < sp.dim; a++) if (classes.has(sp.lsOf[a])) w += lev.vector[a] * lev.vector[a];
		return w;
	};
	/** The computed level (and its rank within J) of every observed level for one solution. */
	const assignAll = (raw: RawLevel[]) => {
		const chosen: { lev: RawLevel; rank: number }[] = new Array(obs.length);
		const used = new Set<string>();
		obs.forEach((o, i) => {
			const t = track[i];
			if (t.mode === 'rank') {
				chosen[i] = { lev: byJ(raw, o.twoJ)[t.rank - 1], rank: t.rank };
				used.add(`${o.twoJ}:${t.rank}`);
			}
		});
		const pairs: { i: number; rank: number; lev: RawLevel; w: number }[] = [];
		obs.forEach((o, i) => {
			const t = track[i];
			if (t.mode !== 'label') return;
			byJ(raw, o.twoJ).forEach((lev, k) => pairs.push({ i, rank: k + 1, lev, w: classWeight(lev, t.classes) }));
		});
		pairs.sort((a, b) => b.w - a.w);
		for (const p of pairs) {
			if (chosen[p.i]) continue;
			const key = `${obs[p.i].twoJ}:${p.rank}`;
			if (used.has(key)) continue;
			used.add(key);
			chosen[p.i] = { lev: p.lev, rank: p.rank };
		}
		obs.forEach((o, i) => {
			if (!chosen[i])
				throw new RangeError(`observed level ${i + 1}: there are more observed than computed levels with J = ${halfString(o.twoJ)}`);
		});
		return chosen;
	};
	assignAll(startRaw);

	// Model at x: calculated energies and the Jacobian (rows: observed, cols: free).
	const model = (xv: number[]) => {
		const p = full(xv);
		const raw = solveRaw(structure, p.Eav, p.values);
		const calc: number[] = [];
		const jac: number[][] = [];
		const levels: RawLevel[] = [];
		const ranks: number[] = [];
		const chosen = assignAll(raw);
		obs.forEach((o, i) => {
			const lev = chosen[i].lev;
			ranks.push(chosen[i].rank);
			levels.push(lev);
			calc.push(lev.energy);
			const sp = structure.spaces[lev.space];
			const dP = (s: Slot) => (s.index < 0 ? 1 : quadratic(sp.param[s.index], lev.vector));
			const row = free.map((s) => dP(s));
			for (const l of links) row[l.to] += l.ratio * dP(l.slot);
			jac.push(row);
		});
		const chi2 = obs.reduce((a, o, i) => a + ((o.energy - calc[i]) / o.sigma) ** 2, 0);
		return { calc, jac, chi2, levels, ranks };
	};

	let current = model(x);
	let lambda = 1e-3;
	let iterations = 0;
	let converged = false;
	const m = free.length;
	while (iterations < MAX_FIT_ITERATIONS) {
		iterations++;
		const A = Array.from({ length: m }, () => new Array(m).fill(0));
		const g = new Array(m).fill(0);
		obs.forEach((o, i) => {
			const w = 1 / (o.sigma * o.sigma);
			const r = o.energy - current.calc[i];
			for (let a = 0; a < m; a++) {
				g[a] += w * current.jac[i][a] * r;
				for (let b = 0; b < m; b++) A[a][b] += w * current.jac[i][a] * current.jac[i][b];
			}
		});
		let improved = false;
		while (lambda < 1e16) {
			const D = A.map((row, a) => row.map((v, b) => (a === b ? v * (1 + lambda) + 1e-300 : v)));
			const step = solve(D, g);
			if (!step) {
				lambda *= 10;
				continue;
			}
			const trial = clamp(x.map((v, a) => v + step[a]));
			const next = model(trial);
			if (next.chi2 <= current.chi2) {
				const change = current.chi2 - next.chi2;
				const moved = trial.some((v, a) => v !== x[a]);
				x = trial;
				current = next;
				lambda = Math.max(lambda / 10, 1e-12);
				improved = true;
				if (!moved || change <= FIT_CONVERGENCE * Math.max(current.chi2, 1e-30) + 1e-24) converged = true;
				break;
			}
			lambda *= 10;
		}
		if (!improved) converged = true; // no step lowers χ²: at a minimum within rounding
		if (converged) break;
	}

	const dof = obs.length - m;
	const A = Array.from({ length: m }, () => new Array(m).fill(0));
	obs.forEach((o, i) => {
		const w = 1 / (o.sigma * o.sigma);
		for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) A[a][b] += w * current.jac[i][a] * current.jac[i][b];
	});
	const cov = dof > 0 ? inverse(A) : null;
	const scale = dof > 0 ? current.chi2 / dof : NaN;
	const sigmaOf = (a: number) => (cov ? Math.sqrt(Math.max(0, cov[a][a] * scale)) : null);
	const final = full(x);
	const parameters: FittedParameter[] = [];
	const slotValue = (s: Slot) => (s.index < 0 ? final.Eav : final.values[s.index]);
	const allSlots: Slot[] = [{ id: 'Eav', index: -1 }, ...structure.params.map((p, index) => ({ id: p.id, index }))];
	for (const s of allSlots) {
		const f = free.findIndex((y) => y.id === s.id);
		const l = links.find((y) => y.slot.id === s.id);
		if (f >= 0) {
			parameters.push({ id: s.id, value: slotValue(s), sigma: sigmaOf(f), status: 'varied', atBound: x[f] === lo[f] || x[f] === hi[f] });
		} else if (l) {
			const sg = sigmaOf(l.to);
			parameters.push({
				id: s.id,
				value: slotValue(s),
				sigma: sg === null ? null : Math.abs(l.ratio) * sg,
				status: 'linked',
				linkedTo: free[l.to].id,
				ratio: l.ratio
			});
		} else parameters.push({ id: s.id, value: slotValue(s), sigma: null, status: 'fixed' });
	}
	const residuals = obs.map((o, i) => ({
		J: halfString(o.twoJ),
		rank: current.ranks[i],
		label: lsComposition(structure, current.levels[i])[0]?.term ?? '',
		observed: o.energy,
		calculated: current.calc[i],
		residual: o.energy - current.calc[i]
	}));
	const sumSq = residuals.reduce((a, r) => a + r.residual * r.residual, 0);
	return {
		config: structure.config,
		parameters,
		residuals,
		rms: Math.sqrt(sumSq / obs.length),
		standardDeviation: dof > 0 ? Math.sqrt(sumSq / dof) : null,
		degreesOfFreedom: dof,
		chiSquare: current.chi2,
		iterations,
		converged,
		method:
			'Levenberg–Marquardt on the exact derivatives ∂E/∂P = ⟨ψ|H_P|ψ⟩ (H is linear in the parameters); uncertainties from (JᵀWJ)⁻¹ scaled by χ²/dof.',
		caution: MODEL_ENERGY_CAUTION
	};
}
