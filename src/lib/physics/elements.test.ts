import { describe, expect, it } from 'vitest';
import {
	ELEMENT_NAMES,
	ELEMENT_SYMBOLS,
	ION_CAUTION,
	SpeciesError,
	elementByZ,
	groundConfiguration,
	madelungConfiguration,
	parseSpecies,
	romanValue,
	speciesLabel,
	toRoman
} from './elements';
import { subshellCapacity } from './parse';

function speciesError(text: string): SpeciesError {
	try {
		parseSpecies(text);
	} catch (e) {
		if (e instanceof SpeciesError) return e;
		throw e;
	}
	throw new Error(`expected "${text}" to be rejected`);
}

describe('elements', () => {
	it('118 symbols and names, all distinct; Fe is 26, Nd 60, U 92, Og 118', () => {
		// Source: IUPAC periodic table (general fact).
		expect(ELEMENT_SYMBOLS).toHaveLength(118);
		expect(ELEMENT_NAMES).toHaveLength(118);
		expect(new Set(ELEMENT_SYMBOLS).size).toBe(118);
		expect(new Set(ELEMENT_NAMES).size).toBe(118);
		expect(ELEMENT_SYMBOLS.indexOf('Fe') + 1).toBe(26);
		expect(ELEMENT_SYMBOLS.indexOf('Nd') + 1).toBe(60);
		expect(ELEMENT_SYMBOLS.indexOf('U') + 1).toBe(92);
		expect(elementByZ(118)).toEqual({ Z: 118, symbol: 'Og', name: 'Oganesson' });
	});

	it('Roman numerals read and write back for 1 … 120, and bad ones are refused', () => {
		for (let n = 1; n <= 120; n++) expect(romanValue(toRoman(n))).toBe(n);
		expect(toRoman(26)).toBe('XXVI');
		expect(romanValue('IIII')).toBeNull();
		expect(romanValue('IC')).toBeNull();
		expect(romanValue('')).toBeNull();
	});
});

describe('reading species', () => {
	it('Fe II, Fe+, Fe 1+, Fe++ minus one, FeII and Fe⁺ are all singly ionized iron', () => {
		// Spectroscopic convention: spectrum number = charge + 1 (Fe II = Fe⁺); general fact.
		for (const text of ['Fe II', 'Fe+', 'Fe 1+', 'Fe +1', 'FeII', 'Fe⁺', 'iron II']) {
			expect(parseSpecies(text)).toEqual({ Z: 26, symbol: 'Fe', name: 'Iron', charge: 1 });
		}
		expect(parseSpecies('Fe++').charge).toBe(2);
	});

	it('Nd3+, Nd³⁺ and Nd IV are the trivalent ion; Nd III is Nd²⁺', () => {
		expect(parseSpecies('Nd3+').charge).toBe(3);
		expect(parseSpecies('Nd³⁺').charge).toBe(3);
		expect(parseSpecies('Nd IV').charge).toBe(3);
		expect(parseSpecies('Nd III').charge).toBe(2);
	});

	it('O, Fe I and N I are neutral; "NI" is N I, not Ni', () => {
		expect(parseSpecies('O').charge).toBe(0);
		expect(parseSpecies('Fe I').charge).toBe(0);
		expect(parseSpecies('NI')).toMatchObject({ symbol: 'N', charge: 0 });
		expect(parseSpecies('Ni')).toMatchObject({ symbol: 'Ni', charge: 0 });
	});

	it('the label is symbol and spectrum number', () => {
		expect(speciesLabel(parseSpecies('Fe 2+'))).toBe('Fe III');
	});

	it('an unknown element is refused with the word as token', () => {
		const e = speciesError('Xx II');
		expect(e.token).toBe('Xx');
		expect(e.message).toMatch(/not an element/);
	});

	it('a charge of Z or more is refused: Fe has 26 electrons, Fe XXVI is the last spectrum', () => {
		const e = speciesError('Fe XXVII');
		expect(e.message).toMatch(/from 0 to 25/);
		expect(e.message).toContain('Fe XXVI');
		expect(speciesError('H II').message).toMatch(/1 electron,/);
		expect(speciesError('Fe 26+').token).toBe('26+');
	});

	it('a bad Roman numeral, lowercase numerals, a negative ion and an empty text are refused', () => {
		expect(speciesError('Fe IIII').token).toBe('IIII');
		expect(speciesError('Fe IIII').message).toMatch(/Roman numeral/);
		expect(speciesError('Fe ii').message).toMatch(/capital Roman/);
		expect(speciesError('O-').message).toMatch(/negative ions/);
		expect(speciesError('O 2-').message).toMatch(/negative ions/);
		expect(speciesError('').message).toMatch(/empty/);
		expect(speciesError('Fe3').message).toMatch(/cannot read the charge/);
	});
});

