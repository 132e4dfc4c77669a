/**
 * Exact numbers of the form sign × sqrt(num/den) with num/den a reduced rational.
 *
 * Every Clebsch–Gordan coefficient and every 3j, 6j and 9j symbol has this form
 * (Edmonds 1957, §3.7 and §6.3: a square root of a ratio of factorials times a
 * rational sum), so the engine carries them exactly and converts to floating
 * point only for display.
 */

/** sign × sqrt(num / den), with num ≥ 0, den > 0, gcd(num, den) = 1, and sign = 0 exactly when num = 0. */
export interface ExactSqrt {
	sign: -1 | 0 | 1;
	num: bigint;
	den: bigint;
}

/** A signed rational num/den with den > 0 and gcd(|num|, den) = 1. */
export interface Rational {
	num: bigint;
	den: bigint;
}

/** The exact zero. */
export const EXACT_ZERO: ExactSqrt = Object.freeze({ sign: 0, num: 0n, den: 1n }) as ExactSqrt;

/** Largest n accepted by `factorial`; far above anything the Wigner symbols reach under the API limits. */
export const MAX_FACTORIAL_ARGUMENT = 20000;

const factorialCache: bigint[] = [1n];

/**
 * n! as a BigInt, cached.
 * Throws RangeError when n is not an integer in 0..MAX_FACTORIAL_ARGUMENT.
 * @example factorial(5) // 120n
 */
export function factorial(n: number): bigint {
	if (!Number.isInteger(n) || n < 0 || n > MAX_FACTORIAL_ARGUMENT) {
		throw new RangeError(`factorial: n must be an integer from 0 to ${MAX_FACTORIAL_ARGUMENT}, got ${n}`);
	}
	for (let k = factorialCache.length; k <= n; k++) factorialCache.push(factorialCache[k - 1] * BigInt(k));
	return factorialCache[n];
}

/**
 * Greatest common divisor of two BigInts (Euclid), always ≥ 0.
 * @example gcd(12n, -18n) // 6n
 */
export function gcd(a: bigint, b: bigint): bigint {
	if (a < 0n) a = -a;
	if (b < 0n) b = -b;
	while (b !== 0n) [a, b] = [b, a % b];
	return a;
}

/**
 * The reduced rational num/den. Throws RangeError when den is 0.
 * @example rational(6n, -4n) // { num: -3n, den: 2n }
 */
export function rational(num: bigint, den: bigint): Rational {
	if (den === 0n) throw new RangeError('rational: the denominator must not be 0');
	if (den < 0n) {
		num = -num;
		den = -den;
	}
	if (num === 0n) return { num: 0n, den: 1n };
	const g = gcd(num, den);
	return { num: num / g, den: den / g };
}

/** a + b, reduced. @example rationalAdd(rational(1n, 2n), rational(1n, 3n)) // 5/6 */
export function rationalAdd(a: Rational, b: Rational): Rational {
	return rational(a.num * b.den + b.num * a.den, a.den * b.den);
}

/** a × b, reduced. @example rationalMultiply(rational(2n, 3n), rational(3n, 4n)) // 1/2 */
export function rationalMultiply(a: Rational, b: Rational): Rational {
	return rational(a.num * b.num, a.den * b.den);
}

/**
 * sign × sqrt(num/den) in lowest terms. Throws RangeError when num < 0 or den ≤ 0.
 * @example exactSqrt(-1, 6n, 20n) // { sign: -1, num: 3n, den: 10n }, i.e. -sqrt(3/10)
 */
export function exactSqrt(sign: number, num: bigint, den: bigint): ExactSqrt {
	if (num < 0n) throw new RangeError(`exactSqrt: the radicand numerator must be ≥ 0, got ${num}`);
	if (den <= 0n) throw new RangeError(`exactSqrt: the radicand denominator must be > 0, got ${den}`);
	if (num === 0n || sign === 0) return EXACT_ZERO;
	const g = gcd(num, den);
	return { sign: sign < 0 ? -1 : 1, num: num / g, den: den / g };
}

/**
 * A signed rational r written as sign(r) × sqrt(r²).
 * @example exactFromRational(rational(-1n, 2n)) // -sqrt(1/4)
 */
export function exactFromRational(r: Rational): ExactSqrt {
	if (r.num === 0n) return EXACT_ZERO;
	return exactSqrt(r.num < 0n ? -1 : 1, r.num * r.num, r.den * r.den);
}

/**
 * Product of two exact square roots: (s₁√q₁)(s₂√q₂) = s₁s₂ √(q₁q₂).
 * @example exactMultiply(exactSqrt(1, 1n, 2n), exactSqrt(-1, 2n, 3n)) // -sqrt(1/3)
 */
