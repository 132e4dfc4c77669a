/**
 * Spectroscopic letters for orbital angular momentum.
 *
 * The sequence s p d f continues alphabetically from g, skipping j (and any
 * letter already used: p and s are not reused), the notation recommended by
 * Russell, Shenstone and Turner (Phys. Rev. 33, 900, 1929) and used throughout
 * Condon & Shortley (1935) and Cowan (1981): s p d f g h i k l m n o q r t u v
 * for l = 0 … 16.
 * Term symbols use the same letters in capitals (S P D F G H I K L …).
 */

/** Lowercase letters for one-electron l = 0, 1, 2, …: `L_LETTERS[l]`. */
export const L_LETTERS = 'spdfghiklmnoqrtuv';

/** Uppercase letters for total L = 0, 1, 2, …: `TERM_LETTERS[L]`. */
export const TERM_LETTERS = L_LETTERS.toUpperCase();

/** Largest l that has a letter (16, 'v'). */
export const MAX_LETTER_L = L_LETTERS.length - 1;

/**
 * The lowercase letter of a one-electron orbital angular momentum l.
 * Throws RangeError when l is not an integer from 0 to MAX_LETTER_L.
 * @example lLetter(3) // 'f'
 */
export function lLetter(l: number): string {
	if (!Number.isInteger(l) || l < 0 || l > MAX_LETTER_L) {
		throw new RangeError(
			`l = ${l} has no letter: l must be an integer from 0 to ${MAX_LETTER_L} (letters ${L_LETTERS.split('').join(' ')})`
		);
	}
	return L_LETTERS[l];
}

/**
 * The l of a lowercase orbital letter ('d' → 2), or null when the character is not one of
 * s p d f g h i k l m n o q r t u v. Capitals are not accepted (they name terms, not orbitals).
 * @example letterToL('k') // 7
 */
export function letterToL(ch: string): number | null {
	if (ch.length !== 1) return null;
	const i = L_LETTERS.indexOf(ch);
	return i < 0 ? null : i;
}

/**
 * The capital letter of a total orbital angular momentum L; beyond the table (L > 16)
 * the value is written out as "[L=25]". Throws RangeError for a negative or non-integer L.
 * @example termLetter(3) // 'F'
 * @example termLetter(25) // '[L=25]'
 */
export function termLetter(L: number): string {
	if (!Number.isInteger(L) || L < 0) throw new RangeError(`L = ${L} is not allowed: L must be a non-negative integer`);
	return L < TERM_LETTERS.length ? TERM_LETTERS[L] : `[L=${L}]`;
}

/**
 * The L of a capital term letter ('F' → 3) or of the written-out form "[L=25]"; null otherwise.
 * @example termLetterToL('K') // 7
 */
export function termLetterToL(text: string): number | null {
	const m = /^\[L=(\d+)\]$/.exec(text);
	if (m) return Number(m[1]);
	if (text.length !== 1) return null;
	const i = TERM_LETTERS.indexOf(text);
	return i < 0 ? null : i;
}
