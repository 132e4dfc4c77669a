import { describe, expect, it } from 'vitest';
import { couplingSweep } from './sweep';
import { intermediateLevels } from './levels-ic';

const params = {
	F: [{ k: 2, a: '2p', b: '2p', value: 25 * 1000 }],
	zeta: [{ shell: '2p', value: 800 }]
}; // invented

describe('LS → jj sweep', () => {
	const sweep = couplingSweep('2p2', params, { points: 61 });
	it('has 61 points from t = 0 to t = 1 and one curve per level (p²: 5)', () => {
		expect(sweep.t).toHaveLength(61);
		expect(sweep.t[0]).toBe(0);
		expect(sweep.t[60]).toBe(1);
		expect(sweep.curves).toHaveLength(5);
		for (const c of sweep.curves) expect(c.energies).toHaveLength(61);
	});
	it('starts at the pure LS energies (ζ = 0) and ends at the pure jj energies (F = 0), Condon & Shortley p² values', () => {
		const ls = intermediateLevels('2p2', { F: params.F })
			.levels.map((l) => l.energy)
			.sort((a, b) => a - b);
		const jj = intermediateLevels('2p2', { zeta: params.zeta })
			.levels.map((l) => l.energy)
			.sort((a, b) => a - b);
		const first = sweep.curves.map((c) => c.energies[0]).sort((a, b) => a - b);
		const last = sweep.curves.map((c) => c.energies[60]).sort((a, b) => a - b);
		first.forEach((e, i) => expect(e).toBeCloseTo(ls[i], 6));
		last.forEach((e, i) => expect(e).toBeCloseTo(jj[i], 6));
	});
	it('labels curves by their LS term at t = 0 and jj group at t = 1: J = 0 goes ³P → (½)², ¹S → (3/2)²', () => {
		const j0 = sweep.curves.filter((c) => c.J === '0');
		expect(j0.map((c) => [c.lsLabel, c.jjLabel])).toEqual([
			['3P', '2p_{1/2}^2'],
			['1S', '2p_{3/2}^2']
		]);
	});
	it('curves of one J never cross (non-crossing rule, von Neumann & Wigner 1929)', () => {
		for (const J of ['0', '2']) {
			const [a, b] = sweep.curves.filter((c) => c.J === J);
			a.energies.forEach((e, i) => expect(e).toBeLessThanOrEqual(b.energies[i]));
		}
	});
	it('refuses a bad number of points, stating the range', () => {
		expect(() => couplingSweep('2p2', params, { points: 1 })).toThrow(/from 2 to 201/);
		expect(() => couplingSweep('2p2', params, { points: 1000 })).toThrow(/from 2 to 201/);
	});
});
