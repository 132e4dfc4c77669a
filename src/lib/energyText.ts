/**
 * The one reader of energy text (observed energies and uncertainties in cm⁻¹), used by the entry
 * form, the API and the paste-a-column tool. Pure: plain text in, plain data out.
 *
 * Accepted: an optional sign (ASCII "-", "+", or the typographic minus U+2212 that the app itself
 * prints), digits, a point as the decimal mark, and spaces, no-break spaces or thin spaces as
 * digit-group separators in groups of three (SI Brochure 9th ed. §5.4.4: "19 000.123 45").
 * Refused, with a message that says why: a comma (it is a decimal mark in some countries and a
 * thousands separator in others, so "17,300" could be 17.3 or 17300), exponents, and anything else.
 *
 * What is kept is the `text`: the digits exactly as entered, with the group separators taken out
 * and the sign written as ASCII "-", so 1880 stays "1880" and 19500.12345 is never rounded.
 */

/** The separators allowed between digit groups: space, no-break space, thin space, narrow no-break space. */
const GROUP_SEPARATORS = /[ \u00a0\u2009\u202f]/;
const MINUS = '\u2212';

export type EnergyText = { ok: true; value: number; text: string; decimals: number } | { ok: false; message: string };

const refuse = (message: string): EnergyText => ({ ok: false, message });

/** Groups of digits must be 1–3 then 3, 3, … before the point and 3, 3, …, 1–3 after it. */
function groupsOk(groups: string[], side: 'integer' | 'fraction'): boolean {
	if (groups.length === 1) return true;
	return groups.every((g, i) => {
		const edge = side === 'integer' ? i === 0 : i === groups.length - 1;
		return edge ? g.length >= 1 && g.length <= 3 : g.length === 3;
	});
}

/**
 * Reads an energy as typed. `what` names the field in messages ("Observed energy", "Uncertainty").
 * Returns null for empty text (no value), otherwise `{ ok, value, text, decimals }` or `{ ok: false, message }`.
 * @example parseEnergyText('19 000') // { ok: true, value: 19000, text: '19000', decimals: 0 }
 * @example parseEnergyText('−12400.50').text // '-12400.50'
 * @example parseEnergyText('17,300').ok // false — a comma is ambiguous
 */
export function parseEnergyText(input: string, what = 'Energy'): EnergyText | null {
	const raw = String(input ?? '').trim();
	if (raw === '') return null;
	if (raw.length > 40) return refuse(`${what} is too long: at most 40 characters`);
	if (raw.includes(','))
		return refuse(
			`${what} "${raw}" has a comma, which is ambiguous (a decimal mark in some countries, a thousands separator in others): write a point for the decimal mark (17.3) and leave out thousands separators or use spaces (17300 or 17 300)`
		);
	if (/[eE]/.test(raw)) return refuse(`${what} "${raw}": write the number in full in cm⁻¹ (e.g. 12400.5), without an exponent`);
	let body = raw;
	let sign = '';
	if (body[0] === '-' || body[0] === MINUS || body[0] === '+') {
		sign = body[0] === '+' ? '' : '-';
		body = body.slice(1).trimStart();
	}
	const [intPart, fracPart, ...more] = body.split('.');
	if (more.length > 0) return refuse(`${what} "${raw}" has more than one decimal point`);
	const split = (s: string) => s.split(GROUP_SEPARATORS);
	const intGroups = split(intPart);
	const fracGroups = fracPart === undefined ? [] : split(fracPart);
	const digitsOnly = (g: string) => /^\d+$/.test(g);
	if (!intGroups.every(digitsOnly) || !fracGroups.every(digitsOnly))
		return refuse(
			`${what} "${raw}" is not a number: use digits, a point as the decimal mark, an optional minus sign, and spaces between groups of three digits`
		);
	if (!groupsOk(intGroups, 'integer') || !groupsOk(fracGroups, 'fraction'))
		return refuse(`${what} "${raw}": spaces may only separate groups of three digits (19 000.123 45)`);
	const intDigits = intGroups.join('');
	const fracDigits = fracGroups.join('');
	const text = `${sign}${intDigits}${fracPart === undefined ? '' : `.${fracDigits}`}`;
	return { ok: true, value: Number(text), text, decimals: fracDigits.length };
}

/**
 * The text of a number that arrived as a JSON number: its shortest round-trip decimal, written out
 * without an exponent (1e-7 → "0.0000001"). Throws RangeError for NaN or ±Infinity.
 * @example numberText(1880) // '1880'
 */
export function numberText(value: number): string {
	if (!Number.isFinite(value)) throw new RangeError(`numberText: ${value} is not a finite number`);
	const s = String(value);
	const m = /^(-?)(\d)(?:\.(\d+))?e([+-]\d+)$/.exec(s);
	if (!m) return s;
	const [, sign, lead, rest = '', expText] = m;
	const exp = Number(expText);
	const digits = lead + rest;
	if (exp < 0) return `${sign}0.${'0'.repeat(-exp - 1)}${digits}`;
	return `${sign}${digits.padEnd(exp + 1, '0').slice(0, exp + 1)}${digits.length > exp + 1 ? `.${digits.slice(exp + 1)}` : ''}`;
}

/**
 * An energy text as people read it: the digits as entered, with the typographic minus.
 * @example showEnergy('-12400.50') // '−12400.50'
 */
export function showEnergy(text: string | null | undefined): string {
	if (text === null || text === undefined) return '';
	return text.startsWith('-') ? MINUS + text.slice(1) : text;
}
