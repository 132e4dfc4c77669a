/**
 * The energy matrix of one configuration in one M_J block of determinants, by the Slater–Condon
 * rules (Slater 1929; Condon & Shortley 1935, §6⁷–6⁹; Cowan 1981, §6-3 and ch. 10):
 * - diagonal: Σ_i ⟨i|h|i⟩ + Σ_{i<j} (⟨ij|g|ij⟩ − ⟨ij|g|ji⟩);
 * - one spin-orbital changed a → c: ⟨c|h|a⟩ + Σ_{j≠a} (⟨cj|g|aj⟩ − ⟨cj|g|ja⟩), times the fermion sign;
 * - two changed a, b → c, d: ⟨cd|g|ab⟩ − ⟨cd|g|ba⟩, times the fermion sign;
 * with ⟨ab|g|cd⟩ = δ(m_s^a, m_s^c) δ(m_s^b, m_s^d) δ(m^a + m^b, m^c + m^d) Σ_k c^k(l_a m_a, l_c m_c)
 * c^k(l_d m_d, l_b m_b) R^k(ab, cd) (Condon & Shortley §6⁸, eq. 13), where R^k is F^k when a, c and
 * b, d share subshells and G^k when a, d and b, c do, and the one-electron part is ζ(nl) l·s
 * (Condon & Shortley §5⁴). H is linear in the parameters, so the matrix is kept as one sparse
 * coefficient list per parameter; each parameter's configuration average is kept beside it and
 * subtracted on the diagonal (the E_av convention, see slater-parameters.ts).
 */
import { ck } from './angular-factors';
import { annihilate, create, rowOf, type DeterminantBlock, type OrbitalSet } from './determinants';
import type { RadialParameter } from './slater-parameters';

/** The block's matrix as sparse upper-triangle entries (row ≤ col), one coefficient per (entry, parameter). */
export interface ParameterMatrices {
	n: number;
	params: RadialParameter[];
	rows: Int32Array;
	cols: Int32Array;
	param: Int32Array;
	coef: Float64Array;
	/** Configuration average of each parameter's coefficient (subtracted on the diagonal). */
	average: Float64Array;
}

type Terms = [number, number][];

/** Builds the coefficient lookups for one orbital set and parameter list (cached per call of `parameterMatrices`). */
function interaction(set: OrbitalSet, params: RadialParameter[]) {
	const nso = set.orbitals.length;
	const index = new Map<string, number>();
	params.forEach((p, i) => index.set(`${p.kind}${p.k ?? ''}:${p.shells.join(',')}`, i));
	const maxK = 2 * Math.max(0, ...set.shells.map((s) => s.l));
	const gCache = new Map<number, Terms>();
	/** ⟨pq|g|rs⟩ as (parameter, coefficient) pairs. */
	const coulomb = (p: number, q: number, r: number, s: number): Terms => {
		const key = ((p * nso + q) * nso + r) * nso + s;
		const hit = gCache.get(key);
		if (hit) return hit;
		const P = set.orbitals[p];
		const Q = set.orbitals[q];
		const R = set.orbitals[r];
		const S = set.orbitals[s];
		const out: Terms = [];
		if (P.twoMs === R.twoMs && Q.twoMs === S.twoMs && P.ml + Q.ml === R.ml + S.ml) {
			let kind: 'F' | 'G' | null = null;
			let shells: number[] = [];
			if (P.shell === R.shell && Q.shell === S.shell) {
				kind = 'F';
				shells = [Math.min(P.shell, Q.shell), Math.max(P.shell, Q.shell)];
			} else if (P.shell === S.shell && Q.shell === R.shell) {
				kind = 'G';
				shells = [Math.min(P.shell, Q.shell), Math.max(P.shell, Q.shell)];
			}
			if (kind) {
				for (let k = kind === 'F' ? 2 : 0; k <= maxK; k++) {
					const c = ck(P.l, P.ml, R.l, R.ml, k) * ck(S.l, S.ml, Q.l, Q.ml, k);
					if (c === 0) continue;
					const i = index.get(`${kind}${k}:${shells.join(',')}`);
					if (i === undefined) continue; // F^0, or F^k within a subshell of one electron: a constant, part of E_av
					out.push([i, c]);
				}
			}
		}
		gCache.set(key, out);
		return out;
	};
	/** ⟨pq|g|rs⟩ − ⟨pq|g|sr⟩. */
	const antisym = (p: number, q: number, r: number, s: number): Terms => {
		const a = coulomb(p, q, r, s);
		const b = coulomb(p, q, s, r);
		if (b.length === 0) return a;
		return [...a, ...b.map(([i, c]) => [i, -c] as [number, number])];
	};
	/** ⟨c|ζ l·s|a⟩ within one subshell (Condon & Shortley §5⁴; l·s = l_z s_z + ½(l₊s₋ + l₋s₊)). */
	const spinOrbit = (c: number, a: number): Terms => {
		const C = set.orbitals[c];
		const A = set.orbitals[a];
		if (C.shell !== A.shell) return [];
		const i = index.get(`zeta:${A.shell}`);
		if (i === undefined) return [];
		const l = A.l;
		let v = 0;
		if (C.ml === A.ml && C.twoMs === A.twoMs) v = (A.ml * A.twoMs) / 2;
		else if (C.ml === A.ml + 1 && A.twoMs === 1 && C.twoMs === -1) v = 0.5 * Math.sqrt(l * (l + 1) - A.ml * (A.ml + 1));
		else if (C.ml === A.ml - 1 && A.twoMs === -1 && C.twoMs === 1) v = 0.5 * Math.sqrt(l * (l + 1) - A.ml * (A.ml - 1));
		return v === 0 ? [] : [[i, v]];
	};
	return { antisym, spinOrbit };
}

