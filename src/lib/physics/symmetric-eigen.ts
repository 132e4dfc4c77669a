/**
 * Eigenvalues and eigenvectors of a real symmetric matrix: Householder reduction to tridiagonal
 * form followed by the implicit QL algorithm with shifts (Wilkinson & Reinsch, Handbook for
 * Automatic Computation II, 1971, procedures tred2 and tql2; the same algorithm as the public-domain
 * JAMA library and ml-matrix's EigenvalueDecomposition). This version works on one flat
 * Float64Array and keeps the eigenvectors as contiguous rows, which measured about 4× faster than
 * ml-matrix's array-of-arrays version for n ≈ 300 (scripts/bench-energy.ts prints both).
 */

/** Eigenvalues ascending; `vectors` holds eigenvector i in row i (entries i·n … i·n + n − 1), normalised. */
export interface SymmetricEigen {
	n: number;
	values: Float64Array;
	vectors: Float64Array;
}

const EPS = 2 ** -52;

/** Relative size below which an entry is treated as zero (far below the double epsilon 2.2e-16). */
const NEGLIGIBLE = 1e-150;

/**
 * Diagonalises the symmetric n×n matrix `a` (row-major, only read; both triangles must be filled).
 * Source: Wilkinson & Reinsch (1971) tred2/tql2. Throws RangeError when the size does not match
 * or the matrix holds a non-finite number.
 * @example symmetricEigen(Float64Array.from([2, 1, 1, 2]), 2).values // Float64Array [1, 3]
 */
export function symmetricEigen(a: Float64Array, n: number): SymmetricEigen {
	if (!Number.isInteger(n) || n < 0 || a.length !== n * n)
		throw new RangeError(`symmetricEigen needs an n×n matrix: got ${a.length} entries for n = ${n}`);
	for (let i = 0; i < a.length; i++)
		if (!Number.isFinite(a[i])) throw new RangeError('symmetricEigen: the matrix holds a non-finite number');
	if (n === 0) return { n, values: new Float64Array(0), vectors: new Float64Array(0) };
	// Scale to entries of order 1 so that tiny (denormal) or huge matrices neither underflow nor overflow.
	let scale = 0;
	for (let i = 0; i < a.length; i++) scale = Math.max(scale, Math.abs(a[i]));
	if (scale === 0) {
		const vectors = new Float64Array(n * n);
		for (let i = 0; i < n; i++) vectors[i * n + i] = 1;
		return { n, values: new Float64Array(n), vectors };
	}
	// Entries below NEGLIGIBLE relative to the largest change no eigenpair beyond rounding (Weyl's
	// inequality: |Δλ| ≤ ‖ΔA‖ ≤ n·NEGLIGIBLE ≪ machine epsilon), but their squares underflow in the
	// Householder sums and can give 0/0; they are set to zero.
	const V = Float64Array.from(a, (x) => {
		const y = x / scale;
		return Math.abs(y) < NEGLIGIBLE ? 0 : y;
	});
	const d = new Float64Array(n);
	const e = new Float64Array(n);
	tred2(V, d, e, n);
	// tred2 below works on the transpose of the textbook V (the input is symmetric, so it starts
	// equal), which makes its inner loops and the QL rotations run along contiguous rows.
	const W = V;
	tql2(W, d, e, n);
	// Sort ascending.
	const order = Array.from({ length: n }, (_, i) => i).sort((x, y) => d[x] - d[y]);
	const values = new Float64Array(n);
	const vectors = new Float64Array(n * n);
	for (let r = 0; r < n; r++) {
		values[r] = d[order[r]] * scale;
		vectors.set(W.subarray(order[r] * n, order[r] * n + n), r * n);
	}
	return { n, values, vectors };
}

