/**
 * Half-integer helpers: the engine stores j, m, S, J as twice their value.
 */

/** "3/2" for 3, "2" for 4, "-1/2" for -1, "0" for 0. */
export function halfString(twice: number): string {
	if (!Number.isInteger(twice)) throw new RangeError(`halfString expects an integer (twice the value), got ${twice}`);
	return twice % 2 === 0 ? String(twice / 2) : `${twice}/2`;
}

/**
 * Parses "3/2", "2", "-1/2", "1.5" into twice its value (3, 4, -1, 3).
 * Throws a RangeError naming the input when it is not an integer or half-integer.
 */
export function parseHalf(text: string): number {
	const t = text.trim();
	const frac = /^([+-]?\d+)\s*\/\s*2$/.exec(t);
	if (frac) return Number(frac[1]);
	if (/^[+-]?\d+(\.0+)?$/.test(t)) return 2 * Number(t);
	if (/^[+-]?\d+\.50*$/.test(t)) return Math.round(2 * Number(t));
	throw new RangeError(`"${text}" is not an integer or half-integer (write e.g. 2, 3/2 or -1/2)`);
}
