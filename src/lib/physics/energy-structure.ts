/**
 * Everything about a configuration's energy matrix that does not depend on the parameter values,
 * built once and reused by the level solver, the LS→jj sweep and the fit.
 *
 * Method. Every level of J has exactly one state with M_J = 0 (or ½), so that one determinant
 * block holds one state of every level (Condon & Shortley 1935, §3⁴). In this block an LS-coupled
 * basis |γ S L J⟩ is built (below), which splits the block into J subspaces with orthonormal bases
 * V_J. Because H commutes with J², each parameter's matrix is projected once,
 * H_p^J = V_Jᵀ H_p V_J, and every later evaluation only sums and diagonalises the small J blocks.
 * LS classes are the joint eigenspaces of L², S² (and Racah's pairing operator for one open
 * subshell, which gives the seniority); L², S² and the pairing conserve M_L and M_S, so they are
 * diagonalised per (M_L, M_S) piece of the block, and J² is then diagonalised inside each class.
 * The LS composition of a level is then the sum of its squared coefficients per class. jj classes are the eigenspaces of the
 * one-electron l·s of each subshell (which count the electrons with j = l − ½ and j = l + ½).
 */
import type { Configuration, Subshell } from './types';
import { centralTwoMJ, checkDeterminantBudget, determinantBlock, orbitalSet, type OrbitalSet } from './determinants';
import { parameterMatrices, type ParameterMatrices } from './hamiltonian';
import { jSquared, lSquared, pairing, seniorityFromPairing, sSquared } from './momentum-operators';
import { radialParameters, shellName, type RadialParameter } from './slater-parameters';
import { symmetricEigen } from './symmetric-eigen';
import { asSubshells, formatConfiguration } from './parse';
import { halfString } from './half';

/** How far an eigenvalue of J², L², S² may sit from k(k+1) before the classification is refused (common practice, no source). */
export const QUANTUM_NUMBER_TOLERANCE = 1e-6;

/** One LS class: a term (with seniority for one open subshell). */
export interface LsClass {
	twoS: number;
	L: number;
	seniority: number | null;
}

/** One jj class: how many electrons of each open subshell sit in j = l − ½ (the rest in j = l + ½). */
export interface JjClass {
	lower: number[];
	label: string;
}

/** One J subspace of the central block. */
export interface JSpace {
	twoJ: number;
	dim: number;
	/** Basis vectors as rows (dim × n). */
	basis: Float64Array;
	/** Projected parameter matrices, dim × dim each, with the configuration average already subtracted. */
	param: Float64Array[];
	/** The basis is LS-coupled: the LS class (index into `lsClasses`) of each basis vector. */
	lsOf: Int32Array;
	jj: { cls: number; projector: Float64Array }[];
}

export interface EnergyStructure {
	config: string;
	parity: 'even' | 'odd';
	set: OrbitalSet;
	params: RadialParameter[];
	/** Number of determinants of the whole configuration (all M_J). */
	totalDeterminants: number;
	blockSize: number;
	lsClasses: LsClass[];
	jjClasses: JjClass[];
	spaces: JSpace[];
	/** Built with the sparse per-parameter matrices of the block (kept for tests and derivatives). */
	matrices: ParameterMatrices;
}

const cache = new Map<string, EnergyStructure>();
const CACHE_SIZE = 6;

/** Empties the structure cache (benchmarks measure cold runs with it). */
export function clearEnergyCache(): void {
	cache.clear();
}

/**
 * V H_p Vᵀ for every parameter p, with V the dim × n basis (rows) and H_p the sparse upper-triangle
 * entries. Works column-major (n × dim) so that every inner loop runs over contiguous memory.
 */