/**
 * Configuration average of each parameter's diagonal coefficient: every determinant counts once,
 * so a pair of spin-orbitals is occupied with probability N(N−1)/(g(g−1)) in one subshell of g
 * spin-orbitals and N₁N₂/(g₁g₂) across two (the definition of E_av in Cowan 1981, §6-1, whose closed
 * forms this reproduces; p² gives −2/25 of F², checked in the tests). ζ averages to 0.
 * @example averageCoefficients(set2p2, params)[0] // −2/25 (E_av of p² = F⁰ − 2F₂, Condon & Shortley)
 */
export function averageCoefficients(set: OrbitalSet, params: RadialParameter[]): Float64Array {
	const { antisym, spinOrbit } = interaction(set, params);
	const avg = new Float64Array(params.length);
	const prob1 = set.orbitals.map((o) => set.shells[o.shell].occupancy / (2 * (2 * o.l + 1)));
	for (let i = 0; i < set.orbitals.length; i++) {
		for (const [p, c] of spinOrbit(i, i)) avg[p] += prob1[i] * c;
		for (let j = i + 1; j < set.orbitals.length; j++) {
			const a = set.orbitals[i];
			const b = set.orbitals[j];
			let pij: number;
			if (a.shell === b.shell) {
				const N = set.shells[a.shell].occupancy;
				const g = 2 * (2 * a.l + 1);
				pij = (N * (N - 1)) / (g * (g - 1));
			} else pij = prob1[i] * prob1[j];
			if (pij === 0) continue;
			for (const [p, c] of antisym(i, j, i, j)) avg[p] += pij * c;
		}
	}
	return avg;
}

/**
 * The energy matrix of one determinant block, per parameter (Slater–Condon rules, see above).
 * Cost: one comparison per pair of determinants; only pairs differing in ≤ 2 spin-orbitals are kept.
 * @example parameterMatrices(set2p2, block0, params).n // 5
 */
