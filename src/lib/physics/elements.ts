/**
 * Elements and ionic species, and their ground configurations.
 *
 * A species is an element and a charge, written the spectroscopic way (Fe II = Fe⁺, the
 * spectrum number being the charge plus one) or as Fe+, Fe 1+, Nd3+. Ground configurations of
 * neutral atoms follow the Madelung (n + l, then n) filling order, corrected by a table of the
 * known exceptions for Z ≤ 103 taken from the ground configurations of the NIST Atomic Spectra
 * Database / CRC Handbook periodic table (values written in from memory of that table).
 * Positive ions take electrons away from the outermost valence subshells first; a short table of
 * ions whose observed ground configuration differs from that rule overrides it.
 */
import { InputError } from './input-error';
import type { Configuration, Subshell } from './types';
import {
	NOBLE_GAS_CORES,
	configurationOf,
	largestCore,
	parseConfiguration,
	formatConfiguration,
	subshellCapacity,
	bySubshellOrder
} from './parse';

/** Chemical symbols for Z = 1 … 118 (IUPAC). `ELEMENT_SYMBOLS[Z - 1]`. */
export const ELEMENT_SYMBOLS: readonly string[] = Object.freeze(
	'H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Ge As Se Br Kr Rb Sr Y Zr Nb Mo Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe Cs Ba La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au Hg Tl Pb Bi Po At Rn Fr Ra Ac Th Pa U Np Pu Am Cm Bk Cf Es Fm Md No Lr Rf Db Sg Bh Hs Mt Ds Rg Cn Nh Fl Mc Lv Ts Og'.split(
		' '
	)
);

/** English element names for Z = 1 … 118 (IUPAC spelling). `ELEMENT_NAMES[Z - 1]`. */
export const ELEMENT_NAMES: readonly string[] = Object.freeze(
	'Hydrogen|Helium|Lithium|Beryllium|Boron|Carbon|Nitrogen|Oxygen|Fluorine|Neon|Sodium|Magnesium|Aluminium|Silicon|Phosphorus|Sulfur|Chlorine|Argon|Potassium|Calcium|Scandium|Titanium|Vanadium|Chromium|Manganese|Iron|Cobalt|Nickel|Copper|Zinc|Gallium|Germanium|Arsenic|Selenium|Bromine|Krypton|Rubidium|Strontium|Yttrium|Zirconium|Niobium|Molybdenum|Technetium|Ruthenium|Rhodium|Palladium|Silver|Cadmium|Indium|Tin|Antimony|Tellurium|Iodine|Xenon|Caesium|Barium|Lanthanum|Cerium|Praseodymium|Neodymium|Promethium|Samarium|Europium|Gadolinium|Terbium|Dysprosium|Holmium|Erbium|Thulium|Ytterbium|Lutetium|Hafnium|Tantalum|Tungsten|Rhenium|Osmium|Iridium|Platinum|Gold|Mercury|Thallium|Lead|Bismuth|Polonium|Astatine|Radon|Francium|Radium|Actinium|Thorium|Protactinium|Uranium|Neptunium|Plutonium|Americium|Curium|Berkelium|Californium|Einsteinium|Fermium|Mendelevium|Nobelium|Lawrencium|Rutherfordium|Dubnium|Seaborgium|Bohrium|Hassium|Meitnerium|Darmstadtium|Roentgenium|Copernicium|Nihonium|Flerovium|Moscovium|Livermorium|Tennessine|Oganesson'.split(
		'|'
	)
);

/** Largest atomic number known to the module. */
export const MAX_Z = ELEMENT_SYMBOLS.length;
/** Largest Z whose neutral ground configuration is checked against the exception table. */
export const MAX_TABULATED_Z = 103;

/** An element with a charge (0 for the neutral atom). */
export interface Species {
	Z: number;
	symbol: string;
	name: string;
	charge: number;
}

/** A ground configuration with where it comes from and, when it is not certain, why. */
export interface GroundConfiguration {
	configuration: Configuration;
	/** Normalized notation with a noble-gas core, e.g. "[Ar] 3d6 4s2". */
	notation: string;
	source: string;
	/** null when the configuration is the tabulated observed one; otherwise a warning to show. */
	caution: string | null;
}

/** A species that cannot be read; `token` is the offending part of the input. */
export class SpeciesError extends InputError {
	constructor(message: string, token: string) {
		super(message, token);
		this.name = 'SpeciesError';
	}
}