export function exactMultiply(a: ExactSqrt, b: ExactSqrt): ExactSqrt {
	return exactSqrt(a.sign * b.sign, a.num * b.num, a.den * b.den);
}

/**
 * x scaled by a signed rational r: sign(r)·x.sign × sqrt(x.num r.num² / (x.den r.den²)).
 * @example exactScale(exactSqrt(1, 1n, 3n), rational(-3n, 2n)) // -sqrt(3/4)
 */
export function exactScale(x: ExactSqrt, r: Rational): ExactSqrt {
	if (r.num === 0n) return EXACT_ZERO;
	const s = r.num < 0n ? -x.sign : x.sign;
	return exactSqrt(s, x.num * r.num * r.num, x.den * r.den * r.den);
}

/** -x. @example exactNegate(exactSqrt(1, 1n, 2n)) // -sqrt(1/2) */
export function exactNegate(x: ExactSqrt): ExactSqrt {
	return x.sign === 0 ? EXACT_ZERO : { sign: x.sign === 1 ? -1 : 1, num: x.num, den: x.den };
}

/** True when a and b are the same exact number (both are kept in lowest terms). */
export function exactEquals(a: ExactSqrt, b: ExactSqrt): boolean {
	return a.sign === b.sign && a.num === b.num && a.den === b.den;
}

function bitLength(x: bigint): number {
	return x === 0n ? 0 : x.toString(2).length;
}

/** x · 2^e without overflowing or underflowing Math.pow in between. */
function timesPowerOfTwo(x: number, e: number): number {
	while (e > 1000) {
		x *= 2 ** 1000;
		e -= 1000;
	}
	while (e < -1000) {
		x *= 2 ** -1000;
		e += 1000;
	}
	return x * 2 ** e;
}

/** Bits kept in the scaled quotient num·2^s/den before the square root (double precision needs 53). */
const QUOTIENT_BITS = 120;

/**
 * The nearest double to sign × sqrt(num/den), accurate to about one unit in the
 * last place even when num and den have thousands of digits (the quotient is
 * formed in BigInt arithmetic scaled by a power of 4, so nothing overflows).
 * @example exactToNumber(exactSqrt(-1, 3n, 10n)) // -0.5477225575051661
 */
export function exactToNumber(x: ExactSqrt): number {
	if (x.sign === 0) return 0;
	let s = QUOTIENT_BITS - (bitLength(x.num) - bitLength(x.den));
	if (s % 2 !== 0) s += 1;
	const q = s >= 0 ? (x.num << BigInt(s)) / x.den : x.num / (x.den << BigInt(-s));
	return x.sign * timesPowerOfTwo(Math.sqrt(Number(q)), -s / 2);
}

/**
 * x² as a string "p/q", or "p" when the denominator is 1.
 * @example exactSquaredString(exactSqrt(-1, 3n, 10n)) // "3/10"
 */
export function exactSquaredString(x: ExactSqrt): string {
	if (x.sign === 0) return '0';
	return x.den === 1n ? `${x.num}` : `${x.num}/${x.den}`;
}

/** The integer square root of n when n is a perfect square, else null (Newton iteration on BigInt). */
export function perfectSquareRoot(n: bigint): bigint | null {
	if (n < 0n) return null;
	if (n < 2n) return n;
	let x = 1n << BigInt(Math.ceil(bitLength(n) / 2));
	for (;;) {
		const y = (x + n / x) >> 1n;
		if (y >= x) break;
		x = y;
	}
	return x * x === n ? x : null;
}

/**
 * Readable exact form: "0", "-1/2" when num and den are perfect squares, otherwise
 * "sqrt(3/10)" or "-sqrt(2)".
 * @example exactString(exactSqrt(-1, 3n, 10n)) // "-sqrt(3/10)"
 */
export function exactString(x: ExactSqrt): string {
	if (x.sign === 0) return '0';
	const minus = x.sign < 0 ? '-' : '';
	const rn = perfectSquareRoot(x.num);
	const rd = perfectSquareRoot(x.den);
	if (rn !== null && rd !== null) return rd === 1n ? `${minus}${rn}` : `${minus}${rn}/${rd}`;
	return `${minus}sqrt(${exactSquaredString(x)})`;
}

/** JSON-safe form of an exact value: sign, p/q of the square, the float and a readable text. */
export interface ExactJson {
	sign: -1 | 0 | 1;
	squared: string;
	value: number;
	text: string;
}

/**
 * An ExactSqrt as plain JSON data (BigInt is not JSON).
 * @example exactJson(exactSqrt(-1, 1n, 3n)) // { sign: -1, squared: '1/3', value: -0.577…, text: '-sqrt(1/3)' }
 */
export function exactJson(x: ExactSqrt): ExactJson {
	return { sign: x.sign, squared: exactSquaredString(x), value: exactToNumber(x), text: exactString(x) };
}