export function parameterMatrices(set: OrbitalSet, block: DeterminantBlock, params: RadialParameter[]): ParameterMatrices {
	const { antisym, spinOrbit } = interaction(set, params);
	const n = block.size;
	const N = block.electrons;
	let cap = 1024;
	let rows = new Int32Array(cap);
	let cols = new Int32Array(cap);
	let param = new Int32Array(cap);
	let coef = new Float64Array(cap);
	let count = 0;
	const acc = new Float64Array(params.length);
	const touched: number[] = [];
	const add = (terms: Terms, scale: number) => {
		for (const [p, c] of terms) {
			if (acc[p] === 0) touched.push(p);
			acc[p] += scale * c;
		}
	};
	const flush = (r: number, c: number) => {
		for (const p of touched) {
			const v = acc[p];
			acc[p] = 0;
			if (Math.abs(v) < 1e-14) continue;
			if (count === cap) {
				cap *= 2;
				const grow = <T extends Int32Array | Float64Array>(a: T, make: (k: number) => T) => {
					const b = make(cap);
					b.set(a);
					return b;
				};
				rows = grow(rows, (k) => new Int32Array(k));
				cols = grow(cols, (k) => new Int32Array(k));
				param = grow(param, (k) => new Int32Array(k));
				coef = grow(coef, (k) => new Float64Array(k));
			}
			rows[count] = r;
			cols[count] = c;
			param[count] = p;
			coef[count] = v;
			count++;
		}
		touched.length = 0;
	};
	const onlyI: number[] = [];
	const onlyJ: number[] = [];
	for (let I = 0; I < n; I++) {
		const dI = rowOf(block, I);
		// Diagonal.
		for (let x = 0; x < N; x++) {
			add(spinOrbit(dI[x], dI[x]), 1);
			for (let y = x + 1; y < N; y++) add(antisym(dI[x], dI[y], dI[x], dI[y]), 1);
		}
		flush(I, I);
		for (let J = I + 1; J < n; J++) {
			const dJ = rowOf(block, J);
			// Merge walk: spin-orbitals only in I (created) and only in J (annihilated).
			onlyI.length = 0;
			onlyJ.length = 0;
			let x = 0;
			let y = 0;
			while ((x < N || y < N) && onlyI.length <= 2) {
				if (y >= N || (x < N && dI[x] < dJ[y])) onlyI.push(dI[x++]);
				else if (x >= N || dJ[y] < dI[x]) onlyJ.push(dJ[y++]);
				else {
					x++;
					y++;
				}
			}
			if (onlyI.length > 2) continue;
			const ket = Array.from(dJ);
			if (onlyI.length === 1) {
				const a = onlyJ[0];
				const c = onlyI[0];
				const step1 = annihilate(ket, a)!;
				const step2 = create(step1.occ, c)!;
				const sign = step1.sign * step2.sign;
				add(spinOrbit(c, a), sign);
				for (const j of step1.occ) add(antisym(c, j, a, j), sign);
				flush(I, J);
			} else if (onlyI.length === 2) {
				const [a, b] = onlyJ;
				const [c, d] = onlyI;
				// a†_c a†_d a_b a_a |J⟩ = sign |I⟩
				const s1 = annihilate(ket, a)!;
				const s2 = annihilate(s1.occ, b)!;
				const s3 = create(s2.occ, d)!;
				const s4 = create(s3.occ, c)!;
				add(antisym(c, d, a, b), s1.sign * s2.sign * s3.sign * s4.sign);
				flush(I, J);
			}
		}
	}
	return {
		n,
		params,
		rows: rows.slice(0, count),
		cols: cols.slice(0, count),
		param: param.slice(0, count),
		coef: coef.slice(0, count),
		average: averageCoefficients(set, params)
	};
}

/**
 * The dense symmetric matrix Σ_p value_p (H_p − avg_p·1) + E_av·1 of the block (row-major).
 * @example assemble(m, { Eav: 0, values }).length // m.n * m.n
 */
export function assemble(m: ParameterMatrices, values: ArrayLike<number>, Eav = 0): Float64Array {
	const n = m.n;
	const H = new Float64Array(n * n);
	for (let e = 0; e < m.rows.length; e++) {
		const v = m.coef[e] * values[m.param[e]];
		const r = m.rows[e];
		const c = m.cols[e];
		H[r * n + c] += v;
		if (r !== c) H[c * n + r] += v;
	}
	let shift = Eav;
	for (let p = 0; p < m.params.length; p++) shift -= m.average[p] * values[p];
	for (let i = 0; i < n; i++) H[i * n + i] += shift;
	return H;
}
