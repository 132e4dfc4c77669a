/**
 * L², S², J² and Racah's pairing operator as sparse symmetric matrices in one M_J block of
 * determinants (each row holds only a few entries, so large blocks such as 4f⁷ 5d stay small).
 *
 * The squares come from the raising operators: X² = X₋X₊ + X_z² + X_z with X₋ = X₊ᵀ (real matrix
 * elements, Condon–Shortley phases), and X₊ maps the block M_J to the block M_J + 1 (Condon &
 * Shortley 1935, §3³ and §8²: l₊|l m⟩ = √((l−m)(l+m+1)) |l m+1⟩, s₊|−½⟩ = |+½⟩). Racah's seniority
 * v of one subshell l^N follows from the pairing operator Q = P†P with
 * P† = Σ_m (−1)^{l−m} a†_{m↑} a†_{−m↓}, whose eigenvalue is (N − v)(4l + 4 − N − v)/4
 * (Racah 1943, Phys. Rev. 63, 367; the quasi-spin form in Judd 1967 and Lawson 1980).
 */
import { annihilate, create, detKey, rowOf, type DeterminantBlock, type OrbitalSet } from './determinants';

/** A symmetric n × n matrix in compressed rows: row i's entries are col/val[start[i] … start[i+1]). */
export interface SparseSymmetric {
	n: number;
	start: Int32Array;
	col: Int32Array;
	val: Float64Array;
}

/** Σ_R A[R,I]·A[R,J] for a sparse map R → [(I, value)], plus `diagonal(i)` on the diagonal. */
function gram(targets: Map<string, [number, number][]>, n: number, diagonal: (i: number) => number): SparseSymmetric {
	const rows: Map<number, number>[] = Array.from({ length: n }, (_, i) => new Map([[i, diagonal(i)]]));
	for (const list of targets.values()) {
		for (const [i, a] of list) for (const [j, b] of list) rows[i].set(j, (rows[i].get(j) ?? 0) + a * b);
	}
	const start = new Int32Array(n + 1);
	rows.forEach((r, i) => (start[i + 1] = start[i] + r.size));
	const col = new Int32Array(start[n]);
	const val = new Float64Array(start[n]);
	rows.forEach((r, i) => {
		let k = start[i];
		for (const [j, v] of r) {
			col[k] = j;
			val[k++] = v;
		}
	});
	return { n, start, col, val };
}

/** The dense sub-matrix of `m` on the rows and columns `idx` (row-major, idx.length²). */
export function denseSubmatrix(m: SparseSymmetric, idx: readonly number[]): Float64Array {
	const pos = new Map(idx.map((i, a) => [i, a]));
	const d = idx.length;
	const out = new Float64Array(d * d);
	idx.forEach((i, a) => {
		for (let k = m.start[i]; k < m.start[i + 1]; k++) {
			const b = pos.get(m.col[k]);
			if (b !== undefined) out[a * d + b] = m.val[k];
		}
	});
	return out;
}

/** Entry (i, j) of `m` (0 where nothing is stored). */
export function entryOf(m: SparseSymmetric, i: number, j: number): number {
	for (let k = m.start[i]; k < m.start[i + 1]; k++) if (m.col[k] === j) return m.val[k];
	return 0;
}

function push(targets: Map<string, [number, number][]>, occ: number[], col: number, value: number) {
	const key = detKey(occ);
	const list = targets.get(key);
	// The same (target, column) pair may arise from different terms; merge them.
	if (list) {
		const hit = list.find((e) => e[0] === col);
		if (hit) hit[1] += value;
		else list.push([col, value]);
	} else targets.set(key, [[col, value]]);
}

/** The raising operators applied to every determinant: which = 'L', 'S' or 'J' (= L + S). */
function raised(set: OrbitalSet, block: DeterminantBlock, which: 'L' | 'S' | 'J'): Map<string, [number, number][]> {
	const targets = new Map<string, [number, number][]>();
	for (let I = 0; I < block.size; I++) {
		const occ = Array.from(rowOf(block, I));
		for (const a of occ) {
			const o = set.orbitals[a];
			if (which !== 'S' && o.ml < o.l) {
				// l₊: (m, σ) → (m+1, σ), neighbouring spin-orbital number + 2
				const amp = Math.sqrt((o.l - o.ml) * (o.l + o.ml + 1));
				const s1 = annihilate(occ, a)!;
				const s2 = create(s1.occ, a + 2);
				if (s2) push(targets, s2.occ, I, amp * s1.sign * s2.sign);
			}
			if (which !== 'L' && o.twoMs === -1) {
				const s1 = annihilate(occ, a)!;
				const s2 = create(s1.occ, a + 1);
				if (s2) push(targets, s2.occ, I, s1.sign * s2.sign);
			}
		}
	}
	return targets;
}

/**
 * L² of the block: L₋L₊ + M_L² + M_L.
 * @example lSquared(set2p2, block).n // 5
 */
export function lSquared(set: OrbitalSet, block: DeterminantBlock): SparseSymmetric {
	return gram(raised(set, block, 'L'), block.size, (i) => block.ML[i] * (block.ML[i] + 1));
}

/** S² of the block: S₋S₊ + M_S² + M_S. */
export function sSquared(set: OrbitalSet, block: DeterminantBlock): SparseSymmetric {
	return gram(raised(set, block, 'S'), block.size, (i) => (block.twoMS[i] / 2) * (block.twoMS[i] / 2 + 1));
}

/** J² of the block: J₋J₊ + M_J(M_J + 1), M_J the block's constant. */
export function jSquared(set: OrbitalSet, block: DeterminantBlock): SparseSymmetric {
	const M = block.twoMJ / 2;
	return gram(raised(set, block, 'J'), block.size, () => M * (M + 1));
}

/**
 * Racah's pairing operator Q = P†P of open subshell `shell` in the block (see the file comment).
 * @example pairing(setD2, block, 0) // ¹S has eigenvalue 5 = 2l + 1, the other terms 0
 */
export function pairing(set: OrbitalSet, block: DeterminantBlock, shell: number): SparseSymmetric {
	const s = set.shells[shell];
	const first = set.offsets[shell];
	const targets = new Map<string, [number, number][]>();
	for (let I = 0; I < block.size; I++) {
		const occ = Array.from(rowOf(block, I));
		for (let m = -s.l; m <= s.l; m++) {
			const up = first + 2 * (m + s.l) + 1;
			const down = first + 2 * (-m + s.l);
			// P contains (−1)^{l−m} a_{−m↓} a_{m↑}: a_{m↑} acts first.
			const s1 = annihilate(occ, up);
			if (!s1) continue;
			const s2 = annihilate(s1.occ, down);
			if (!s2) continue;
			const phase = (s.l - m) % 2 === 0 ? 1 : -1;
			push(targets, s2.occ, I, phase * s1.sign * s2.sign);
		}
	}
	return gram(targets, block.size, () => 0);
}

/** Seniority v from a pairing eigenvalue q of l^N: the v (same parity as N) with (N−v)(4l+4−N−v)/4 closest to q. */
export function seniorityFromPairing(l: number, N: number, q: number): { v: number; error: number } {
	let best = { v: N % 2, error: Infinity };
	for (let v = N % 2; v <= Math.min(N, 4 * l + 2 - N); v += 2) {
		const err = Math.abs(((N - v) * (4 * l + 4 - N - v)) / 4 - q);
		if (err < best.error) best = { v, error: err };
	}
	return best;
}