describe('ground configurations of neutral atoms', () => {
	// Source for every value in this block: ground configurations of the NIST Atomic Spectra
	// Database periodic table / CRC Handbook table of neutral-atom configurations (from memory).
	const cases: [string, string][] = [
		['H', '1s'],
		['C', '[He] 2s2 2p2'],
		['Ne', '[Ne]'],
		['Fe', '[Ar] 3d6 4s2'],
		['Cr', '[Ar] 3d5 4s'],
		['Cu', '[Ar] 3d10 4s'],
		['Ge', '[Ar] 3d10 4s2 4p2'],
		['Nb', '[Kr] 4d4 5s'],
		['Mo', '[Kr] 4d5 5s'],
		['Tc', '[Kr] 4d5 5s2'],
		['Ru', '[Kr] 4d7 5s'],
		['Rh', '[Kr] 4d8 5s'],
		['Pd', '[Kr] 4d10'],
		['Ag', '[Kr] 4d10 5s'],
		['La', '[Xe] 5d 6s2'],
		['Ce', '[Xe] 4f 5d 6s2'],
		['Pr', '[Xe] 4f3 6s2'],
		['Nd', '[Xe] 4f4 6s2'],
		['Eu', '[Xe] 4f7 6s2'],
		['Gd', '[Xe] 4f7 5d 6s2'],
		['Tb', '[Xe] 4f9 6s2'],
		['Yb', '[Xe] 4f14 6s2'],
		['Lu', '[Xe] 4f14 5d 6s2'],
		['W', '[Xe] 4f14 5d4 6s2'],
		['Pt', '[Xe] 4f14 5d9 6s'],
		['Au', '[Xe] 4f14 5d10 6s'],
		['Pb', '[Xe] 4f14 5d10 6s2 6p2'],
		['Ra', '[Rn] 7s2'],
		['Ac', '[Rn] 6d 7s2'],
		['Th', '[Rn] 6d2 7s2'],
		['Pa', '[Rn] 5f2 6d 7s2'],
		['U', '[Rn] 5f3 6d 7s2'],
		['Np', '[Rn] 5f4 6d 7s2'],
		['Pu', '[Rn] 5f6 7s2'],
		['Cm', '[Rn] 5f7 6d 7s2'],
		['No', '[Rn] 5f14 7s2'],
		['Lr', '[Rn] 5f14 7s2 7p']
	];
	for (const [symbol, notation] of cases) {
		it(`${symbol} I is ${notation}`, () => {
			expect(groundConfiguration(symbol).notation).toBe(notation);
		});
	}

	it('neutral atoms up to Z = 103 carry no caution except the tentative Lr', () => {
		for (let Z = 1; Z <= 102; Z++) expect(groundConfiguration(ELEMENT_SYMBOLS[Z - 1]).caution).toBeNull();
		expect(groundConfiguration('Lr').caution).toMatch(/tentative/);
	});

	it('beyond Z = 103 the Madelung order is used with a caution (Og: [Rn] 5f14 6d10 7s2 7p6)', () => {
		const og = groundConfiguration('Og');
		expect(og.notation).toBe('[Rn] 5f14 6d10 7s2 7p6');
		expect(og.caution).toMatch(/predicted, not measured/);
	});

	it('every Madelung configuration has Z electrons and the noble gases come out closed', () => {
		for (let Z = 1; Z <= 118; Z++) expect(madelungConfiguration(Z).electrons).toBe(Z);
		for (const Z of [2, 10, 18, 36, 54, 86, 118]) {
			expect(madelungConfiguration(Z).subshells.every((s) => s.occupancy === subshellCapacity(s.l))).toBe(true);
		}
	});
});

