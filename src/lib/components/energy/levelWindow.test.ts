/**
 * The level table's filters and page, and the level picture's label placement (product rules,
 * common practice, no source). The level data are invented; the J counts of d² (³F₂,₃,₄ ³P₀,₁,₂
 * ¹D₂ ¹G₄ ¹S₀: J = 0 ×2, 1 ×1, 2 ×3, 3 ×1, 4 ×2) are from Condon & Shortley 1935, ch. VII.
 */
import { describe, expect, it } from 'vitest';
import { levelWindow, placeLabels } from './levelWindow';
import { countByJ } from '../jValues';

const level = (J: string, relative: number) => ({ J, relative });
// d² in an invented order of energies.
const D2 = [
	level('2', 0),
	level('3', 10),
	level('4', 20),
	level('2', 30),
	level('0', 40),
	level('1', 50),
	level('2', 60),
	level('4', 70),
	level('0', 80)
];

describe('levelWindow', () => {
	it('keeps every level without filters, each with its rank from the lowest', () => {
		const w = levelWindow(D2, { J: [], maxRelative: null, limit: 100 });
		expect(w).toMatchObject({ matching: 9, total: 9 });
		expect(w.rows.map((r) => r.rank)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
	});
	it('filters by J and keeps the ranks of the whole answer', () => {
		const w = levelWindow(D2, { J: ['2'], maxRelative: null, limit: 100 });
		expect(w.rows.map((r) => r.rank)).toEqual([1, 4, 7]);
		expect(w.matching).toBe(3);
	});
	it('cuts at an energy ceiling and at the page limit, counting what matched', () => {
		const w = levelWindow(D2, { J: [], maxRelative: 45, limit: 2 });
		expect(w.rows.map((r) => r.level.relative)).toEqual([0, 10]);
		expect(w).toMatchObject({ matching: 5, total: 9 });
	});
});

describe('countByJ (the J filter of the level table)', () => {
	it('d²: J = 0 ×2, 1 ×1, 2 ×3, 3 ×1, 4 ×2, smallest J first', () =>
		expect(countByJ(D2)).toEqual([
			{ J: '0', count: 2 },
			{ J: '1', count: 1 },
			{ J: '2', count: 3 },
			{ J: '3', count: 1 },
			{ J: '4', count: 2 }
		]));
	it('sorts half-integer J by value (1/2 before 3/2 before 11/2)', () =>
		expect(countByJ([level('11/2', 0), level('1/2', 1), level('3/2', 2)]).map((c) => c.J)).toEqual(['1/2', '3/2', '11/2']));
});

describe('placeLabels', () => {
	it('leaves labels of well-spaced levels at their levels', () => expect(placeLabels([400, 300, 200], 12, 20)).toEqual([400, 300, 200]));
	it('pushes a crowded label up to keep the gap', () => expect(placeLabels([400, 395, 390], 12, 20)).toEqual([400, 388, 376]));
	it('leaves out labels that would drift more than maxShift or above the top', () => {
		expect(placeLabels([400, 399, 398, 397], 12, 20, 5)).toEqual([400, null, null, null]);
		expect(placeLabels([30, 29], 12, 20)).toEqual([30, null]);
	});
});