/**
 * Neutral atoms whose ground configuration differs from the Madelung order, Z ≤ 103.
 * Source: ground configurations of the NIST Atomic Spectra Database periodic table and the
 * CRC Handbook table "Electronic configuration of neutral atoms in the ground state"
 * (written in from memory of those tables). Lr (7p instead of 6d) is marked tentative there.
 */
const NEUTRAL_EXCEPTIONS: Readonly<Record<string, string>> = {
	Cr: '[Ar] 3d5 4s',
	Cu: '[Ar] 3d10 4s',
	Nb: '[Kr] 4d4 5s',
	Mo: '[Kr] 4d5 5s',
	Ru: '[Kr] 4d7 5s',
	Rh: '[Kr] 4d8 5s',
	Pd: '[Kr] 4d10',
	Ag: '[Kr] 4d10 5s',
	La: '[Xe] 5d 6s2',
	Ce: '[Xe] 4f 5d 6s2',
	Gd: '[Xe] 4f7 5d 6s2',
	Pt: '[Xe] 4f14 5d9 6s',
	Au: '[Xe] 4f14 5d10 6s',
	Ac: '[Rn] 6d 7s2',
	Th: '[Rn] 6d2 7s2',
	Pa: '[Rn] 5f2 6d 7s2',
	U: '[Rn] 5f3 6d 7s2',
	Np: '[Rn] 5f4 6d 7s2',
	Cm: '[Rn] 5f7 6d 7s2',
	Lr: '[Rn] 5f14 7s2 7p'
};

/**
 * Positive ions whose observed ground configuration differs from the removal rule of
 * `groundConfiguration`. Source: ground levels in the NIST Atomic Spectra Database (from memory;
 * only cases the author is sure of are listed: V II 3d⁴ a⁵D, Co II 3d⁸ a³F, Ni II 3d⁹ ²D,
 * Y II 5s² ¹S, La II 5d² a³F, Ce II 4f 5d² ⁴H°, Ce III 4f² ³H, Hf II 5d 6s² ²D, Lu II 6s² ¹S,
 * Lu III 6s ²S, Ac II 7s² ¹S, Th III 5f 6d ³H°, Th IV 5f ²F°, U II 5f³ 7s² ⁴I°).
 * Added after checking the actinide ions where the removal rule's guess differs from those
 * ground levels (also from memory of NIST ASD): Pa II 5f² 7s² ³H₄ (the rule gives 5f² 6d 7s),
 * Ac III 7s ²S₁/₂ (the rule gives 6d), U III 5f⁴ ⁵I₄ (the rule gives 5f³ 6d).
 */
const ION_EXCEPTIONS: Readonly<Record<string, string>> = {
	'V II': '[Ar] 3d4',
	'Co II': '[Ar] 3d8',
	'Ni II': '[Ar] 3d9',
	'Y II': '[Kr] 5s2',
	'La II': '[Xe] 5d2',
	'Ce II': '[Xe] 4f 5d2',
	'Ce III': '[Xe] 4f2',
	'Hf II': '[Xe] 4f14 5d 6s2',
	'Lu II': '[Xe] 4f14 6s2',
	'Lu III': '[Xe] 4f14 6s',
	'Ac II': '[Rn] 7s2',
	'Th III': '[Rn] 5f 6d',
	'Th IV': '[Rn] 5f',
	'U II': '[Rn] 5f3 7s2',
	'Ac III': '[Rn] 7s',
	'Pa II': '[Rn] 5f2 7s2',
	'U III': '[Rn] 5f4'
};

/** Shown with every ion not in the table of observed ion ground configurations. */
export const ION_CAUTION =
	'Ground configurations of ions can differ from this rule (for example V II is 3d4, not 3d3 4s, and Ni II is 3d9); check against observed data such as the NIST Atomic Spectra Database before relying on it.';

const SUPERHEAVY_CAUTION =
	'Beyond Z = 103 the ground configuration is given by the Madelung (n + l, then n) order only; it is predicted, not measured, and relativistic effects may change it.';

const LR_CAUTION =
	'The 7p ground configuration of Lr is tentative in the reference tables (predicted and supported by ionization-energy measurements).';

const ROMAN = /^M{0,3}(CM|CD|D?C{0,3})(XC|XL|L?X{0,3})(IX|IV|V?I{0,3})$/;
const ROMAN_VALUES: Record<string, number> = { I: 1, V: 5, X: 10, L: 50, C: 100, D: 500, M: 1000 };

/**
 * Value of a canonical capital Roman numeral ("XIV" → 14), or null when it is not one.
 * @example romanValue('IV') // 4
 */
