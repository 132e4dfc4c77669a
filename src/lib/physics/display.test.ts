import { describe, expect, it } from 'vitest';
import { levelDisplay, subscriptDigits, superscriptDigits, termDisplay } from './display';

describe('person-facing labels', () => {
	it('odd terms carry ° after the letter: ⁸P°, even ones do not: ⁶D', () => {
		// Notation of Condon & Shortley (1935) and Cowan (1981): ° marks odd parity.
		expect(termDisplay(7, 1, true)).toBe('⁸P°');
		expect(termDisplay(5, 2, false)).toBe('⁶D');
	});

	it('levels put J as a subscript after the mark: ²P°₃/₂, ³P₀, ¹⁰F₁₁/₂', () => {
		// ²P°₃/₂: the Ne II ground level as Cowan (1981) writes it (from memory).
		expect(levelDisplay(1, 1, 3, true)).toBe('²P°₃/₂');
		expect(levelDisplay(2, 1, 0, false)).toBe('³P₀');
		expect(levelDisplay(9, 3, 11, false)).toBe('¹⁰F₁₁/₂');
	});

	it('digits map one by one; other characters stay', () => {
		expect(superscriptDigits('12')).toBe('¹²');
		expect(subscriptDigits('5/2')).toBe('₅/₂');
	});
});
