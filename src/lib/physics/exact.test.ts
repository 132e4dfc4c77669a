import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	EXACT_ZERO,
	exactEquals,
	exactFromRational,
	exactMultiply,
	exactNegate,
	exactScale,
	exactSqrt,
	exactSquaredString,
	exactString,
	exactToNumber,
	factorial,
	gcd,
	perfectSquareRoot,
	rational,
	rationalAdd,
	rationalMultiply
} from './exact';

/** Relative agreement expected between exactToNumber and Math.sqrt on small inputs (a few ulp). */
const RELATIVE_TOLERANCE = 1e-15;

function closeRelative(a: number, b: number): boolean {
	return Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

describe('factorial', () => {
	// 20! from memory; the recurrence test below checks it independently.
	it('gives 0! = 1, 5! = 120, 20! = 2432902008176640000', () => {
		expect(factorial(0)).toBe(1n);
		expect(factorial(1)).toBe(1n);
		expect(factorial(5)).toBe(120n);
		expect(factorial(20)).toBe(2432902008176640000n);
	});
	it('satisfies n! = n (n-1)! up to 300', () => {
		for (let n = 1; n <= 300; n++) expect(factorial(n)).toBe(BigInt(n) * factorial(n - 1));
	});
	it('rejects negative and fractional n with a message naming the allowed range', () => {
		expect(() => factorial(-1)).toThrow(/integer from 0 to/);
		expect(() => factorial(1.5)).toThrow(/got 1.5/);
	});
});

describe('rationals', () => {
	it('reduces and moves the sign to the numerator', () => {
		expect(rational(6n, -4n)).toEqual({ num: -3n, den: 2n });
		expect(rational(0n, -7n)).toEqual({ num: 0n, den: 1n });
		expect(() => rational(1n, 0n)).toThrow(/denominator/);
	});
	it('adds and multiplies: 1/2 + 1/3 = 5/6, (2/3)(3/4) = 1/2', () => {
		expect(rationalAdd(rational(1n, 2n), rational(1n, 3n))).toEqual({ num: 5n, den: 6n });
		expect(rationalMultiply(rational(2n, 3n), rational(3n, 4n))).toEqual({ num: 1n, den: 2n });
	});
	it('gcd is the greatest common divisor (property: divides both, and the cofactors are coprime)', () => {
		fc.assert(
			fc.property(fc.bigInt({ min: 1n, max: 10n ** 30n }), fc.bigInt({ min: 1n, max: 10n ** 30n }), (a, b) => {
				const g = gcd(a, -b);
				return a % g === 0n && b % g === 0n && gcd(a / g, b / g) === 1n;
			})
		);
	});
});

describe('ExactSqrt construction', () => {
	it('keeps sqrt(6/20) as sqrt(3/10) and zero as sign 0', () => {
		expect(exactSqrt(-1, 6n, 20n)).toEqual({ sign: -1, num: 3n, den: 10n });
		expect(exactSqrt(1, 0n, 5n)).toEqual(EXACT_ZERO);
		expect(exactSqrt(0, 3n, 5n)).toEqual(EXACT_ZERO);
	});
	it('rejects a negative radicand or a zero denominator', () => {
		expect(() => exactSqrt(1, -1n, 2n)).toThrow(/numerator must be ≥ 0/);
		expect(() => exactSqrt(1, 1n, 0n)).toThrow(/denominator must be > 0/);
	});
	it('multiplies, scales and negates: sqrt(1/2)·(−sqrt(2/3)) = −sqrt(1/3), sqrt(1/3)·(−3/2) = −sqrt(3/4)', () => {
		expect(exactMultiply(exactSqrt(1, 1n, 2n), exactSqrt(-1, 2n, 3n))).toEqual({ sign: -1, num: 1n, den: 3n });
		expect(exactScale(exactSqrt(1, 1n, 3n), rational(-3n, 2n))).toEqual({ sign: -1, num: 3n, den: 4n });
		expect(exactNegate(exactSqrt(1, 1n, 2n))).toEqual({ sign: -1, num: 1n, den: 2n });
		expect(exactNegate(EXACT_ZERO)).toEqual(EXACT_ZERO);
		expect(exactScale(exactSqrt(1, 1n, 3n), rational(0n, 1n))).toEqual(EXACT_ZERO);
	});
	it('writes a rational r as sign(r) sqrt(r²)', () => {
		expect(exactFromRational(rational(-1n, 2n))).toEqual({ sign: -1, num: 1n, den: 4n });
		expect(exactEquals(exactFromRational(rational(0n, 1n)), EXACT_ZERO)).toBe(true);
	});
});

describe('exactToNumber', () => {
	it('matches Math.sqrt for small radicands (property)', () => {
		fc.assert(
			fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 1_000_000 }), fc.boolean(), (p, q, neg) => {
				const x = exactSqrt(neg ? -1 : 1, BigInt(p), BigInt(q));
				return closeRelative(exactToNumber(x), (neg ? -1 : 1) * Math.sqrt(p / q));
			})
		);
	});
	it('stays finite and accurate when num and den overflow a double (10^400-digit-sized radicands)', () => {
		const big = 10n ** 400n;
		expect(closeRelative(exactToNumber(exactSqrt(1, 3n * big + 1n, big)), Math.sqrt(3))).toBe(true);
		// (10^400 + 1)/10^400 is already in lowest terms, so the BigInts stay huge.
		const x = exactSqrt(-1, big + 1n, big);
		expect(closeRelative(exactToNumber(x), -1)).toBe(true);
		// sqrt(1/2^2000) = 2^-1000, still a normal double.
		expect(exactToNumber(exactSqrt(1, 1n, 1n << 2000n))).toBe(2 ** -1000);
		expect(exactToNumber(exactSqrt(1, 1n << 1600n, 1n))).toBe(2 ** 800);
	});
	it('returns 0 for zero', () => {
		expect(exactToNumber(EXACT_ZERO)).toBe(0);
	});
});

describe('exact strings', () => {
	it('writes -sqrt(3/10), sqrt(2), 1/2, -1, 0', () => {
		expect(exactString(exactSqrt(-1, 3n, 10n))).toBe('-sqrt(3/10)');
		expect(exactString(exactSqrt(1, 2n, 1n))).toBe('sqrt(2)');
		expect(exactString(exactSqrt(1, 1n, 4n))).toBe('1/2');
		expect(exactString(exactSqrt(-1, 1n, 1n))).toBe('-1');
		expect(exactString(EXACT_ZERO)).toBe('0');
	});
	it('writes the square as "p/q" or "p"', () => {
		expect(exactSquaredString(exactSqrt(-1, 3n, 10n))).toBe('3/10');
		expect(exactSquaredString(exactSqrt(1, 4n, 1n))).toBe('4');
		expect(exactSquaredString(EXACT_ZERO)).toBe('0');
	});
	it('finds integer square roots of perfect squares only (property)', () => {
		fc.assert(
			fc.property(fc.bigInt({ min: 0n, max: 10n ** 40n }), (r) => {
				return perfectSquareRoot(r * r) === r && (r < 1n || perfectSquareRoot(r * r + 1n) === null);
			})
		);
		expect(perfectSquareRoot(-4n)).toBeNull();
	});
});
