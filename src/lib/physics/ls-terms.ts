/**
 * The LS-coupled basis of one M_J block and the parameter matrices in it, built term by term.
 *
 * A term |γ S L⟩ has one state |γ S L M_L M_S⟩ on each M_L piece of the block (M_S = M_J − M_L)
 * with |M_L| ≤ L and |M_S| ≤ S. Its state on the lowest such piece comes from the LS classes of
 * that piece; the others follow by the ladder L₊S₋, which raises M_L and lowers M_S with positive
 * factors √((L−M_L)(L+M_L+1)(S+M_S)(S−M_S+1)) in the Condon–Shortley phases (Condon & Shortley
 * 1935, §3³). L₊S₋ is the part of J² = L² + S² + 2L_zS_z + L₊S₋ + L₋S₊ that moves a vector from
 * the piece M_L to M_L + 1, so it is read off the sparse J². The states of one term then have
 * consistent phases, and its J states are Clebsch–Gordan sums
 *   |γ S L J M⟩ = Σ ⟨L M_L S M_S | J M⟩ |γ S L M_L M_S⟩            (Condon & Shortley §3⁶).
 * In this basis the matrices need few products of long vectors:
 * - the Coulomb integrals F^k, G^k are scalars in L and in S, so ⟨γSLJ|H|γ'SLJ⟩ equals
 *   ⟨γSLM_LM_S|H|γ'SLM_LM_S⟩ on any one piece, for every J (Condon & Shortley §9¹; Cowan 1981, §11-4);
 * - the spin–orbit operator Σζ l·s = Σ_q (−1)^q W_{q,−q} is a double tensor of rank (1,1), so each of
 *   its M components is a 3j product times one reduced element per pair of terms (Wigner–Eckart,
 *   Edmonds 1957, eq. 5.4.1, in spin and in orbit), which is read from the one component with the
 *   largest 3j product; the J matrices then follow from the Clebsch–Gordan sums.
 */
import type { DeterminantBlock } from './determinants';
import type { ParameterMatrices } from './hamiltonian';
import type { SparseSymmetric } from './momentum-operators';
import { clebschGordanFloat, wigner3jFloat } from './wigner';

/** A vector on a few positions of the block: `pos` are block indices, `val` the values there. */
export interface SparseVector {
	pos: Int32Array;
	val: Float64Array;
}

/** One term |γ S L⟩ of the block: its class (index into the LS classes) and its state on each piece. */
export interface BlockTerm {
	cls: number;
	twoS: number;
	L: number;
	/** Lowest M_L of the pieces it lives on. */
	ML0: number;
	/** states[i] is |γ S L, M_L = ML0 + i, M_S = M_J − M_L⟩. */
	states: SparseVector[];
}

/** How far the ladder's norm may sit from its formula before the build is refused (common practice, no source). */
export const LADDER_TOLERANCE = 1e-7;

/** The pieces M_L of a term in the block 2M_J: |M_L| ≤ L and |M_J − M_L| ≤ S. */
export function termPieces(twoMJ: number, twoS: number, L: number): { from: number; to: number } {
	return { from: Math.max(0 - L, (twoMJ - twoS) / 2), to: Math.min(L, (twoMJ + twoS) / 2) }; // 0 − L, not −L: no −0
}

/**
 * Every term's states on every piece, by the ladder L₊S₋ from its lowest piece. `lowest(twoS, L, ML)`
 * gives the orthonormal class vectors of each class on piece ML (one per γ); each class is asked for
 * on its lowest piece only.
 */
