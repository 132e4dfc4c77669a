/**
 * The term-by-term LS basis (ls-terms.ts) against the whole determinant block: the central M_J
 * block holds one state of every level (Condon & Shortley 1935, §3⁴), so the eigenvalues of the
 * full energy matrix in that block must equal the union of the J spaces' eigenvalues, for any
 * parameter values. This checks the ladder phases, the Clebsch–Gordan sums, the Coulomb elements
 * read on one piece and the spin–orbit reduced elements (Wigner–Eckart) at once.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { clearEnergyCache, energyStructure } from './energy-structure';
import { solveRaw } from './levels-ic';
import { parseConfiguration } from './parse';
import { centralTwoMJ, determinantBlock } from './determinants';
import { parameterMatrices } from './hamiltonian';
import { symmetricEigen } from './symmetric-eigen';
import { termPieces } from './ls-terms';

/** Eigenvalue agreement, relative to the parameter scale (rounding of two eigen solvers; common practice, no source). */
const AGREE = 1e-8;

/** The eigenvalues of E_av + Σ_p v_p (H_p − average_p) in the whole central block, ascending. */
function blockEigenvalues(config: string, values: number[]): number[] {
	const s = energyStructure(parseConfiguration(config));
	const block = determinantBlock(s.set, centralTwoMJ(s.set.electrons));
	const m = parameterMatrices(s.set, block, s.params);
	const n = block.size;
	const H = new Float64Array(n * n);
	for (let e = 0; e < m.rows.length; e++) {
		const v = values[m.param[e]] * m.coef[e];
		H[m.rows[e] * n + m.cols[e]] += v;
		if (m.rows[e] !== m.cols[e]) H[m.cols[e] * n + m.rows[e]] += v;
	}
	for (let i = 0; i < n; i++) for (let p = 0; p < values.length; p++) H[i * n + i] -= values[p] * m.average[p];
	return Array.from(symmetricEigen(H, n).values).sort((a, b) => a - b);
}

const CASES = [
	'2p3', // three equivalent electrons, M_J = ½
	'3d3', // two ²D terms told apart by seniority
	'4f2', // f shell: seniority not conserved by the Coulomb integrals
	'2p 3p', // two open subshells, F and G
	'3d2 4p', // odd, three kinds of exchange
	'4f 5d', // f and d, ΔL up to 5 between terms
	'2p2 3s 3p' // three open subshells, an s among them
];

describe('J spaces from the term basis give the eigenvalues of the whole determinant block', () => {
	for (const config of CASES) {
		it(`${config}, random parameters (fast-check)`, () => {
			clearEnergyCache();
			const count = energyStructure(parseConfiguration(config)).params.length;
			fc.assert(
				fc.property(fc.array(fc.double({ min: -5000, max: 60000, noNaN: true }), { minLength: count, maxLength: count }), (values) => {
					const s = energyStructure(parseConfiguration(config));
					const fromSpaces = solveRaw(s, 0, values).map((l) => l.energy);
					const whole = blockEigenvalues(config, values);
					expect(fromSpaces).toHaveLength(whole.length);
					const scale = Math.max(1, ...values.map(Math.abs));
					fromSpaces.forEach((e, i) => expect(Math.abs(e - whole[i])).toBeLessThan(AGREE * scale));
				}),
				{ numRuns: 8 }
			);
		});
	}
});

describe('the pieces of a term in a block (|M_L| ≤ L, |M_J − M_L| ≤ S)', () => {
	it('⁴F in the M_J = ½ block lives on M_L = −1 … 2 (M_S = 3/2 … −3/2)', () => expect(termPieces(1, 3, 3)).toEqual({ from: -1, to: 2 }));
	it('¹S in the M_J = 0 block lives on M_L = 0 only', () => expect(termPieces(0, 0, 0)).toEqual({ from: 0, to: 0 }));
	it('⁸S in the M_J = ½ block: M_L = 0 only', () => expect(termPieces(1, 7, 0)).toEqual({ from: 0, to: 0 }));
});
