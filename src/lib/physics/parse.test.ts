import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	ConfigurationError,
	MAX_CONFIGURATION_LENGTH,
	NOBLE_GAS_CORES,
	asSubshells,
	configurationOf,
	displayConfiguration,
	formatConfiguration,
	largestCore,
	openSubshells,
	parseConfiguration,
	subshellCapacity
} from './parse';
import type { Subshell } from './types';

/** The thrown ConfigurationError of a failing parse (the test fails if nothing is thrown). */
function errorOf(text: string): ConfigurationError {
	try {
		parseConfiguration(text);
	} catch (e) {
		if (e instanceof ConfigurationError) return e;
		throw e;
	}
	throw new Error(`expected "${text}" to be rejected`);
}

describe('reading configurations', () => {
	it('1s2 2s2 2p6 3s2 3p6 3d5 4s1 is chromium: 24 electrons, even parity', () => {
		// Source: Cr I ground configuration [Ar] 3d5 4s (NIST/CRC periodic table); parity (−1)^Σl.
		const cfg = parseConfiguration('1s2 2s2 2p6 3s2 3p6 3d5 4s1');
		expect(cfg.electrons).toBe(24);
		expect(cfg.parity).toBe('even');
		expect(cfg.core).toBeNull();
		expect(cfg.subshells.map((s) => [s.n, s.l, s.occupancy])).toEqual([
			[1, 0, 2],
			[2, 0, 2],
			[2, 1, 6],
			[3, 0, 2],
			[3, 1, 6],
			[3, 2, 5],
			[4, 0, 1]
		]);
	});

	it('[Ar] 3d5 4s expands the argon core and equals the long form', () => {
		const short = parseConfiguration('[Ar] 3d5 4s');
		const long = parseConfiguration('1s2 2s2 2p6 3s2 3p6 3d5 4s1');
		expect(short.subshells).toEqual(long.subshells);
		expect(short.core).toBe('Ar');
	});

	it('dots, superscripts, carets and braces are all read the same way', () => {
		const ref = parseConfiguration('4f7 5d 6s2').subshells;
		expect(parseConfiguration('4f7.5d.6s2').subshells).toEqual(ref);
		expect(parseConfiguration('4f⁷5d6s²').subshells).toEqual(ref);
		expect(parseConfiguration('4f^7 5d^1 6s^{2}').subshells).toEqual(ref);
		expect(parseConfiguration('  4f7   5d1·6s2 ').subshells).toEqual(ref);
		expect(parseConfiguration('3d⁵4s¹').subshells).toEqual(parseConfiguration('3d5 4s').subshells);
	});

	it('2p5 3p leaves out occupancy 1 and has even parity', () => {
		// Parity (−1)^(5·1 + 1·1) = +1 (Condon & Shortley 1935; general fact).
		const cfg = parseConfiguration('2p5 3p');
		expect(cfg.subshells).toEqual([
			{ n: 2, l: 1, occupancy: 5 },
			{ n: 3, l: 1, occupancy: 1 }
		]);
		expect(cfg.parity).toBe('even');
	});

	it('4f7 5d 6s2 (Gd I) has odd parity', () => {
		// Gd I ground level ⁹D°₂ is odd (NIST ASD, from memory); Σ l = 7·3 + 2 = 23.
		expect(parseConfiguration('4f7 5d 6s2').parity).toBe('odd');
	});

	it('subshells come out ordered by n then l, whatever the input order', () => {
		const cfg = parseConfiguration('6s2 4f7 5d');
		expect(cfg.subshells.map((s) => `${s.n}${s.l}`)).toEqual(['43', '52', '60']);
	});

	it('every noble-gas core expands to the standard closed shells (He 2, Ne 10, Ar 18, Kr 36, Xe 54, Rn 86 electrons)', () => {
		// Source: atomic numbers of the noble gases (general fact).
		const sizes: Record<string, number> = { He: 2, Ne: 10, Ar: 18, Kr: 36, Xe: 54, Rn: 86 };
		for (const [name, size] of Object.entries(sizes)) {
			expect(parseConfiguration(`[${name}]`).electrons).toBe(size);
			expect(NOBLE_GAS_CORES[name].every((s) => s.occupancy === subshellCapacity(s.l))).toBe(true);
		}
		// [Rn] includes 4f14 and 5d10 (Rn: [Xe] 4f14 5d10 6s2 6p6).
		expect(parseConfiguration('[Rn]').subshells).toContainEqual({ n: 4, l: 3, occupancy: 14 });
	});

	it('high-l letters k, l … v are read, with n up to 20', () => {
		expect(parseConfiguration('8k 9l2').subshells).toEqual([
			{ n: 8, l: 7, occupancy: 1 },
			{ n: 9, l: 8, occupancy: 2 }
		]);
		expect(parseConfiguration('20v').subshells[0].l).toBe(16);
	});
});