function projectParameters(m: ParameterMatrices, basis: Float64Array, dim: number, n: number): Float64Array[] {
	const Vt = new Float64Array(n * dim);
	for (let a = 0; a < dim; a++) for (let i = 0; i < n; i++) Vt[i * dim + a] = basis[a * n + i];
	const T = m.params.map(() => new Float64Array(n * dim));
	const { rows, cols, coef, param } = m;
	for (let e = 0; e < rows.length; e++) {
		const r = rows[e] * dim;
		const c = cols[e] * dim;
		const v = coef[e];
		const t = T[param[e]];
		for (let a = 0; a < dim; a++) t[c + a] += v * Vt[r + a];
		if (r !== c) for (let a = 0; a < dim; a++) t[r + a] += v * Vt[c + a];
	}
	return T.map((t) => {
		const P = new Float64Array(dim * dim);
		for (let i = 0; i < n; i++) {
			const o = i * dim;
			for (let a = 0; a < dim; a++) {
				const va = Vt[o + a];
				if (va === 0) continue;
				const pa = a * dim;
				for (let b = 0; b < dim; b++) P[pa + b] += va * t[o + b];
			}
		}
		return P;
	});
}

function nearestTwoK(x: number, what: string): number {
	// x = K(K+1) → 2K
	const twoK = Math.round(Math.sqrt(1 + 4 * x) - 1);
	const K = twoK / 2;
	if (Math.abs(K * (K + 1) - x) > QUANTUM_NUMBER_TOLERANCE * Math.max(1, x)) {
		throw new Error(`internal error: ${what} eigenvalue ${x} is not of the form k(k+1)`);
	}
	return twoK;
}

/**
 * The parameter-independent structure of a configuration (cached, a few configurations at a time).
 * Throws RangeError over the determinant budgets (message states the limit), ConfigurationError
 * for bad notation, and RangeError when no subshell is open.
 * @example energyStructure(parseConfiguration('3d2')).spaces.map((s) => s.twoJ) // [0, 2, 4, 6, 8]
 */