export function romanValue(text: string): number | null {
	if (text.length === 0 || !ROMAN.test(text)) return null;
	let v = 0;
	for (let i = 0; i < text.length; i++) {
		const cur = ROMAN_VALUES[text[i]];
		const next = i + 1 < text.length ? ROMAN_VALUES[text[i + 1]] : 0;
		v += cur < next ? -cur : cur;
	}
	return v;
}

/**
 * Capital Roman numeral of 1 … 3999. Throws RangeError otherwise.
 * @example toRoman(26) // 'XXVI'
 */
export function toRoman(n: number): string {
	if (!Number.isInteger(n) || n < 1 || n > 3999) throw new RangeError(`toRoman: n must be an integer from 1 to 3999, got ${n}`);
	const table: [number, string][] = [
		[1000, 'M'],
		[900, 'CM'],
		[500, 'D'],
		[400, 'CD'],
		[100, 'C'],
		[90, 'XC'],
		[50, 'L'],
		[40, 'XL'],
		[10, 'X'],
		[9, 'IX'],
		[5, 'V'],
		[4, 'IV'],
		[1, 'I']
	];
	let out = '';
	for (const [v, s] of table)
		while (n >= v) {
			out += s;
			n -= v;
		}
	return out;
}

/**
 * The spectroscopic label of a species: element symbol and spectrum number, "Fe II" for Fe⁺.
 * @example speciesLabel({ Z: 26, symbol: 'Fe', name: 'Iron', charge: 1 }) // 'Fe II'
 */
export function speciesLabel(species: Species): string {
	return `${species.symbol} ${toRoman(species.charge + 1)}`;
}

/**
 * The element with atomic number Z. Throws RangeError for Z outside 1 … 118.
 * @example elementByZ(26).symbol // 'Fe'
 */
export function elementByZ(Z: number): { Z: number; symbol: string; name: string } {
	if (!Number.isInteger(Z) || Z < 1 || Z > MAX_Z) throw new RangeError(`Z = ${Z} is out of range: Z must be an integer from 1 to ${MAX_Z}`);
	return { Z, symbol: ELEMENT_SYMBOLS[Z - 1], name: ELEMENT_NAMES[Z - 1] };
}

function findElement(word: string): number | null {
	const exact = ELEMENT_SYMBOLS.indexOf(word);
	if (exact >= 0) return exact + 1;
	return null;
}

function findElementLoose(word: string): number | null {
	const w = word.toLowerCase();
	const bySymbol = ELEMENT_SYMBOLS.findIndex((s) => s.toLowerCase() === w);
	if (bySymbol >= 0) return bySymbol + 1;
	const byName = ELEMENT_NAMES.findIndex(
		(s) => s.toLowerCase() === w || (w === 'aluminum' && s === 'Aluminium') || (w === 'cesium' && s === 'Caesium')
	);
	return byName >= 0 ? byName + 1 : null;
}

const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';

function chargeOf(rest: string, symbol: string): number {
	const r = rest.trim();
	if (r === '' || r === '0' || r === '0+') return 0;
	if (/^[IVXLCDM]+$/.test(r)) {
		const v = romanValue(r);
		if (v === null) {
			throw new SpeciesError(
				`"${r}" is not a valid Roman numeral: write the spectrum number as I, II, III, IV, … (${symbol} II is ${symbol}+)`,
				r
			);
		}
		return v - 1;
	}
	if (/^[ivxlcdm]+$/.test(r)) {
		throw new SpeciesError(`write the spectrum number in capital Roman numerals: "${symbol} ${r.toUpperCase()}", not "${r}"`, r);
	}
	let m = /^(\d*)\s*([+-])$/.exec(r) ?? /^([+-])\s*(\d+)$/.exec(r);
	if (m) {
		const digits = m[1] === '+' || m[1] === '-' ? m[2] : m[1];
		const sign = m[1] === '+' || m[1] === '-' ? m[1] : m[2];
		const size = digits === '' ? 1 : Number(digits);
		if (sign === '-' && size > 0)
			throw new SpeciesError(`negative ions are not supported ("${r}"): give a neutral atom or a positive ion`, r);
		return size;
	}
	if (/^\++$/.test(r)) return r.length;
	if (/^-+$/.test(r)) throw new SpeciesError(`negative ions are not supported ("${r}"): give a neutral atom or a positive ion`, r);
	m = /^\^?\{?([⁰¹²³⁴⁵⁶⁷⁸⁹]*)([⁺⁻])\}?$/.exec(r);
	if (m) {
		if (m[2] === '⁻') throw new SpeciesError(`negative ions are not supported ("${r}"): give a neutral atom or a positive ion`, r);
		return m[1] === ''
			? 1
			: Number(
					m[1]
						.split('')
						.map((c) => SUPERSCRIPT.indexOf(c))
						.join('')
				);
	}
	throw new SpeciesError(
		`cannot read the charge "${r}": write a spectrum number (${symbol} II) or a charge (${symbol}+, ${symbol} 2+, ${symbol}3+)`,
		r
	);
}

