/**
 * Everything about a configuration's energy matrix that does not depend on the parameter values,
 * built once and reused by the level solver, the LS→jj sweep and the fit.
 *
 * Method. Every level of J has exactly one state with M_J = 0 (or ½), so that one determinant
 * block holds one state of every level (Condon & Shortley 1935, §3⁴). The block is split into
 * pieces of one M_L (M_S = M_J − M_L). L², S² (and Racah's pairing operator for one open
 * subshell, which gives the seniority) conserve M_L and M_S, so their joint eigenspaces — the LS
 * classes — are found per piece: S² only flips spins, so it is diagonalised on each group of
 * determinants that occupy the same spatial orbitals, then L² (with the pairing operator) inside
 * each S of the piece. From the classes, ls-terms.ts builds the terms |γ S L⟩ with consistent
 * phases on every piece, their J states by Clebsch–Gordan sums, and every parameter's matrix in
 * each J space (Coulomb integrals from one piece, spin–orbit from one reduced element per pair
 * of terms). Each later evaluation only sums and diagonalises the small J blocks.
 * The LS composition of a level is the sum of its squared coefficients per class. jj classes are
 * the eigenspaces of the one-electron l·s of each subshell (which count the electrons with
 * j = l − ½ and j = l + ½).
 */
import type { Configuration, Subshell } from './types';
import {
	centralTwoMJ,
	checkDeterminantBudget,
	determinantBlock,
	orbitalSet,
	rowOf,
	type DeterminantBlock,
	type OrbitalSet
} from './determinants';
import { parameterMatrices } from './hamiltonian';
import { denseSubmatrix, jSquared, lSquared, pairing, seniorityFromPairing, sSquared, type SparseSymmetric } from './momentum-operators';
import { radialParameters, shellName, type RadialParameter } from './slater-parameters';
import { symmetricEigen } from './symmetric-eigen';
import { blockTerms, rowsOfH, termJSpaces, termPieces, type SparseVector } from './ls-terms';
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
	/** Projected parameter matrices, dim × dim each, with the configuration average already subtracted. */
	param: Float64Array[];
	/** The basis is LS-coupled: the LS class (index into `lsClasses`) of each basis vector. */
	lsOf: Int32Array;
	/** Per jj class, an orthonormal basis of its eigenspace in this J space (rows of length dim). */
	jj: { cls: number; vectors: Float64Array[] }[];
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
}

const cache = new Map<string, EnergyStructure>();
/** At most this many structures, and at most CACHE_BYTES of their matrices, stay cached (the newest is always kept). */
const CACHE_SIZE = 6;
/** 4f⁷ 5d's J-space matrices take about 90 MB; a compute worker's heap is capped at 512 MB (product rule, no source). */
export const CACHE_BYTES = 160e6;

/** Bytes of a structure's J-space matrices and jj vectors (what dominates its size). */
export function structureBytes(s: EnergyStructure): number {
	let bytes = 0;
	for (const sp of s.spaces) {
		for (const p of sp.param) bytes += p.byteLength;
		for (const j of sp.jj) for (const v of j.vectors) bytes += v.byteLength;
	}
	return bytes;
}

function remember(key: string, s: EnergyStructure): void {
	cache.set(key, s);
	let total = 0;
	for (const x of cache.values()) total += structureBytes(x);
	while (cache.size > 1 && (cache.size > CACHE_SIZE || total > CACHE_BYTES)) {
		const oldest = cache.keys().next().value!;
		total -= structureBytes(cache.get(oldest)!);
		cache.delete(oldest);
	}
}

/** Empties the structure cache (benchmarks measure cold runs with it). */
export function clearEnergyCache(): void {
	cache.clear();
}

/** A vector on a few positions of a piece: `pos` are piece-local positions, `val` the values there. */
interface LocalVector {
	pos: Int32Array;
	val: Float64Array;
}

/**
 * Eigenvectors of S² in one piece (block indices `idx`), grouped by 2S. Determinants that occupy the
 * same spatial orbitals form S²'s blocks (s± only flips spins), each small and diagonalised alone.
 */
