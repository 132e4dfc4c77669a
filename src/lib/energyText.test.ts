/**
 * Energy text as typed. Digit grouping by spaces or thin spaces and the point as decimal mark follow
 * the SI Brochure (BIPM, 9th ed. 2019, §5.4.4); the typographic minus is U+2212 (Unicode standard).
 * That a comma is ambiguous is common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { numberText, parseEnergyText, showEnergy } from './energyText';

const ok = (text: string) => {
	const r = parseEnergyText(text);
	if (!r || !r.ok) throw new Error(`expected "${text}" to be read, got ${JSON.stringify(r)}`);
	return r;
};
const refused = (text: string) => {
	const r = parseEnergyText(text, 'Observed energy');
	if (!r || r.ok) throw new Error(`expected "${text}" to be refused`);
	return r.message;
};

describe('energies as typed', () => {
	it('keeps the digits entered: 1880 stays 1880, 19500.12345 is not rounded, 1880.0 keeps its decimal', () => {
		expect(ok('1880')).toEqual({ ok: true, value: 1880, text: '1880', decimals: 0 });
		expect(ok('19500.12345')).toMatchObject({ value: 19500.12345, text: '19500.12345', decimals: 5 });
		expect(ok('1880.0')).toMatchObject({ text: '1880.0', decimals: 1 });
	});

	it('reads spaces, no-break spaces and thin spaces between groups of three digits', () => {
		expect(ok('19 000').text).toBe('19000');
		expect(ok('19\u2009000').text).toBe('19000');
		expect(ok('19\u202f000.123\u200945').text).toBe('19000.12345');
		expect(ok('1\u00a0234\u00a0567').value).toBe(1234567);
	});

	it('reads the typographic minus (U+2212) and the ASCII minus alike', () => {
		expect(ok('−12400')).toMatchObject({ value: -12400, text: '-12400' });
		expect(ok('-12 400.5')).toMatchObject({ value: -12400.5, text: '-12400.5' });
		expect(ok('+5').text).toBe('5');
	});

	it('refuses a comma and says why: 17,300 could be 17.3 or 17300', () => {
		expect(refused('17,300')).toMatch(/comma, which is ambiguous/);
		expect(refused('17,3')).toMatch(/point for the decimal mark/);
	});

	it('refuses misplaced group spaces, exponents, two points and words, saying what is allowed', () => {
		expect(refused('1 90')).toMatch(/groups of three digits/);
		expect(refused('1.2e4')).toMatch(/without an exponent/);
		expect(refused('1.2.3')).toMatch(/more than one decimal point/);
		expect(refused('about 12')).toMatch(/not a number/);
		expect(refused('--5')).toMatch(/not a number/);
	});

	it('empty text is no value', () => {
		expect(parseEnergyText('   ')).toBeNull();
	});

	it('shows negative values with the typographic minus', () => {
		expect(showEnergy('-12400.50')).toBe('−12400.50');
		expect(showEnergy('1880')).toBe('1880');
	});

	it('a JSON number becomes its shortest decimal text without an exponent', () => {
		expect(numberText(1880)).toBe('1880');
		expect(numberText(19500.12345)).toBe('19500.12345');
		expect(numberText(1e-7)).toBe('0.0000001');
		expect(numberText(1.5e-7)).toBe('0.00000015');
		expect(numberText(1e21)).toBe('1000000000000000000000');
	});

	it('property: every number text reads back to the same number and the same text', () => {
		fc.assert(
			// Energies in cm⁻¹ between 10⁻⁶ and 10⁷ in size, the range the notes accept.
			fc.property(
				fc.double({ min: -1e7, max: 1e7, noNaN: true }).filter((x) => Math.abs(x) >= 1e-6),
				(x) => {
					const text = numberText(x);
					const r = ok(text);
					expect(r.value).toBe(x);
					expect(r.text).toBe(text);
				}
			)
		);
	});
});