export function blockTerms(
	block: DeterminantBlock,
	J2: SparseSymmetric,
	classes: readonly { twoS: number; L: number }[],
	lowest: (cls: number, ML: number) => SparseVector[]
): BlockTerm[] {
	const out: BlockTerm[] = [];
	const scratch = new Float64Array(block.size);
	classes.forEach(({ twoS, L }, cls) => {
		const { from, to } = termPieces(block.twoMJ, twoS, L);
		for (const start of lowest(cls, from)) {
			const states = [start];
			for (let ML = from; ML < to; ML++) {
				const u = states[states.length - 1];
				for (let t = 0; t < u.pos.length; t++) {
					const i = u.pos[t];
					const v = u.val[t];
					for (let k = J2.start[i]; k < J2.start[i + 1]; k++) scratch[J2.col[k]] += v * J2.val[k];
				}
				const pos: number[] = [];
				const val: number[] = [];
				let norm = 0;
				for (let t = 0; t < u.pos.length; t++) {
					const i = u.pos[t];
					for (let k = J2.start[i]; k < J2.start[i + 1]; k++) {
						const j = J2.col[k];
						const x = scratch[j];
						if (x !== 0 && block.ML[j] === ML + 1) {
							pos.push(j);
							val.push(x);
							norm += x * x;
						}
						scratch[j] = 0;
					}
				}
				norm = Math.sqrt(norm);
				const twoMS = block.twoMJ - 2 * ML;
				const expected = Math.sqrt((L - ML) * (L + ML + 1) * ((twoS + twoMS) / 2) * ((twoS - twoMS) / 2 + 1));
				if (Math.abs(norm - expected) > LADDER_TOLERANCE * Math.max(1, expected)) {
					throw new Error(`internal error: L₊S₋ on a term gave norm ${norm}, expected ${expected}`);
				}
				states.push({ pos: Int32Array.from(pos), val: Float64Array.from(val, (x) => x / norm) });
			}
			out.push({ cls, twoS, L, ML0: from, states });
		}
	});
	return out;
}

/** Every parameter matrix's entries by source row (both triangles): row i feeds column `col[k]` of parameter `param[k]`. */
export interface RowsOfH {
	start: Int32Array;
	col: Int32Array;
	coef: Float64Array;
	param: Int32Array;
}

/** The sparse upper-triangle matrices of hamiltonian.ts as rows of both triangles, for H u products. */
export function rowsOfH(m: ParameterMatrices): RowsOfH {
	const { rows, cols, coef, param } = m;
	const count = new Int32Array(m.n + 1);
	for (let e = 0; e < rows.length; e++) {
		count[rows[e] + 1]++;
		if (rows[e] !== cols[e]) count[cols[e] + 1]++;
	}
	for (let i = 0; i < m.n; i++) count[i + 1] += count[i];
	const fill = count.slice(0, m.n);
	const out: RowsOfH = {
		start: count,
		col: new Int32Array(count[m.n]),
		coef: new Float64Array(count[m.n]),
		param: new Int32Array(count[m.n])
	};
	const put = (from: number, to: number, e: number) => {
		const k = fill[from]++;
		out.col[k] = to;
		out.coef[k] = coef[e];
		out.param[k] = param[e];
	};
	for (let e = 0; e < rows.length; e++) {
		put(rows[e], cols[e], e);
		if (rows[e] !== cols[e]) put(cols[e], rows[e], e);
	}
	return out;
}

/** The entries of H that belong to the parameters `only` marks (the Coulomb or the spin–orbit ones), as rows again. */
function rowsOnly(H: RowsOfH, only: Uint8Array): RowsOfH {
	const n = H.start.length - 1;
	const start = new Int32Array(n + 1);
	for (let i = 0; i < n; i++) {
		let c = 0;
		for (let k = H.start[i]; k < H.start[i + 1]; k++) c += only[H.param[k]];
		start[i + 1] = start[i] + c;
	}
	const out: RowsOfH = { start, col: new Int32Array(start[n]), coef: new Float64Array(start[n]), param: new Int32Array(start[n]) };
	let at = 0;
	for (let k = 0; k < H.col.length; k++)
		if (only[H.param[k]]) {
			out.col[at] = H.col[k];
			out.coef[at] = H.coef[k];
			out.param[at++] = H.param[k];
		}
	return out;
}