/**
 * Reads a species: an element symbol (or English name) followed by a spectrum number in capital
 * Roman numerals ("Fe II" = Fe⁺, "O" or "Fe I" = neutral) or a charge ("Fe+", "Fe 1+", "Nd3+",
 * "Fe++", "Nd³⁺"). Throws SpeciesError (with `token`) for an empty text, an unknown element, a
 * bad Roman numeral, a negative charge, or a charge ≥ Z (no electrons left).
 * @example parseSpecies('Nd III') // { Z: 60, symbol: 'Nd', name: 'Neodymium', charge: 2 }
 */
export function parseSpecies(text: string): Species {
	const t = String(text ?? '').trim();
	if (t === '')
		throw new SpeciesError('the species is empty: write an element and a spectrum number or charge, e.g. "Fe II" or "Nd3+"', '');
	if (t.length > 40) throw new SpeciesError(`the species "${t.slice(0, 20)}…" is too long: at most 40 characters`, t.slice(0, 20));
	const m = /^(\p{L}+)(.*)$/u.exec(t);
	if (!m) throw new SpeciesError(`"${t}" does not start with an element symbol such as Fe or Nd`, t);
	let word = m[1];
	let rest = m[2];
	let Z = findElement(word);
	if (Z === null) {
		// Compact spectra such as "FeII": a symbol followed directly by a Roman numeral.
		const split = /^([A-Z][a-z]?)([IVXLCDM]+)$/.exec(word);
		if (split && findElement(split[1]) !== null) {
			word = split[1];
			rest = split[2] + rest;
			Z = findElement(word);
		} else {
			Z = findElementLoose(word);
		}
	}
	if (Z === null) throw new SpeciesError(`"${word}" is not an element: write a chemical symbol (H … Og) or an English element name`, word);
	const el = elementByZ(Z);
	const charge = chargeOf(rest, el.symbol);
	if (charge >= Z) {
		throw new SpeciesError(
			`${el.symbol} has ${Z} electron${Z === 1 ? '' : 's'}, so the charge must be from 0 to ${Z - 1} (spectra ${el.symbol} I to ${el.symbol} ${toRoman(Z)}); got charge ${charge}`,
			rest.trim()
		);
	}
	return { Z, symbol: el.symbol, name: el.name, charge };
}

/** Subshells in the Madelung order: by n + l, then by n (Madelung 1936; Klechkowski). */
function madelungOrder(): { n: number; l: number }[] {
	const list: { n: number; l: number }[] = [];
	for (let n = 1; n <= 8; n++) for (let l = 0; l < n && l <= 4; l++) list.push({ n, l });
	return list.sort((a, b) => a.n + a.l - (b.n + b.l) || a.n - b.n);
}
const MADELUNG = madelungOrder();

/**
 * Fills Z electrons in the Madelung (n + l, then n) order, without exceptions.
 * Throws RangeError for Z outside 1 … 118.
 * @example formatConfiguration(madelungConfiguration(26), { compactCore: true }) // '[Ar] 3d6 4s2'
 */
export function madelungConfiguration(Z: number): Configuration {
	elementByZ(Z);
	const subshells: Subshell[] = [];
	let left = Z;
	for (const { n, l } of MADELUNG) {
		if (left === 0) break;
		const k = Math.min(left, subshellCapacity(l));
		subshells.push({ n, l, occupancy: k });
		left -= k;
	}
	const cfg = configurationOf(subshells);
	return { ...cfg, core: largestCore(cfg.subshells) };
}

const CORE_SIZES: [string, number][] = [
	['He', 2],
	['Ne', 10],
	['Ar', 18],
	['Kr', 36],
	['Xe', 54],
	['Rn', 86]
];

/**
 * Removes `count` electrons, one at a time, from the outermost valence subshell: the valence
 * subshells are those outside the largest noble-gas core with fewer electrons than remain, and
 * the outermost is the one with the largest n, then the largest l (so 4p, then 4s, then 3d,
 * then 4f for a lanthanide). This is the usual textbook rule for positive ions.
 */
