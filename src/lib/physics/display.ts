/**
 * Person-facing labels of terms and levels, written the way papers and reference tables print
 * them: the multiplicity 2S+1 as a superscript, the L letter, ° for odd parity, J as a subscript
 * (³P°₂, ⁴F₃/₂, ²P°₃/₂). Condon & Shortley (1935) and Cowan (1981) write terms this way; the °
 * for odd parity is the usual mark (Russell, Shenstone & Turner 1929 recommendation, from memory).
 * Machine keys ("3P2", "4F3/2") are elsewhere (terms.ts `termLabel`, `levelLabel`).
 */
import { halfString } from './half';
import { termLetter } from './letters';

const SUPER = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SUB = '₀₁₂₃₄₅₆₇₈₉';

/** Digits of a number (or a text like "3/2") as superscripts; other characters stay. */
export function superscriptDigits(text: string | number): string {
	return String(text).replace(/\d/g, (d) => SUPER[Number(d)]);
}

/** Digits as subscripts, the slash kept: "3/2" → "₃/₂". */
export function subscriptDigits(text: string | number): string {
	return String(text).replace(/\d/g, (d) => SUB[Number(d)]);
}

/**
 * The term ^{2S+1}L with ° when odd, as plain Unicode text.
 * Throws RangeError when L has no letter.
 * @example termDisplay(7, 1, true) // '⁸P°'
 */
export function termDisplay(twoS: number, L: number, odd: boolean): string {
	return `${superscriptDigits(twoS + 1)}${termLetter(L)}${odd ? '°' : ''}`;
}

/**
 * A level ^{2S+1}L°_J as plain Unicode text, J as a subscript.
 * Throws RangeError when L has no letter or 2J is not an integer.
 * @example levelDisplay(1, 1, 3, true) // '²P°₃/₂'
 */
export function levelDisplay(twoS: number, L: number, twoJ: number, odd: boolean): string {
	return `${termDisplay(twoS, L, odd)}${subscriptDigits(halfString(twoJ))}`;
}
