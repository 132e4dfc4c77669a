/**
 * The Condon–Shortley angular factors c^k(l m, l' m') of the Coulomb interaction, from 3j symbols:
 *   c^k(l m, l' m') = (−1)^m √((2l+1)(2l'+1)) (l k l'; 0 0 0) (l k l'; −m m−m' m')
 * (Condon & Shortley 1935, §6⁸ and Table 1⁶; Cowan 1981, eq. 11.23; Slater 1960, App. 20).
 * Values come from the engine's exact 3j symbols, converted to doubles once and cached.
 */
import { wigner3jFloat } from './wigner';

const cache = new Map<number, number>();

/**
 * c^k(l m, l' m'); zero when the triangle (l k l') or the parity l + k + l' even fails.
 * Throws RangeError from the 3j symbol when |m| > l.
 * @example ck(1, 1, 1, 1, 2) // −0.2 (Condon & Shortley Table 1⁶: c²(p1, p1) = −1/5)
 */
export function ck(l: number, m: number, l2: number, m2: number, k: number): number {
	const key = (((l * 64 + l2) * 64 + k) * 128 + (m + 63)) * 128 + (m2 + 63);
	const hit = cache.get(key);
	if (hit !== undefined) return hit;
	let value = 0;
	if ((l + k + l2) % 2 === 0 && k >= Math.abs(l - l2) && k <= l + l2 && Math.abs(m - m2) <= k) {
		const sign = m % 2 === 0 ? 1 : -1;
		value =
			sign *
			Math.sqrt((2 * l + 1) * (2 * l2 + 1)) *
			wigner3jFloat(2 * l, 2 * k, 2 * l2, 0, 0, 0) *
			wigner3jFloat(2 * l, 2 * k, 2 * l2, -2 * m, 2 * (m - m2), 2 * m2);
	}
	cache.set(key, value);
	return value;
}