describe('configuration errors name the offending token', () => {
	it('empty text', () => {
		const e = errorOf('   ');
		expect(e.token).toBe('');
		expect(e.message).toMatch(/empty/);
	});

	it(`text over ${MAX_CONFIGURATION_LENGTH} characters`, () => {
		const text = '1s2 '.repeat(60);
		const e = errorOf(text);
		expect(e.message).toMatch(/at most 200/);
		expect(e.token).toBe(`${text.slice(0, 20)}…`);
	});

	it('an unknown letter lists the allowed letters', () => {
		const e = errorOf('1s2 2x3');
		expect(e.token).toBe('2x3');
		expect(e.message).toContain('s p d f g h i k l m n o q r t u v');
	});

	it('j is not a subshell letter (it is skipped)', () => {
		const e = errorOf('8j');
		expect(e.token).toBe('8j');
		expect(e.message).toMatch(/j is skipped/);
	});

	it('capital letters get a hint that subshell letters are lowercase', () => {
		const e = errorOf('2P6');
		expect(e.token).toBe('2P6');
		expect(e.message).toMatch(/lowercase/);
	});

	it('a 2d subshell does not exist: l must be smaller than n', () => {
		const e = errorOf('1s2 2d1');
		expect(e.token).toBe('2d1');
		expect(e.message).toMatch(/^a 2d subshell does not exist: l must be smaller than n/);
	});

	it('a p subshell holds at most 6 electrons', () => {
		// Pauli principle: 2(2l+1) = 6 for l = 1.
		const e = errorOf('1s2 2s2 2p7');
		expect(e.token).toBe('2p7');
		expect(e.message).toMatch(/^a p subshell holds at most 6 electrons/);
		expect(errorOf('4f15').message).toMatch(/^an f subshell holds at most 14 electrons/);
	});

	it('occupancy 0 or negative', () => {
		expect(errorOf('2p0').token).toBe('2p0');
		expect(errorOf('2p0').message).toMatch(/1 to 6/);
		expect(errorOf('2p-1').token).toBe('2p-1');
	});

	it('n out of range (1 … 20)', () => {
		expect(errorOf('0s2').token).toBe('0s2');
		expect(errorOf('21s').message).toMatch(/from 1 to 20/);
		expect(errorOf('21s').token).toBe('21s');
	});

	it('a subshell given twice', () => {
		const e = errorOf('2p2 3s 2p');
		expect(e.token).toBe('2p');
		expect(e.message).toMatch(/given twice/);
	});

	it('a subshell that clashes with the core, in either order', () => {
		const a = errorOf('[Ne] 2p6 3s');
		expect(a.token).toBe('2p6');
		expect(a.message).toMatch(/\[Ne\] core already contains 2p6/);
		const b = errorOf('3p6 [Ar]');
		expect(b.token).toBe('[Ar]');
	});

	it('an unknown core and a second core', () => {
		const a = errorOf('[Fe] 4s2');
		expect(a.token).toBe('[Fe]');
		expect(a.message).toContain('[He] [Ne] [Ar] [Kr] [Xe] [Rn]');
		expect(errorOf('[He] [Ne]').token).toBe('[Ne]');
	});

	it('plain digits run together are ambiguous and need a separator', () => {
		const e = errorOf('3d54s');
		expect(e.token).toBe('3d54s');
		expect(e.message).toMatch(/space or a dot/);
	});

	it('text that is not a subshell at all', () => {
		const e = errorOf('3d5 hello');
		expect(e.token).toBe('hello');
	});

	it('errors are ConfigurationError instances with a message and a token', () => {
		const e = errorOf('2d');
		expect(e).toBeInstanceOf(Error);
		expect(e.name).toBe('ConfigurationError');
	});
});

describe('writing configurations', () => {
	it('normalizes 1s2 2s2 2p6 3s2 3p6 3d5 4s1 to the long form with 4s written without 1', () => {
		expect(formatConfiguration(parseConfiguration('1s2 2s2 2p6 3s2 3p6 3d5 4s1'))).toBe('1s2 2s2 2p6 3s2 3p6 3d5 4s');
	});

	it('compactCore writes the largest noble-gas core contained fully', () => {
		expect(formatConfiguration(parseConfiguration('1s2 2s2 2p6 3s2 3p6 3d5 4s1'), { compactCore: true })).toBe('[Ar] 3d5 4s');
		expect(formatConfiguration(parseConfiguration('1s2 2s2 2p5 3s'), { compactCore: true })).toBe('[He] 2s2 2p5 3s');
		expect(formatConfiguration(parseConfiguration('2p5 3p'), { compactCore: true })).toBe('2p5 3p');
		expect(largestCore(parseConfiguration('[Xe] 4f7 6s2').subshells)).toBe('Xe');
	});

	it('display form keeps a typed core and spells out an untyped one: [Xe] 4f² 5d, 1s² 2s² 2p⁶ 3s', () => {
		// [Xe] = 1s² … 5p⁶, 54 electrons (the noble-gas core shorthand; common practice, no source).
		expect(displayConfiguration(parseConfiguration('[Xe] 4f2 5d'))).toBe('[Xe] 4f² 5d');
		expect(displayConfiguration(parseConfiguration('1s2 2s2 2p6 3s'))).toBe('1s² 2s² 2p⁶ 3s');
	});

	it('superscripts: 3d⁵ 4s', () => {
		expect(formatConfiguration(parseConfiguration('[Ar] 3d5 4s'), { superscripts: true, compactCore: true })).toBe('[Ar] 3d⁵ 4s');
		expect(formatConfiguration(parseConfiguration('4f14'), { superscripts: true })).toBe('4f¹⁴');
	});

	it('writing then reading gives back the same configuration (random configurations)', () => {
		const subshell = fc
			.integer({ min: 1, max: 20 })
			.chain((n) =>
				fc
					.integer({ min: 0, max: Math.min(n - 1, 16) })
					.chain((l) => fc.integer({ min: 1, max: 4 * l + 2 }).map((occupancy) => ({ n, l, occupancy })))
			);
		const list = fc.uniqueArray(subshell, { minLength: 1, maxLength: 8, selector: (s) => `${s.n},${s.l}` });
		fc.assert(
			fc.property(list, fc.boolean(), fc.boolean(), (subshells, superscripts, compactCore) => {
				const cfg = configurationOf(subshells);
				const text = formatConfiguration(cfg, { superscripts, compactCore });
				expect(parseConfiguration(text).subshells).toEqual(cfg.subshells);
			}),
			{ numRuns: 200 }
		);
	});
});

