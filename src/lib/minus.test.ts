import { describe, expect, it } from 'vitest';
import { withMinus } from './minus';

// The minus sign is U+2212 (Unicode standard; ISO 80000-2 prints − for subtraction and negative numbers).
describe('true minus signs', () => {
	it('−3, −1/2, −0.5 and M_l lists like "−1↑ 0↓" get U+2212; hyphens between words stay', () => {
		expect(withMinus(-3)).toBe('−3');
		expect(withMinus('-1/2')).toBe('−1/2');
		expect(withMinus('-0.5')).toBe('−0.5');
		expect(withMinus('-1+ 0-')).toBe('−1+ 0-');
		expect(withMinus('Russell-Saunders')).toBe('Russell-Saunders');
		expect(withMinus(2)).toBe('2');
	});
});
