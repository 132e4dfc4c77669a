import { describe, expect, it } from 'vitest';
import { evaluateSymbol } from './symbol-args';
import { MAX_J_9J, MAX_J_SYMBOL } from '../../physics/wigner';

const FLOAT_TOLERANCE = 1e-12;

describe('evaluateSymbol', () => {
	it('evaluates cg ⟨1 0, 1/2 1/2 | 3/2 1/2⟩ = sqrt(2/3) (PDG 1 × 1/2 table)', () => {
		const r = evaluateSymbol('cg', ['1', '0', '1/2', '1/2', '3/2', '1/2']);
		expect(r.exact).toEqual({ sign: 1, squared: '2/3' });
		expect(r.text).toBe('sqrt(2/3)');
		expect(Math.abs(r.value - Math.sqrt(2 / 3))).toBeLessThan(FLOAT_TOLERANCE);
	});
	it('evaluates 3j (1 1 0; 1 −1 0) = 1/sqrt(3) (Edmonds Table 2 first form), 6j {1 1 1; 1 1 1} = 1/6, and a zero 9j', () => {
		expect(evaluateSymbol('3j', ['1', '1', '0', '1', '-1', '0']).exact).toEqual({ sign: 1, squared: '1/3' });
		expect(evaluateSymbol('6j', ['1', '1', '1', '1', '1', '1']).text).toBe('1/6');
		expect(evaluateSymbol('9j', ['1', '1', '1', '1', '1', '1', '1', '1', '1'])).toMatchObject({
			value: 0,
			exact: { sign: 0, squared: '0' }
		});
		// (j j 0; m −m 0) with j = 3/2, m = −1/2: (−1)^{j−m}/sqrt(2j+1) = +1/2 (Edmonds Table 2)
		expect(evaluateSymbol('3j', ['1.5', '1.5', '0', '-0.5', '0.5', '0']).exact).toEqual({ sign: 1, squared: '1/4' });
		expect(evaluateSymbol('3j', ['1.5', '1.5', '0', '1/2', '-1/2', '0']).exact).toEqual({ sign: -1, squared: '1/4' });
	});
	it('says how many values each kind needs', () => {
		expect(() => evaluateSymbol('3j', ['1', '1', '0', '1', '-1'])).toThrow('3j needs 6 values (j1, j2, j3, m1, m2, m3), got 5');
		expect(() => evaluateSymbol('cg', [])).toThrow('cg needs 6 values (j1, m1, j2, m2, J, M), got 0');
		expect(() => evaluateSymbol('9j', ['1'])).toThrow(/9j needs 9 values/);
		expect(() => evaluateSymbol('12j' as never, ['1'])).toThrow(/kind must be one of 3j, 6j, 9j, cg/);
	});
	it('names a value that is not an integer or half-integer, a negative j and an out-of-range m', () => {
		expect(() => evaluateSymbol('6j', ['1', '1', '1/3', '1', '1', '1'])).toThrow(
			'6j argument 3 (j3) = "1/3" is not an integer or half-integer'
		);
		expect(() => evaluateSymbol('6j', ['1', '-1', '1', '1', '1', '1'])).toThrow('6j argument 2 (j2) = -1 must be ≥ 0');
		expect(() => evaluateSymbol('cg', ['1', '2', '1', '0', '1', '0'])).toThrow(/\|m1\| = 2 exceeds j1 = 1/);
	});
	it(`refuses j above ${MAX_J_SYMBOL} (${MAX_J_9J} for 9j) and states the limit`, () => {
		const big = String(MAX_J_SYMBOL + 1);
		expect(() => evaluateSymbol('6j', [big, big, '1', '1', '1', '1'])).toThrow(`at most ${MAX_J_SYMBOL} for 6j`);
		expect(() => evaluateSymbol('3j', ['1', big, big, '0', '0', '0'])).toThrow(/argument 2 \(j2\)/);
		const big9 = String(MAX_J_9J + 1);
		expect(() => evaluateSymbol('9j', [big9, '1', big9, '1', '1', '1', '1', '1', '1'])).toThrow(`at most ${MAX_J_9J} for 9j`);
		expect(evaluateSymbol('3j', [String(MAX_J_SYMBOL), String(MAX_J_SYMBOL), '0', '0', '0', '0']).exact.sign).toBe(1);
	});
});
