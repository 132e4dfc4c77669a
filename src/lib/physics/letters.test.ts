import { describe, expect, it } from 'vitest';
import { L_LETTERS, MAX_LETTER_L, TERM_LETTERS, lLetter, letterToL, termLetter, termLetterToL } from './letters';

describe('orbital letters', () => {
	it('l = 0 … 16 are s p d f g h i k l m n o q r t u v (j skipped)', () => {
		// Source: Russell, Shenstone & Turner, Phys. Rev. 33, 900 (1929); the sequence used by
		// Condon & Shortley (1935) and Cowan (1981).
		const expected = 's p d f g h i k l m n o q r t u v'.split(' ');
		expect(Array.from({ length: MAX_LETTER_L + 1 }, (_, l) => lLetter(l))).toEqual(expected);
		expect(L_LETTERS).not.toContain('j');
	});

	it('k is l = 7 and l is l = 8, because j is skipped', () => {
		// Source: as above (general fact of the notation).
		expect(letterToL('k')).toBe(7);
		expect(letterToL('l')).toBe(8);
		expect(letterToL('j')).toBeNull();
	});

	it('every letter maps back to its l', () => {
		for (let l = 0; l <= MAX_LETTER_L; l++) expect(letterToL(lLetter(l))).toBe(l);
	});

	it('capitals are not orbital letters, and strings of more than one character are rejected', () => {
		expect(letterToL('D')).toBeNull();
		expect(letterToL('dd')).toBeNull();
	});

	it('l beyond the table throws a RangeError naming the allowed range', () => {
		expect(() => lLetter(17)).toThrow(/from 0 to 16/);
		expect(() => lLetter(-1)).toThrow(RangeError);
		expect(() => lLetter(1.5)).toThrow(RangeError);
	});
});

describe('term letters', () => {
	it('L = 0 … 16 are S P D F G H I K L M N O Q R T U V', () => {
		// Source: Russell, Shenstone & Turner (1929), capital letters for terms.
		expect(TERM_LETTERS).toBe('SPDFGHIKLMNOQRTUV');
		expect(termLetter(6)).toBe('I');
		expect(termLetter(7)).toBe('K');
	});

	it('L beyond the table is written out as [L=25]', () => {
		// Common practice, no source: the letters run out at V (L = 16).
		expect(termLetter(17)).toBe('[L=17]');
		expect(termLetter(25)).toBe('[L=25]');
		expect(termLetterToL('[L=25]')).toBe(25);
	});

	it('term letters map back to L', () => {
		for (let L = 0; L <= 20; L++) expect(termLetterToL(termLetter(L))).toBe(L);
		expect(termLetterToL('J')).toBeNull();
	});

	it('a negative L throws', () => {
		expect(() => termLetter(-1)).toThrow(/non-negative integer/);
	});
});
