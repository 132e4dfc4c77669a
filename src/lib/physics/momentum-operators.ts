/**
 * L², S², J² and Racah's pairing operator as dense matrices in one M_J block of determinants.
 *
 * The squares come from the raising operators: X² = X₋X₊ + X_z² + X_z with X₋ = X₊ᵀ (real matrix
 * elements, Condon–Shortley phases), and X₊ maps the block M_J to the block M_J + 1 (Condon &
 * Shortley 1935, §3³ and §8²: l₊|l m⟩ = √((l−m)(l+m+1)) |l m+1⟩, s₊|−½⟩ = |+½⟩). Racah's seniority
 * v of one subshell l^N follows from the pairing operator Q = P†P with
 * P† = Σ_m (−1)^{l−m} a†_{m↑} a†_{−m↓}, whose eigenvalue is (N − v)(4l + 4 − N − v)/4
 * (Racah 1943, Phys. Rev. 63, 367; the quasi-spin form in Judd 1967 and Lawson 1980).
 */
import { annihilate, create, detKey, rowOf, type DeterminantBlock, type OrbitalSet } from './determinants';

/** Σ_R A[R,I]·A[R,J] for a sparse map R → [(I, value)], as a dense n×n matrix. */
function gram(targets: Map<string, [number, number][]>, n: number): Float64Array {
	const G = new Float64Array(n * n);
	for (const list of targets.values()) {
		for (const [i, a] of list) for (const [j, b] of list) G[i * n + j] += a * b;
	}
	return G;
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
 * L² of the block (dense, row-major): L₋L₊ + M_L² + M_L.
 * @example lSquared(set2p2, block).length // 25
 */
export function lSquared(set: OrbitalSet, block: DeterminantBlock): Float64Array {
	const G = gram(raised(set, block, 'L'), block.size);
	for (let i = 0; i < block.size; i++) G[i * block.size + i] += block.ML[i] * (block.ML[i] + 1);
	return G;
}

/** S² of the block: S₋S₊ + M_S² + M_S. */
export function sSquared(set: OrbitalSet, block: DeterminantBlock): Float64Array {
	const G = gram(raised(set, block, 'S'), block.size);
	for (let i = 0; i < block.size; i++) {
		const ms = block.twoMS[i] / 2;
		G[i * block.size + i] += ms * (ms + 1);
	}
	return G;
}

/** J² of the block: J₋J₊ + M_J(M_J + 1), M_J the block's constant. */
export function jSquared(set: OrbitalSet, block: DeterminantBlock): Float64Array {
	const G = gram(raised(set, block, 'J'), block.size);
	const M = block.twoMJ / 2;
	for (let i = 0; i < block.size; i++) G[i * block.size + i] += M * (M + 1);
	return G;
}

/**
 * Racah's pairing operator Q = P†P of open subshell `shell` in the block (see the file comment).
 * @example pairing(setD2, block, 0) // ¹S has eigenvalue 5 = 2l + 1, the other terms 0
 */
export function pairing(set: OrbitalSet, block: DeterminantBlock, shell: number): Float64Array {
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
	return gram(targets, block.size);
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