export function energyStructure(
	cfg: Configuration | readonly Subshell[],
	limits: { maxBlock?: number; maxTotal?: number } = {}
): EnergyStructure {
	const all = asSubshells(cfg);
	const set = orbitalSet(all);
	const config = formatConfiguration(all);
	const key = `${config}|${limits.maxBlock ?? ''}|${limits.maxTotal ?? ''}`;
	const hit = cache.get(key);
	if (hit) return hit;
	if (set.shells.length === 0) throw new RangeError(`${config} has no open subshell: it has a single level ¹S₀ and nothing to solve`);
	const { total } = checkDeterminantBudget(set.shells, limits);
	const params = radialParameters(set);
	const twoM = centralTwoMJ(set.electrons);
	const block = determinantBlock(set, twoM);
	const n = block.size;
	const matrices = parameterMatrices(set, block, params);

	// LS classes per (M_L) piece; within the block M_S is fixed by M_L, and L², S² and the pairing
	// operator conserve M_L, so each piece is diagonalised on its own.
	const L2 = lSquared(set, block);
	const S2 = sSquared(set, block);
	const J2 = jSquared(set, block);
	const single = set.shells.length === 1 && set.shells[0].occupancy >= 2 ? pairing(set, block, 0) : null;
	const lsClasses: LsClass[] = [];
	const lsIndex = new Map<string, number>();
	/** Per class: its vectors, each supported on one piece (indices into the block and values). */
	const classVectors: { idx: number[]; val: Float64Array }[][] = [];
	const pieces = new Map<number, number[]>();
	for (let i = 0; i < n; i++) {
		const list = pieces.get(block.ML[i]);
		if (list) list.push(i);
		else pieces.set(block.ML[i], [i]);
	}
	// Irrational weights keep the joint eigenvalues of different classes apart (common practice, no source).
	const wS = Math.PI;
	const wQ = Math.E / 7;
	for (const idx of pieces.values()) {
		const m = idx.length;
		const K = new Float64Array(m * m);
		for (let a = 0; a < m; a++)
			for (let b = 0; b < m; b++) {
				const ia = idx[a] * n + idx[b];
				K[a * m + b] = L2[ia] + wS * S2[ia] + (single ? wQ * single[ia] : 0);
			}
		const eig = symmetricEigen(K, m);
		for (let r = 0; r < m; r++) {
			const val = eig.vectors.slice(r * m, r * m + m);
			let l2 = 0;
			let s2 = 0;
			let q = 0;
			for (let a = 0; a < m; a++)
				for (let b = 0; b < m; b++) {
					const w = val[a] * val[b];
					const ia = idx[a] * n + idx[b];
					l2 += w * L2[ia];
					s2 += w * S2[ia];
					if (single) q += w * single[ia];
				}
			const L = nearestTwoK(l2, 'L²') / 2;
			const twoS = nearestTwoK(s2, 'S²');
			let seniority: number | null = null;
			if (single) {
				const sv = seniorityFromPairing(set.shells[0].l, set.shells[0].occupancy, q);
				if (sv.error > 1e-6 * Math.max(1, q)) throw new Error(`internal error: pairing eigenvalue ${q} fits no seniority`);
				seniority = sv.v;
			}
			const ck = `${twoS},${L},${seniority}`;
			let cls = lsIndex.get(ck);
			if (cls === undefined) {
				cls = lsClasses.length;
				lsClasses.push({ twoS, L, seniority });
				lsIndex.set(ck, cls);
				classVectors.push([]);
			}
			classVectors[cls].push({ idx, val });
		}
	}

	// LS-coupled basis: J² commutes with L², S² and the pairing operator, so it is diagonalised
	// inside each class; its eigenvectors are states |γ S L J, M_J⟩ (Condon & Shortley 1935, §8³).
	const groups = new Map<number, { cls: number; vec: Float64Array }[]>();
	lsClasses.forEach((_, cls) => {
		const vs = classVectors[cls];
		const d = vs.length;
		// J² u for each class vector (dense n), then the d × d class matrix.
		const Ju = vs.map(({ idx, val }) => {
			const out = new Float64Array(n);
			idx.forEach((i, a) => {
				const v = val[a];
				if (v === 0) return;
				const row = i * n;
				for (let j = 0; j < n; j++) out[j] += v * J2[row + j];
			});
			return out;
		});
		const C = new Float64Array(d * d);
		for (let a = 0; a < d; a++)
			for (let b = 0; b < d; b++) {
				let s = 0;
				vs[b].idx.forEach((i, k) => (s += vs[b].val[k] * Ju[a][i]));
				C[a * d + b] = s;
			}
		for (let a = 0; a < d; a++)
			for (let b = a + 1; b < d; b++) {
				const s = (C[a * d + b] + C[b * d + a]) / 2;
				C[a * d + b] = s;
				C[b * d + a] = s;
			}
		const eig = symmetricEigen(C, d);
		for (let r = 0; r < d; r++) {
			const twoJ = nearestTwoK(eig.values[r], 'J²');
			const vec = new Float64Array(n);
			for (let a = 0; a < d; a++) {
				const c = eig.vectors[r * d + a];
				if (c === 0) continue;
				vs[a].idx.forEach((i, k) => (vec[i] += c * vs[a].val[k]));
			}
			const list = groups.get(twoJ);
			if (list) list.push({ cls, vec });
			else groups.set(twoJ, [{ cls, vec }]);
		}
	});

	// jj classes via the one-electron l·s of each subshell (the ζ parameter matrices).
	const zetaParams = params.map((p, i) => (p.kind === 'zeta' ? i : -1)).filter((i) => i >= 0);
	const jjClasses: JjClass[] = [];
	const jjIndex = new Map<string, number>();

	const spaces: JSpace[] = [];
	const sortedJ = [...groups.keys()].sort((a, b) => a - b);
	for (const twoJ of sortedJ) {
		const members = groups.get(twoJ)!;
		const dim = members.length;
		const basis = new Float64Array(dim * n);
		members.forEach((m, r) => basis.set(m.vec, r * n));
		const lsOf = Int32Array.from(members.map((m) => m.cls));
		const param = projectParameters(matrices, basis, dim, n).map((P, p) => {
			for (let a = 0; a < dim; a++) P[a * dim + a] -= matrices.average[p];
			// symmetrise against rounding
			for (let a = 0; a < dim; a++)
				for (let b = a + 1; b < dim; b++) {
					const s = (P[a * dim + b] + P[b * dim + a]) / 2;
					P[a * dim + b] = s;
					P[b * dim + a] = s;
				}
			return P;
		});
		// jj projectors from the eigenvectors of Σ_s c_s (l·s)_s in this J space.
		const jj: { cls: number; projector: Float64Array }[] = [];
		if (zetaParams.length > 0) {
			const Z = new Float64Array(dim * dim);
			zetaParams.forEach((p, s) => {
				const weight = 1 + s * Math.SQRT2 * 3.1;
				for (let i = 0; i < dim * dim; i++) Z[i] += weight * param[p][i];
			});
			const ez = symmetricEigen(Z, dim);
			const acc = new Map<number, Float64Array>();
			for (let r = 0; r < dim; r++) {
				const u = ez.vectors.subarray(r * dim, r * dim + dim);
				const lower = set.shells.map((sh, si) => {
					const p = params.findIndex((x) => x.kind === 'zeta' && x.shells[0] === si);
					if (p < 0) return 0; // s subshell: j = ½ only, counted as upper
					let z = 0;
					for (let a = 0; a < dim; a++) for (let b = 0; b < dim; b++) z += u[a] * u[b] * param[p][a * dim + b];
					// ⟨l·s⟩ = (l/2)(N − n₋) − ((l+1)/2) n₋  ⇒  n₋ = ((l/2)N − z)/((2l+1)/2)
					const nl = ((sh.l / 2) * sh.occupancy - z) / ((2 * sh.l + 1) / 2);
					const r0 = Math.round(nl);
					if (Math.abs(nl - r0) > 1e-6) throw new Error(`internal error: jj occupation ${nl} is not an integer`);
					return r0;
				});
				const key2 = lower.join(',');
				let cls = jjIndex.get(key2);
				if (cls === undefined) {
					cls = jjClasses.length;
					jjClasses.push({ lower, label: jjLabel(set, lower) });
					jjIndex.set(key2, cls);
				}
				let P = acc.get(cls);
				if (!P) acc.set(cls, (P = new Float64Array(dim * dim)));
				for (let a = 0; a < dim; a++) for (let b = 0; b < dim; b++) P[a * dim + b] += u[a] * u[b];
			}
			for (const [cls, projector] of acc) jj.push({ cls, projector });
		}
		spaces.push({ twoJ, dim, basis, param, lsOf, jj });
	}
	const parity = all.reduce((a, s) => a + s.l * s.occupancy, 0) % 2 === 0 ? 'even' : 'odd';
	const structure: EnergyStructure = {
		config,
		parity,
		set,
		params,
		totalDeterminants: total,
		blockSize: n,
		lsClasses,
		jjClasses,
		spaces,
		matrices
	};
	if (cache.size >= CACHE_SIZE) cache.delete(cache.keys().next().value!);
	cache.set(key, structure);
	return structure;
}

/** "2p_{1/2}^2 2p_{3/2}": the j = l ∓ ½ groups of each open subshell, empty groups left out, ^1 not written. */
function jjLabel(set: OrbitalSet, lower: number[]): string {
	const parts: string[] = [];
	set.shells.forEach((s, i) => {
		const name = shellName(s);
		const lo = s.l === 0 ? 0 : lower[i];
		const hi = s.occupancy - lo;
		const piece = (twoJ: number, k: number) => (k === 0 ? null : `${name}_{${halfString(twoJ)}}${k === 1 ? '' : `^${k}`}`);
		if (s.l > 0) {
			const a = piece(2 * s.l - 1, lo);
			if (a) parts.push(a);
		}
		const b = piece(2 * s.l + 1, hi);
		if (b) parts.push(b);
	});
	return parts.join(' ');
}