describe('ground configurations of positive ions', () => {
	it('Fe II is 3d6 4s: the 4s electron goes first', () => {
		// Fe II ground level a⁶D₉/₂, 3d⁶(⁵D)4s (NIST ASD, from memory).
		const g = groundConfiguration('Fe II');
		expect(g.notation).toBe('[Ar] 3d6 4s');
		expect(g.caution).toBe(ION_CAUTION);
	});

	it('Ti II 3d2 4s, Ca II 4s, Cu II 3d10, Fe III 3d6, Cr II 3d5', () => {
		// NIST ASD ground levels, from memory: Ti II a⁴F 3d²4s, Ca II ²S 4s, Cu II ¹S 3d¹⁰,
		// Fe III ⁵D 3d⁶, Cr II ⁶S 3d⁵.
		expect(groundConfiguration('Ti II').notation).toBe('[Ar] 3d2 4s');
		expect(groundConfiguration('Ca II').notation).toBe('[Ar] 4s');
		expect(groundConfiguration('Cu II').notation).toBe('[Ar] 3d10');
		expect(groundConfiguration('Fe III').notation).toBe('[Ar] 3d6');
		expect(groundConfiguration('Cr II').notation).toBe('[Ar] 3d5');
	});

	it('trivalent lanthanide ions are [Xe] 4f^n: Ce³⁺ 4f1 … Gd³⁺ 4f7 … Lu³⁺ 4f14', () => {
		// Kittel, Introduction to Solid State Physics, table of trivalent lanthanide ions (4f^n
		// with n = 1 for Ce³⁺ to 13 for Yb³⁺); Ashcroft & Mermin (1976) ch. 31. La³⁺ is [Xe].
		const lanthanides = ['La', 'Ce', 'Pr', 'Nd', 'Pm', 'Sm', 'Eu', 'Gd', 'Tb', 'Dy', 'Ho', 'Er', 'Tm', 'Yb', 'Lu'];
		lanthanides.forEach((symbol, n) => {
			expect(groundConfiguration(`${symbol}3+`).notation).toBe(n === 0 ? '[Xe]' : `[Xe] 4f${n === 1 ? '' : n}`);
		});
	});

	it('V II 3d4, Co II 3d8, Ni II 3d9 differ from the removal rule and come from the table without caution', () => {
		// NIST ASD ground levels, from memory: V II a⁵D₀ 3d⁴, Co II a³F₄ 3d⁸, Ni II ²D₅/₂ 3d⁹.
		for (const [s, n] of [
			['V II', '[Ar] 3d4'],
			['Co II', '[Ar] 3d8'],
			['Ni II', '[Ar] 3d9']
		]) {
			const g = groundConfiguration(s);
			expect(g.notation).toBe(n);
			expect(g.caution).toBeNull();
		}
	});

	it('La II 5d2, Ce III 4f2, Lu II 6s2, Y II 5s2, U II 5f3 7s2', () => {
		// NIST ASD ground levels, from memory: La II a³F₂ 5d², Ce III ³H₄ 4f², Lu II ¹S₀ 4f¹⁴6s²,
		// Y II ¹S₀ 5s², U II ⁴I°₉/₂ 5f³7s².
		expect(groundConfiguration('La II').notation).toBe('[Xe] 5d2');
		expect(groundConfiguration('Ce III').notation).toBe('[Xe] 4f2');
		expect(groundConfiguration('Lu II').notation).toBe('[Xe] 4f14 6s2');
		expect(groundConfiguration('Y II').notation).toBe('[Kr] 5s2');
		expect(groundConfiguration('U II').notation).toBe('[Rn] 5f3 7s2');
	});

	it('highly charged iron: Fe X chlorine-like, Fe XVII neon-like, Fe XXV helium-like, Fe XXVI hydrogen-like', () => {
		// Isoelectronic sequences (general fact): Fe X has 17 electrons (Cl-like 3s² 3p⁵),
		// Fe XVII 10 (Ne-like), Fe XXV 2, Fe XXVI 1.
		expect(groundConfiguration('Fe X').notation).toBe('[Ne] 3s2 3p5');
		expect(groundConfiguration('Fe XVII').notation).toBe('[Ne]');
		expect(groundConfiguration('Fe XXV').notation).toBe('[He]');
		expect(groundConfiguration('Fe XXVI').notation).toBe('1s');
	});

	it('Pa II 5f2 7s2, Ac III 7s, U III 5f4: actinide ions where removing the outermost electrons guesses wrong', () => {
		// NIST ASD ground levels, from memory: Pa II ³H₄ 5f²7s², Ac III ²S₁/₂ 7s (Fr-like, 6d just above),
		// U III ⁵I₄ 5f⁴. The removal rule would give 5f² 6d 7s, 6d and 5f³ 6d.
		for (const [s, n] of [
			['Pa II', '[Rn] 5f2 7s2'],
			['Ac III', '[Rn] 7s'],
			['U III', '[Rn] 5f4']
		]) {
			const g = groundConfiguration(s);
			expect(g.notation).toBe(n);
			expect(g.caution).toBeNull();
		}
	});

	it('the removal rule stays where it agrees with the tables: Th II 6d2 7s, U IV 5f3, Pa IV 5f2, Pu II 5f6 7s', () => {
		// NIST ASD ground levels, from memory: Th II ⁴F₃/₂ 6d²7s, U IV ⁴I°₉/₂ 5f³, Pa IV ³H₄ 5f², Pu II ⁸F₁/₂ 5f⁶7s.
		expect(groundConfiguration('Th II').notation).toBe('[Rn] 6d2 7s');
		expect(groundConfiguration('U IV').notation).toBe('[Rn] 5f3');
		expect(groundConfiguration('Pa IV').notation).toBe('[Rn] 5f2');
		expect(groundConfiguration('Pu II').notation).toBe('[Rn] 5f6 7s');
	});

	it('one-electron ions (H-like) are 1s exactly and carry no ion caution: He II, C VI, Fe XXVI, U XCII', () => {
		// A single electron has the hydrogen-like ground state 1s ²S₁/₂ (general fact).
		for (const s of ['He II', 'C VI', 'Fe XXVI', 'U XCII']) {
			const g = groundConfiguration(s);
			expect(g.notation).toBe('1s');
			expect(g.caution).toBeNull();
		}
		// Two electrons are still computed by the rule and keep the caution.
		expect(groundConfiguration('Fe XXV').caution).toBe(ION_CAUTION);
	});

	it('every ion has Z − charge electrons', () => {
		for (let Z = 1; Z <= 103; Z++) {
			for (let q = 0; q < Z; q += Math.max(1, Math.floor(Z / 7))) {
				expect(groundConfiguration({ Z, symbol: '', name: '', charge: q }).configuration.electrons).toBe(Z - q);
			}
		}
	});

	it('a species object with a bad charge is refused', () => {
		expect(() => groundConfiguration({ Z: 8, symbol: 'O', name: 'Oxygen', charge: 8 })).toThrow(/from 0 to 7/);
	});
});
