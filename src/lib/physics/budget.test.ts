/**
 * Budgets of the engine entry points: each refuses over-large input before working, with a
 * message that states the limit (limits: ./budget.ts, common practice, no source). Regression
 * for GET /api/v1/terms?config=12o23, which once grew the heap past 4 GB.
 */
import { describe, expect, it } from 'vitest';
import { BudgetError, gridCells, gridExtent, MAX_GRID_CELLS, sheetLevelRowsBound } from './budget';
import { parseConfiguration } from './parse';
import { termSheet } from './report';
import { termsOf } from './terms';
import { seniorityTable } from './seniority';
import { microstateGrid } from './microstates';
import { jjLevelCountsByJ, jjLevels } from './jj';
import { couplingBridge } from './bridge';
import { wigner3j, wigner6j, wigner9j } from './wigner';
import { termsByEnumeration } from './enumerate';

const cfg = (text: string) => parseConfiguration(text);

describe('engine budgets, checked before the work', () => {
	it('12o23 and 10m19 fit the counting budget; 12o23 is over the Term sheet budget', () => {
		expect(() => termsOf(cfg('12o23'))).not.toThrow(); // terms with seniority counts: small
		expect(() => termSheet(parseConfiguration('12o23'))).toThrow(/Term sheet .* over the limit of 15000/);
	});
	it('the Term sheet row bound is an upper bound of the real J-level rows (3d3: 19 levels in 8 terms → 17 rows)', () => {
		// d³: 2P 2D(2) 2F 2G 2H 4P 4F (Condon & Shortley 1935, ch. VII); rows = distinct terms × their J values.
		const rows = termsOf(cfg('3d3')).reduce((a, t) => a + Math.min(t.twoS, 2 * t.L) + 1, 0);
		expect(rows).toBe(17);
		expect(sheetLevelRowsBound(gridExtent(cfg('3d3').subshells))).toBeGreaterThanOrEqual(rows);
	});
	it('a grid over MAX_GRID_CELLS is refused with the limit', () => {
		const big = cfg('9l17 10m19 11n21 12o23');
		expect(gridCells(gridExtent(big.subshells))).toBeGreaterThan(MAX_GRID_CELLS);
		expect(() => microstateGrid(big)).toThrow(BudgetError);
	});
	it('the seniority table of a subshell is bounded (l ≤ 16, work under the limit)', () => {
		expect(seniorityTable(16, 33).length).toBeGreaterThan(0);
	});
	it('jj counting is refused over its work limit, and the bridge checks the jj listing limit first', () => {
		expect(() => jjLevelCountsByJ(cfg('17v33'))).toThrow(/jj counting work .* over the limit of 4\.0e\+8/);
		expect(() => jjLevels(cfg('4f7 5d3'))).toThrow(/at most 20000/);
		expect(() => couplingBridge(cfg('4f7 5d3'))).toThrow(/at most 20000/);
	});
	it('exact Wigner symbols refuse j over their limits (3j/6j: 200, 9j: 50)', () => {
		expect(() => wigner3j(402, 402, 0, 0, 0, 0)).toThrow(/over the limit of j = 200/);
		expect(() => wigner6j(2, 2, 2, 2, 2, 2_000_000)).toThrow(BudgetError);
		expect(() => wigner9j(102, 2, 2, 2, 2, 2, 2, 2, 2)).toThrow(/over the limit of j = 50/);
	});
	it('explicit enumeration keeps its own limit', () => {
		// 4f7 5d3 6p3: 8 236 800 microstates, over the 2 000 000 that are listed one by one.
		expect(() => termsByEnumeration(cfg('4f7 5d3 6p3'))).toThrow(RangeError);
	});
});