function tred2(V: Float64Array, d: Float64Array, e: Float64Array, n: number): void {
	for (let j = 0; j < n; j++) d[j] = V[j * n + n - 1];
	for (let i = n - 1; i > 0; i--) {
		let scale = 0;
		let h = 0;
		for (let k = 0; k < i; k++) scale += Math.abs(d[k]);
		if (scale === 0) {
			e[i] = d[i - 1];
			for (let j = 0; j < i; j++) {
				d[j] = V[j * n + i - 1];
				V[j * n + i] = 0;
				V[i * n + j] = 0;
			}
		} else {
			for (let k = 0; k < i; k++) {
				d[k] /= scale;
				h += d[k] * d[k];
			}
			let f = d[i - 1];
			let g = Math.sqrt(h);
			if (f > 0) g = -g;
			e[i] = scale * g;
			h -= f * g;
			d[i - 1] = f - g;
			for (let j = 0; j < i; j++) e[j] = 0;
			for (let j = 0; j < i; j++) {
				f = d[j];
				V[i * n + j] = f;
				g = e[j] + V[j * n + j] * f;
				for (let k = j + 1; k <= i - 1; k++) {
					const vkj = V[j * n + k];
					g += vkj * d[k];
					e[k] += vkj * f;
				}
				e[j] = g;
			}
			f = 0;
			for (let j = 0; j < i; j++) {
				e[j] /= h;
				f += e[j] * d[j];
			}
			const hh = f / (h + h);
			for (let j = 0; j < i; j++) e[j] -= hh * d[j];
			for (let j = 0; j < i; j++) {
				f = d[j];
				g = e[j];
				for (let k = j; k <= i - 1; k++) V[j * n + k] -= f * e[k] + g * d[k];
				d[j] = V[j * n + i - 1];
				V[j * n + i] = 0;
			}
		}
		d[i] = h;
	}
	for (let i = 0; i < n - 1; i++) {
		V[i * n + n - 1] = V[i * n + i];
		V[i * n + i] = 1;
		const h = d[i + 1];
		if (h !== 0) {
			for (let k = 0; k <= i; k++) d[k] = V[(i + 1) * n + k] / h;
			for (let j = 0; j <= i; j++) {
				let g = 0;
				for (let k = 0; k <= i; k++) g += V[(i + 1) * n + k] * V[j * n + k];
				for (let k = 0; k <= i; k++) V[j * n + k] -= g * d[k];
			}
		}
		for (let k = 0; k <= i; k++) V[(i + 1) * n + k] = 0;
	}
	for (let j = 0; j < n; j++) {
		d[j] = V[j * n + n - 1];
		V[j * n + n - 1] = 0;
	}
	V[(n - 1) * n + n - 1] = 1;
	e[0] = 0;
}

/** QL on the tridiagonal (d, e); W is the transposed accumulated transform (row i = column i of V). */
function tql2(W: Float64Array, d: Float64Array, e: Float64Array, n: number): void {
	for (let i = 1; i < n; i++) e[i - 1] = e[i];
	e[n - 1] = 0;
	let f = 0;
	let tst1 = 0;
	for (let l = 0; l < n; l++) {
		tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
		let m = l;
		while (m < n) {
			if (Math.abs(e[m]) <= EPS * tst1) break;
			m++;
		}
		if (m === n) m = n - 1;
		if (m > l) {
			let iterations = 0;
			do {
				if (++iterations > 60) throw new Error('internal error: symmetricEigen did not converge');
				let g = d[l];
				let p = (d[l + 1] - g) / (2 * e[l]);
				let r = Math.hypot(p, 1);
				if (p < 0) r = -r;
				d[l] = e[l] / (p + r);
				d[l + 1] = e[l] * (p + r);
				const dl1 = d[l + 1];
				let h = g - d[l];
				for (let i = l + 2; i < n; i++) d[i] -= h;
				f += h;
				p = d[m];
				let c = 1;
				let c2 = c;
				let c3 = c;
				const el1 = e[l + 1];
				let s = 0;
				let s2 = 0;
				for (let i = m - 1; i >= l; i--) {
					c3 = c2;
					c2 = c;
					s2 = s;
					g = c * e[i];
					h = c * p;
					r = Math.hypot(p, e[i]);
					e[i + 1] = s * r;
					s = e[i] / r;
					c = p / r;
					p = c * d[i] - s * g;
					d[i + 1] = h + s * (c * g + s * d[i]);
					const rowA = (i + 1) * n;
					const rowB = i * n;
					for (let k = 0; k < n; k++) {
						const hk = W[rowA + k];
						const vk = W[rowB + k];
						W[rowA + k] = s * vk + c * hk;
						W[rowB + k] = c * vk - s * hk;
					}
				}
				p = (-s * s2 * c3 * el1 * e[l]) / dl1;
				e[l] = s * p;
				d[l] = c * p;
			} while (Math.abs(e[l]) > EPS * tst1);
		}
		d[l] = d[l] + f;
		e[l] = 0;
	}
}
