import { describe, expect, it } from 'vitest';
import { checkDeterminantBudget, determinantBlock, determinantCounts, orbitalSet } from './determinants';
import { parseConfiguration } from './parse';

describe('determinant blocks', () => {
	it('p² has C(6,2) = 15 determinants and 5 with M_J = 0, one per level ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII)', () => {
		const cfg = parseConfiguration('2p2');
		expect(determinantCounts(cfg).total).toBe(15);
		expect(determinantBlock(orbitalSet(cfg), 0).size).toBe(determinantCounts(cfg).byTwoMJ.get(0));
		expect(determinantCounts(cfg).byTwoMJ.get(0)).toBe(5);
	});
	it('f⁷ has C(14,7) = 3432 determinants; closed subshells add none', () => {
		expect(determinantCounts(parseConfiguration('[Xe] 4f7')).total).toBe(3432);
	});
	it('every listed determinant of a block has the block M_J', () => {
		const set = orbitalSet(parseConfiguration('3d2 4p'));
		const b = determinantBlock(set, 3);
		for (let i = 0; i < b.size; i++) expect(2 * b.ML[i] + b.twoMS[i]).toBe(3);
		expect(b.size).toBe(determinantCounts(set.shells).byTwoMJ.get(3));
	});
	it('the budget check states the limit', () => {
		expect(() => checkDeterminantBudget(parseConfiguration('4f7 5d'))).toThrow(
			/3106 determinants; the energy solver diagonalises at most 1200/
		);
		expect(() => checkDeterminantBudget(parseConfiguration('4f7'), { maxTotal: 1000 })).toThrow(
			/3432 determinants; the energy solver takes at most 1000/
		);
		expect(checkDeterminantBudget(parseConfiguration('4f7'))).toEqual({ total: 3432, block: 327 });
	});
});
