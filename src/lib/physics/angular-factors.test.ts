import { describe, expect, it } from 'vitest';
import { ck } from './angular-factors';

// Condon & Shortley 1935, Table 1⁶ (c^k for p p): c⁰ = 1 on the diagonal; c²(±1,±1) = −1/5,
// c²(±1,0) = √3/5, c²(0,0) = 2/5, c²(±1,∓1) = −√6/5.
describe('c^k(l m, l′ m′) for p–p (Condon & Shortley 1935, Table 1⁶)', () => {
	it('c⁰(p1, p1) = 1', () => expect(ck(1, 1, 1, 1, 0)).toBeCloseTo(1, 14));
	it('c²(p1, p1) = −1/5', () => expect(ck(1, 1, 1, 1, 2)).toBeCloseTo(-1 / 5, 14));
	it('c²(p1, p0) = √3/5 up to the phase (−1)^{m−m′}', () => expect(Math.abs(ck(1, 1, 1, 0, 2))).toBeCloseTo(Math.sqrt(3) / 5, 14));
	it('c²(p0, p0) = 2/5', () => expect(ck(1, 0, 1, 0, 2)).toBeCloseTo(2 / 5, 14));
	it('c²(p1, p−1) = −√6/5', () => expect(ck(1, 1, 1, -1, 2)).toBeCloseTo(-Math.sqrt(6) / 5, 14));
	it('vanishes for odd l + k + l′ and outside the triangle', () => {
		expect(ck(1, 0, 1, 0, 1)).toBe(0);
		expect(ck(1, 0, 1, 0, 4)).toBe(0);
	});
	it('s–p exchange: c¹(s0, p0)² = 1/3 (Condon & Shortley Table 1⁶: c¹(s, p0) = 1/√3)', () =>
		expect(ck(0, 0, 1, 0, 1) ** 2).toBeCloseTo(1 / 3, 14));
});
