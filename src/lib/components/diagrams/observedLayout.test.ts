import { describe, expect, it } from 'vitest';
import { observedLayout, tickStep, OBSERVED_GEOMETRY as G } from './observedLayout';

const level = (term: string, J: string, energy: number) => ({
	key: `${term}#1|${J}`,
	term,
	multiplicity: Number(term[0]),
	letter: term[1],
	occurrence: 1,
	count: 1,
	J,
	energy,
	uncertainty: null,
	status: 'confirmed' as const
});

// Drawing geometry only; the 1-2-5 tick steps are common practice, no source.
describe('observed level diagram layout (geometry, no physics)', () => {
	it('round tick steps: 1, 2, 5 × 10^k', () => {
		expect(tickStep(43000)).toBe(10000);
		expect(tickStep(300)).toBe(50);
		expect(tickStep(7)).toBe(2);
	});

	it('puts higher energies higher and orders columns by their lowest level', () => {
		const { columns } = observedLayout([level('1D', '2', 20000), level('3P', '0', 0), level('3P', '1', 100), level('3P', '2', 300)]);
		expect(columns.map((c) => c.id)).toEqual(['3P#1', '1D#1']);
		const [p] = columns;
		expect(p.levels[2].y).toBeLessThan(p.levels[0].y);
		expect(p.levels[0].y).toBeCloseTo(G.top + G.plotHeight, 6);
	});

	it('keeps crowded J labels at least the minimum gap apart while the bars stay true', () => {
		const { columns } = observedLayout([level('3P', '0', 0), level('3P', '1', 1), level('3P', '2', 2), level('1S', '0', 40000)]);
		const ls = columns[0].levels;
		for (let k = 1; k < ls.length; k++) expect(ls[k - 1].labelY - ls[k].labelY).toBeGreaterThanOrEqual(G.minLabelGap - 1e-9);
		expect(ls[1].y).not.toBe(ls[1].labelY);
	});
});