describe('checked subshell lists', () => {
	it('configurationOf sorts, counts electrons and checks each subshell', () => {
		const cfg = configurationOf(
			[
				{ n: 4, l: 0, occupancy: 1 },
				{ n: 3, l: 2, occupancy: 5 }
			],
			'Ar'
		);
		expect(cfg.electrons).toBe(24);
		expect(cfg.core).toBe('Ar');
		expect(() => configurationOf([{ n: 2, l: 2, occupancy: 1 }])).toThrow(ConfigurationError);
		expect(() => configurationOf([{ n: 3, l: 1, occupancy: 2 }], 'Ar')).toThrow(/already contains 3p6/);
	});

	it('asSubshells rejects a bad occupancy in a plain list', () => {
		const bad: Subshell[] = [{ n: 3, l: 2, occupancy: 11 }];
		expect(() => asSubshells(bad)).toThrow(/a d subshell holds at most 10 electrons/);
	});

	it('openSubshells leaves out closed subshells', () => {
		expect(openSubshells(parseConfiguration('[Ar] 3d5 4s')).map((s) => s.l)).toEqual([2, 0]);
	});
});

describe('parent terms typed in parentheses', () => {
	it('3d6(5D) 4s reads as 3d6 4s with the parent ⁵D on 3d', () => {
		// Notation of the reference tables, e.g. Fe II 3d⁶(⁵D)4s (NIST ASD, from memory).
		const cfg = parseConfiguration('3d6(5D) 4s');
		expect(cfg.subshells).toEqual(parseConfiguration('3d6 4s').subshells);
		expect(cfg.parents).toEqual([{ n: 3, l: 2, own: { twoS: 4, L: 2, seniority: null, index: null }, intermediate: null }]);
	});

	it('superscripts, the odd mark, seniority and index are read; no space is needed after the parenthesis', () => {
		expect(parseConfiguration('3d⁶(⁵D)4s').parents?.[0].own).toMatchObject({ twoS: 4, L: 2 });
		expect(parseConfiguration('2p5(2P°) 3p').parents?.[0]).toMatchObject({ own: null, intermediate: { twoS: 1, L: 1 } });
		expect(parseConfiguration('3d4(3F, v=2) 4s').parents?.[0].own).toEqual({ twoS: 2, L: 3, seniority: 2, index: null });
		expect(parseConfiguration('4f3(2D,v=3,#2) 6s').parents?.[0].own).toEqual({ twoS: 1, L: 2, seniority: 3, index: 2 });
		expect(parseConfiguration('3d6(5D).4s').subshells).toHaveLength(2);
	});

	it('a lone electron takes the intermediate term: 3d5(6S) 4s(7S) 4p', () => {
		const cfg = parseConfiguration('3d5(6S) 4s(7S) 4p');
		expect(cfg.parents?.map((p) => [p.n, p.l, p.own?.twoS ?? null, p.intermediate?.twoS ?? null])).toEqual([
			[3, 2, 5, null],
			[4, 0, null, 6]
		]);
	});

	it('configurations without parentheses carry no parents field', () => {
		expect(parseConfiguration('[Ar] 3d5 4s')).not.toHaveProperty('parents');
	});

	it('bad parent terms are refused with what is allowed', () => {
		expect(errorOf('3d6(5X) 4s').message).toMatch(/not a term letter/);
		expect(errorOf('3d6(D) 4s').message).toMatch(/write the term as multiplicity and letter/);
		expect(errorOf('2p6(1S) 3s').message).toMatch(/2p6 is full/);
		expect(errorOf('3d6 4s(6D)').message).toMatch(/last open subshell/);
	});
});