function spinEigenvectors(S2: SparseSymmetric, block: DeterminantBlock, idx: readonly number[]): Map<number, LocalVector[]> {
	const groups = new Map<string, number[]>();
	idx.forEach((i, a) => {
		const key = Array.from(rowOf(block, i), (o) => o >> 1).join(',');
		const g = groups.get(key);
		if (g) g.push(a);
		else groups.set(key, [a]);
	});
	const out = new Map<number, LocalVector[]>();
	for (const pos of groups.values()) {
		const d = pos.length;
		const eig = symmetricEigen(
			denseSubmatrix(
				S2,
				pos.map((a) => idx[a])
			),
			d
		);
		for (let r = 0; r < d; r++) {
			const twoS = nearestTwoK(eig.values[r], 'S²');
			const list = out.get(twoS) ?? [];
			list.push({ pos: Int32Array.from(pos), val: eig.vectors.slice(r * d, r * d + d) });
			out.set(twoS, list);
		}
	}
	return out;
}

/** The d × d matrix ⟨u_a|M|u_b⟩ of a sparse operator that stays inside the piece (`local` maps block → piece positions). */
function projectOnto(M: SparseSymmetric, vecs: readonly LocalVector[], idx: readonly number[], local: Int32Array): Float64Array {
	const d = vecs.length;
	const Mu = vecs.map(({ pos, val }) => {
		const out = new Float64Array(idx.length);
		for (let t = 0; t < pos.length; t++) {
			const i = idx[pos[t]];
			for (let k = M.start[i]; k < M.start[i + 1]; k++) out[local[M.col[k]]] += val[t] * M.val[k];
		}
		return out;
	});
	const W = new Float64Array(d * d);
	for (let a = 0; a < d; a++)
		for (let b = a; b < d; b++) {
			const { pos, val } = vecs[b];
			let s = 0;
			for (let t = 0; t < pos.length; t++) s += val[t] * Mu[a][pos[t]];
			W[a * d + b] = s;
			W[b * d + a] = s;
		}
	return W;
}

/** cᵀ W c for a d × d row-major W. */
function quadraticForm(W: Float64Array, c: ArrayLike<number>, d: number): number {
	let s = 0;
	for (let a = 0; a < d; a++) {
		let row = 0;
		for (let b = 0; b < d; b++) row += W[a * d + b] * c[b];
		s += c[a] * row;
	}
	return s;
}

/** The weight of the s-th ζ matrix in the sum that separates the jj classes (irrational; common practice, no source). */
const zetaWeight = (s: number) => 1 + s * Math.SQRT2 * 3.1;

/** ⟨Σ l·s⟩ of l^N = (l/2)(N − n₋) − ((l+1)/2) n₋ with n₋ electrons in j = l − ½, solved for n₋. */
const lowerFromLs = (l: number, N: number, z: number) => ((l / 2) * N - z) / ((2 * l + 1) / 2);

/**
 * Every possible jj class with its eigenvalue of Σ_s w_s (Σ l·s)_s, so that an eigenvalue names its
 * class without a quadratic form; null when two candidates lie too close to tell apart.
 */
function lowerCandidates(set: OrbitalSet, params: RadialParameter[]): { lower: number[]; value: number }[] | null {
	let out: { lower: number[]; value: number }[] = [{ lower: [], value: 0 }];
	const zetaOf = new Map(params.filter((p) => p.kind === 'zeta').map((p, s) => [p.shells[0], s]));
	set.shells.forEach((sh, si) => {
		const s = zetaOf.get(si);
		const next: typeof out = [];
		for (const c of out) {
			if (s === undefined) next.push({ lower: [...c.lower, 0], value: c.value });
			else
				for (let lo = Math.max(0, sh.occupancy - (2 * sh.l + 2)); lo <= Math.min(sh.occupancy, 2 * sh.l); lo++) {
					const z = (sh.l / 2) * (sh.occupancy - lo) - ((sh.l + 1) / 2) * lo;
					next.push({ lower: [...c.lower, lo], value: c.value + zetaWeight(s) * z });
				}
		}
		out = next;
	});
	const sorted = out.map((c) => c.value).sort((a, b) => a - b);
	for (let i = 1; i < sorted.length; i++) if (sorted[i] - sorted[i - 1] < 1e-3) return null;
	return out;
}