/**
 * H u added into `w`, one interleaved buffer: w[col · np + p] holds parameter p's matrix times u at
 * row col, so a later dot product reads all parameters of a row from one place in memory.
 */
function applyTo(H: RowsOfH, u: SparseVector, w: Float64Array, np: number): void {
	for (let t = 0; t < u.pos.length; t++) {
		const i = u.pos[t];
		const v = u.val[t];
		for (let k = H.start[i]; k < H.start[i + 1]; k++) w[H.col[k] * np + H.param[k]] += H.coef[k] * v;
	}
}

function clear(H: RowsOfH, u: SparseVector, w: Float64Array, np: number): void {
	for (let t = 0; t < u.pos.length; t++) {
		const i = u.pos[t];
		for (let k = H.start[i]; k < H.start[i + 1]; k++) w[H.col[k] * np + H.param[k]] = 0;
	}
}

/** ⟨u| H_p |·⟩ for every parameter p in `params`, divided by `scale`: one pass over u for all of them. */
function dots(u: SparseVector, w: Float64Array, np: number, params: Int32Array, scale: number): Float64Array {
	const values = new Float64Array(np);
	for (let t = 0; t < u.pos.length; t++) {
		const base = u.pos[t] * np;
		const v = u.val[t];
		for (let q = 0; q < params.length; q++) values[params[q]] += v * w[base + params[q]];
	}
	if (scale !== 1) for (let q = 0; q < params.length; q++) values[params[q]] /= scale;
	return values;
}

/** Memo of the float 3j and Clebsch–Gordan values (the exact ones are costly and few keys recur). */
function memo<A extends number[]>(f: (...a: A) => number): (...a: A) => number {
	const seen = new Map<string, number>();
	return (...a: A) => {
		const key = a.join(',');
		let v = seen.get(key);
		if (v === undefined) {
			v = f(...a);
			seen.set(key, v);
		}
		return v;
	};
}

/**
 * The spin–orbit M factor of ⟨γ S L M_L M_S| Σ_q (−1)^q W_{q,−q} |γ' S' L' M_L' M_S'⟩ (all doubled
 * but the M_L): (−1)^q (−1)^{S−M_S} 3j(S 1 S'; −M_S −q M_S') (−1)^{L−M_L} 3j(L 1 L'; −M_L q M_L'),
 * q = M_L − M_L' (Edmonds 1957, eq. 5.4.1, in spin and in orbit).
 */
function spinOrbitFactorOf(
	twoS: number,
	L: number,
	twoMS: number,
	ML: number,
	twoS2: number,
	L2: number,
	twoMS2: number,
	ML2: number
): number {
	const q = ML - ML2;
	if (Math.abs(q) > 1) return 0;
	const sign = (x: number) => (((x % 2) + 2) % 2 === 0 ? 1 : -1);
	const s3j = wigner3jFloat(twoS, 2, twoS2, -twoMS, -2 * q, twoMS2);
	const l3j = wigner3jFloat(2 * L, 2, 2 * L2, -2 * ML, 2 * q, 2 * ML2);
	return sign(q) * sign((twoS - twoMS) / 2) * sign(L - ML) * s3j * l3j;
}

/** The J matrices of the block in the basis of the terms' J states. */
export interface TermJSpace {
	twoJ: number;
	/** Per basis vector: the term (index into the terms). */
	terms: Int32Array;
	/** Per parameter, dim × dim (no average subtracted). */
	param: Float64Array[];
}

/**
 * The parameter matrices in every J space: Coulomb entries (parameters with `spinOrbit[p]` false)
 * between terms of the same S and L from one piece, spin–orbit entries by their reduced elements.
 */