function removeElectrons(subshells: readonly Subshell[], count: number): Subshell[] {
	const list = subshells.map((s) => ({ ...s }));
	let electrons = list.reduce((a, s) => a + s.occupancy, 0);
	for (let k = 0; k < count; k++) {
		let core: readonly Subshell[] = [];
		for (const [name, size] of CORE_SIZES) if (size < electrons) core = NOBLE_GAS_CORES[name];
		let pick: Subshell | null = null;
		for (const s of list) {
			const inCore = core.find((c) => c.n === s.n && c.l === s.l)?.occupancy ?? 0;
			if (s.occupancy - inCore <= 0) continue;
			if (!pick || s.n > pick.n || (s.n === pick.n && s.l > pick.l)) pick = s;
		}
		if (!pick) throw new Error('internal error: no electron left to remove');
		pick.occupancy--;
		electrons--;
	}
	return list.filter((s) => s.occupancy > 0).sort(bySubshellOrder);
}

function withCore(cfg: Configuration): Configuration {
	return { ...cfg, core: largestCore(cfg.subshells) };
}

/**
 * Ground configuration of a neutral atom or positive ion.
 * Neutral atoms: Madelung (n + l, then n) order with the table of exceptions for Z ≤ 103 (NIST
 * ASD / CRC Handbook ground configurations); Z > 103 Madelung only, with a caution.
 * Positive ions: a table of observed ion ground configurations where the author is sure of it
 * (NIST ASD ground levels), otherwise the neutral configuration with electrons removed from the
 * outermost valence subshell first (largest n, then largest l: np, then ns, then (n−1)d, then
 * (n−2)f), with ION_CAUTION.
 * Throws SpeciesError when the text cannot be read (see `parseSpecies`).
 * @example groundConfiguration('Fe II').notation // '[Ar] 3d6 4s'
 */
export function groundConfiguration(input: Species | string): GroundConfiguration {
	const species = typeof input === 'string' ? parseSpecies(input) : checkSpecies(input);
	const { Z, symbol, charge } = species;
	const label = speciesLabel(species);
	let neutral: Configuration;
	let source: string;
	let caution: string | null = null;
	if (NEUTRAL_EXCEPTIONS[symbol]) {
		neutral = withCore(parseConfiguration(NEUTRAL_EXCEPTIONS[symbol]));
		source = `${symbol} I: tabulated exception to the Madelung order (NIST Atomic Spectra Database / CRC Handbook ground configuration)`;
		if (symbol === 'Lr') caution = LR_CAUTION;
	} else if (Z <= MAX_TABULATED_Z) {
		neutral = madelungConfiguration(Z);
		source = `${symbol} I: Madelung (n + l, then n) filling order, which agrees with the NIST Atomic Spectra Database / CRC Handbook ground configuration for this element`;
	} else {
		neutral = madelungConfiguration(Z);
		source = `${symbol} I: Madelung (n + l, then n) filling order`;
		caution = SUPERHEAVY_CAUTION;
	}
	let configuration = neutral;
	if (charge > 0) {
		const tabulated = ION_EXCEPTIONS[label];
		if (tabulated) {
			configuration = withCore(parseConfiguration(tabulated));
			source = `${label}: observed ground configuration (NIST Atomic Spectra Database ground level), which differs from the removal rule`;
			caution = null;
		} else if (Z - charge === 1) {
			// One electron left: the ground configuration is 1s, exactly (hydrogen-like ion).
			configuration = configurationOf([{ n: 1, l: 0, occupancy: 1 }]);
			source = `${label}: one electron left, so the ground configuration is 1s (hydrogen-like ion)`;
			caution = null;
		} else {
			configuration = withCore(configurationOf(removeElectrons(neutral.subshells, charge)));
			source = `${label}: ${charge} electron${charge > 1 ? 's' : ''} removed from the ${symbol} I ground configuration, outermost valence subshell first (largest n, then largest l)`;
			caution = caution ? `${ION_CAUTION} ${caution}` : ION_CAUTION;
		}
	}
	if (configuration.electrons !== Z - charge) throw new Error(`internal error: ${label} should have ${Z - charge} electrons`);
	return { configuration, notation: formatConfiguration(configuration, { compactCore: true }), source, caution };
}

function checkSpecies(s: Species): Species {
	const el = elementByZ(s.Z);
	if (!Number.isInteger(s.charge) || s.charge < 0 || s.charge >= s.Z) {
		throw new SpeciesError(
			`charge ${s.charge} is not allowed for ${el.symbol}: it must be an integer from 0 to ${s.Z - 1}`,
			String(s.charge)
		);
	}
	return { Z: s.Z, symbol: el.symbol, name: el.name, charge: s.charge };
}