/** The candidate whose eigenvalue matches `value`, or null (then the caller measures each subshell). */
function decodeLower(candidates: { lower: number[]; value: number }[] | null, value: number): number[] | null {
	if (!candidates) return null;
	for (const c of candidates) if (Math.abs(c.value - value) <= QUANTUM_NUMBER_TOLERANCE * Math.max(1, Math.abs(value))) return c.lower;
	return null;
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
	if (hit) {
		// The newest use goes last, so the least recently used is dropped first.
		cache.delete(key);
		cache.set(key, hit);
		return hit;
	}
	if (set.shells.length === 0) throw new RangeError(`${config} has no open subshell: it has a single level ¹S₀ and nothing to solve`);
	const { total } = checkDeterminantBudget(set.shells, limits);
	const params = radialParameters(set);
	const twoM = centralTwoMJ(set.electrons);
	const block = determinantBlock(set, twoM);
	const n = block.size;
	const matrices = parameterMatrices(set, block, params);

	// LS classes per (M_L) piece; within the block M_S is fixed by M_L, and L², S² and the pairing
	// operator conserve M_L, so each piece is treated on its own. S² changes only spins, so it is
	// block-diagonal over the spatial orbitals a determinant occupies: it is diagonalised on each such
	// small group first, then L² (with the pairing operator) inside each S of the piece.
	const L2 = lSquared(set, block);
	const S2 = sSquared(set, block);
	const J2 = jSquared(set, block);
	const single = set.shells.length === 1 && set.shells[0].occupancy >= 2 ? pairing(set, block, 0) : null;
	const lsClasses: LsClass[] = [];
	const lsIndex = new Map<string, number>();
	/** Orthonormal class vectors by class and piece ("cls,M_L"), each on its piece only. */
	const classVectors = new Map<string, SparseVector[]>();
	const pieces = new Map<number, number[]>();
	for (let i = 0; i < n; i++) {
		const list = pieces.get(block.ML[i]);
		if (list) list.push(i);
		else pieces.set(block.ML[i], [i]);
	}
	// An irrational weight keeps the joint eigenvalues of L² and the pairing operator apart (common practice, no source).
	const wQ = Math.E / 7;
	const local = new Int32Array(n).fill(-1);
	for (const idx of pieces.values()) {
		// A term's states are taken from its lowest piece, max(−L, M_J − S) ≤ M_J (ls-terms.ts); the
		// pieces above M_J start no term, and the ladder reaches them.
		if (2 * block.ML[idx[0]] > block.twoMJ) continue;
		const m = idx.length;
		idx.forEach((i, a) => (local[i] = a));
		for (const [twoS, vecs] of spinEigenvectors(S2, block, idx)) {
			const d = vecs.length;
			const WL = projectOnto(L2, vecs, idx, local);
			const WQ = single ? projectOnto(single, vecs, idx, local) : null;
			const K = WQ ? WL.map((x, i) => x + wQ * WQ[i]) : WL;
			const eig = symmetricEigen(K, d);
			for (let r = 0; r < d; r++) {
				const c = eig.vectors.subarray(r * d, r * d + d);
				const L = nearestTwoK(quadraticForm(WL, c, d), 'L²') / 2;
				let seniority: number | null = null;
				if (WQ) {
					const q = quadraticForm(WQ, c, d);
					const sv = seniorityFromPairing(set.shells[0].l, set.shells[0].occupancy, q);
					if (sv.error > 1e-6 * Math.max(1, q)) throw new Error(`internal error: pairing eigenvalue ${q} fits no seniority`);
					seniority = sv.v;
				}
				const val = new Float64Array(m);
				for (let k = 0; k < d; k++) {
					const { pos, val: u } = vecs[k];
					for (let t = 0; t < pos.length; t++) val[pos[t]] += c[k] * u[t];
				}
				const ck = `${twoS},${L},${seniority}`;
				let cls = lsIndex.get(ck);
				if (cls === undefined) {
					cls = lsClasses.length;
					lsClasses.push({ twoS, L, seniority });
					lsIndex.set(ck, cls);
				}
				// Only a term's lowest piece gives its states (the ladder makes the others).
				if (block.ML[idx[0]] !== termPieces(block.twoMJ, twoS, L).from) continue;
				const nz: number[] = [];
				for (let t = 0; t < m; t++) if (val[t] !== 0) nz.push(t);
				const key = `${cls},${block.ML[idx[0]]}`;
				const list = classVectors.get(key) ?? [];
				list.push({ pos: Int32Array.from(nz, (t) => idx[t]), val: Float64Array.from(nz, (t) => val[t]) });
				classVectors.set(key, list);
			}
		}
		idx.forEach((i) => (local[i] = -1));
	}

	// The LS-coupled basis |γ S L J, M_J⟩ term by term, and the parameter matrices in its J spaces (ls-terms.ts).
	const terms = blockTerms(block, J2, lsClasses, (cls, ML) => classVectors.get(`${cls},${ML}`) ?? []);
	const termSpaces = termJSpaces(
		block,
		rowsOfH(matrices),
		terms,
		params.map((p) => p.kind === 'zeta')
	);
	const states = termSpaces.reduce((sum, sp) => sum + sp.terms.length, 0);
	if (states !== n) throw new Error(`internal error: the J spaces hold ${states} states, the block ${n}`);

	// jj classes via the one-electron l·s of each subshell (the ζ parameter matrices).
	const zetaParams = params.map((p, i) => (p.kind === 'zeta' ? i : -1)).filter((i) => i >= 0);
	const jjClasses: JjClass[] = [];
	const jjIndex = new Map<string, number>();
	const jjCandidates = lowerCandidates(set, params);

	const spaces: JSpace[] = [];
	for (const { twoJ, terms: members, param } of termSpaces) {
		const dim = members.length;
		const lsOf = Int32Array.from(members, (t) => terms[t].cls);
		for (let p = 0; p < params.length; p++) for (let a = 0; a < dim; a++) param[p][a * dim + a] -= matrices.average[p];
		// jj classes from the eigenvectors of Σ_s c_s (l·s)_s in this J space.
		const jj: { cls: number; vectors: Float64Array[] }[] = [];
		if (zetaParams.length > 0) {
			const Z = new Float64Array(dim * dim);
			zetaParams.forEach((p, s) => {
				const weight = zetaWeight(s);
				for (let i = 0; i < dim * dim; i++) Z[i] += weight * param[p][i];
			});
			const ez = symmetricEigen(Z, dim);
			const acc = new Map<number, Float64Array[]>();
			for (let r = 0; r < dim; r++) {
				const u = ez.vectors.subarray(r * dim, r * dim + dim);
				const lower =
					decodeLower(jjCandidates, ez.values[r]) ??
					set.shells.map((sh, si) => {
						const p = params.findIndex((x) => x.kind === 'zeta' && x.shells[0] === si);
						if (p < 0) return 0; // s subshell: j = ½ only, counted as upper
						let z = 0;
						for (let a = 0; a < dim; a++) for (let b = 0; b < dim; b++) z += u[a] * u[b] * param[p][a * dim + b];
						const nl = lowerFromLs(sh.l, sh.occupancy, z);
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
				const list = acc.get(cls);
				if (list) list.push(u.slice());
				else acc.set(cls, [u.slice()]);
			}
			for (const [cls, vectors] of acc) jj.push({ cls, vectors });
		}
		spaces.push({ twoJ, dim, param, lsOf, jj });
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
		spaces
	};
	remember(key, structure);
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

/** The weight (0 … 1) of one jj class in a level's eigenvector: Σ (u·ψ)² over the class's basis. */
export function jjWeight(entry: { vectors: Float64Array[] }, psi: ArrayLike<number>): number {
	let w = 0;
	for (const u of entry.vectors) {
		let dot = 0;
		for (let a = 0; a < u.length; a++) dot += u[a] * psi[a];
		w += dot * dot;
	}
	return w;
}