export function termJSpaces(block: DeterminantBlock, H: RowsOfH, terms: readonly BlockTerm[], spinOrbit: readonly boolean[]): TermJSpace[] {
	const np = spinOrbit.length;
	const n = block.size;
	const twoM = block.twoMJ;
	const coulombOnly = Uint8Array.from(spinOrbit, (z) => (z ? 0 : 1));
	const zetaOnly = Uint8Array.from(spinOrbit, (z) => (z ? 1 : 0));
	const hasZeta = spinOrbit.some((z) => z);
	const w = new Float64Array(n * np);
	const Hc = rowsOnly(H, coulombOnly);
	const Hz = rowsOnly(H, zetaOnly);
	const coulombParams = Int32Array.from(spinOrbit.flatMap((z, p) => (z ? [] : [p])));
	const zetaParams = Int32Array.from(spinOrbit.flatMap((z, p) => (z ? [p] : [])));
	const factor = memo(spinOrbitFactorOf);
	const cg = memo(clebschGordanFloat);

	// Coulomb: per pair of terms with the same S and L, on their common lowest piece.
	const coulomb = new Map<number, Float64Array>(); // key t1 * T + t2 (t1 ≤ t2) → per parameter
	const T = terms.length;
	const sameSL = new Map<string, number[]>();
	terms.forEach((t, i) => {
		const key = `${t.twoS},${t.L}`;
		const list = sameSL.get(key);
		if (list) list.push(i);
		else sameSL.set(key, [i]);
	});
	const pieceSize = new Map<number, number>();
	for (let i = 0; i < n; i++) pieceSize.set(block.ML[i], (pieceSize.get(block.ML[i]) ?? 0) + 1);
	for (const group of sameSL.values()) {
		// Any piece gives the same elements: the smallest one costs least.
		const { ML0, states } = terms[group[0]];
		let at = 0;
		for (let i = 1; i < states.length; i++) if (pieceSize.get(ML0 + i)! < pieceSize.get(ML0 + at)!) at = i;
		for (const t2 of group) {
			const u2 = terms[t2].states[at];
			applyTo(Hc, u2, w, np);
			for (const t1 of group) if (t1 <= t2) coulomb.set(t1 * T + t2, dots(terms[t1].states[at], w, np, coulombParams, 1));
			clear(Hc, u2, w, np);
		}
	}

	// Spin–orbit: one reduced element per pair of terms with |ΔS|, |ΔL| ≤ 1, from the best component.
	const reduced = new Map<number, Float64Array>();
	/**
	 * The M component (state i of term a, state j of term b) to read the reduced element from: among
	 * those whose spin–orbit factor is at least a quarter of the largest (so the division stays well
	 * conditioned), the one on the smallest piece of a. It depends on S, L and S', L' only.
	 */
	const components = new Map<string, { best: number; i: number; j: number }>();
	const bestComponent = (a: BlockTerm, b: BlockTerm) => {
		const key = `${a.twoS},${a.L},${b.twoS},${b.L}`;
		let hit = components.get(key);
		if (hit) return hit;
		const all: { best: number; i: number; j: number }[] = [];
		for (let i = 0; i < a.states.length; i++)
			for (let j = Math.max(0, i + a.ML0 - b.ML0 - 1); j <= Math.min(b.states.length - 1, i + a.ML0 - b.ML0 + 1); j++) {
				const f = factor(a.twoS, a.L, twoM - 2 * (a.ML0 + i), a.ML0 + i, b.twoS, b.L, twoM - 2 * (b.ML0 + j), b.ML0 + j);
				if (f !== 0) all.push({ best: f, i, j });
			}
		const largest = Math.max(0, ...all.map((c) => Math.abs(c.best)));
		hit = { best: 0, i: 0, j: 0 };
		for (const c of all)
			if (Math.abs(c.best) >= largest / 4 && (hit.best === 0 || pieceSize.get(a.ML0 + c.i)! < pieceSize.get(a.ML0 + hit.i)!)) hit = c;
		components.set(key, hit);
		return hit;
	};
	if (hasZeta) {
		for (let t2 = 0; t2 < T; t2++) {
			const b = terms[t2];
			// The partners t1 ≤ t2, grouped by the state j of t2 their element is read from: H_ζ is applied
			// once per such state, into the one reused buffer `w` (4f⁷ 5d has ~10⁴ term states, and a dense
			// vector for each of them was most of the structure's build time).
			const byState = new Map<number, { t1: number; i: number; best: number }[]>();
			for (let t1 = 0; t1 <= t2; t1++) {
				const a = terms[t1];
				if (Math.abs(a.twoS - b.twoS) > 2 || Math.abs(a.L - b.L) > 1) continue;
				const { best, i, j } = bestComponent(a, b);
				if (best === 0) continue;
				const list = byState.get(j);
				if (list) list.push({ t1, i, best });
				else byState.set(j, [{ t1, i, best }]);
			}
			for (const [j, partners] of byState) {
				const u = b.states[j];
				applyTo(Hz, u, w, np);
				for (const { t1, i, best } of partners) reduced.set(t1 * T + t2, dots(terms[t1].states[i], w, np, zetaParams, best));
				clear(Hz, u, w, np);
			}
		}
	}

	// The J spaces: each term gives one J state for |L − S| ≤ J ≤ L + S.
	const byJ = new Map<number, number[]>();
	terms.forEach((t, i) => {
		for (let twoJ = Math.abs(2 * t.L - t.twoS); twoJ <= 2 * t.L + t.twoS; twoJ += 2) {
			const list = byJ.get(twoJ);
			if (list) list.push(i);
			else byJ.set(twoJ, [i]);
		}
	});
	/** ⟨(γ S L) J M|Σ_q (−1)^q W_{q,−q}|(γ' S' L') J M⟩ / reduced element: a sum over the M components. */
	const jFactor = memo((twoJ: number, twoS: number, L: number, twoS2: number, L2: number): number => {
		const A = termPieces(twoM, twoS, L);
		const B = termPieces(twoM, twoS2, L2);
		let s = 0;
		for (let ML = A.from; ML <= A.to; ML++) {
			const ca = cg(2 * L, 2 * ML, twoS, twoM - 2 * ML, twoJ, twoM);
			if (ca === 0) continue;
			for (let ML2 = Math.max(B.from, ML - 1); ML2 <= Math.min(B.to, ML + 1); ML2++) {
				const cb = cg(2 * L2, 2 * ML2, twoS2, twoM - 2 * ML2, twoJ, twoM);
				if (cb !== 0) s += ca * cb * factor(twoS, L, twoM - 2 * ML, ML, twoS2, L2, twoM - 2 * ML2, ML2);
			}
		}
		return s;
	});
	return [...byJ.keys()]
		.sort((x, y) => x - y)
		.map((twoJ) => {
			const members = byJ.get(twoJ)!;
			const dim = members.length;
			const param = Array.from({ length: np }, () => new Float64Array(dim * dim));
			for (let a = 0; a < dim; a++)
				for (let b = a; b < dim; b++) {
					const t1 = members[a];
					const t2 = members[b];
					const key = t1 * T + t2; // members are in term order, so t1 < t2 when a < b
					const C = coulomb.get(key);
					const R = reduced.get(key);
					if (!C && !R) continue;
					// Both terms have a state of this J (byJ), so the Clebsch–Gordan sum is defined.
					const f = R ? jFactor(twoJ, terms[t1].twoS, terms[t1].L, terms[t2].twoS, terms[t2].L) : 0;
					for (let p = 0; p < np; p++) {
						const v = spinOrbit[p] ? (R ? f * R[p] : 0) : C ? C[p] : 0;
						param[p][a * dim + b] = v;
						param[p][b * dim + a] = v;
					}
				}
			return { twoJ, terms: Int32Array.from(members), param };
		});
}
