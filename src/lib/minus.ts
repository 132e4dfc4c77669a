/**
 * Numbers as people read them in print: a true minus sign (U+2212) instead of the hyphen-minus.
 * @example withMinus(-3) // '−3'
 * @example withMinus('-1/2') // '−1/2'
 */
export function withMinus(value: string | number | bigint): string {
	return String(value).replace(/-(?=[\d.])/g, '\u2212');
}
