/**
 * Implied closed subshells and the electron count against the species. Electron counts: a
 * species of atomic number Z and charge q has Z − q electrons (general fact). Ground
 * configurations: NIST ASD / CRC Handbook tables, from memory (as in elements.test.ts). The rule
 * for what a short notation implies is common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import { checkElectrons, completeConfiguration, impliedClosedSubshells, sameConfiguration } from './implied';
import { formatConfiguration, parseConfiguration } from './parse';
import { parseSpecies } from './elements';

const cfg = parseConfiguration;
const implied = (notation: string, species?: string) =>
	formatConfiguration(impliedClosedSubshells(cfg(notation), species ? parseSpecies(species) : null));

describe('closed subshells a short notation implies', () => {
	it('O III 2p2 implies 1s2 2s2; a bare 2p4 implies the same', () => {
		expect(implied('2p2', 'O III')).toBe('1s2 2s2');
		expect(implied('2p4')).toBe('1s2 2s2');
	});

	it('Nd IV 4f3 implies [Xe] and not 6s2; Fe II 3d6 4s implies [Ar]', () => {
		expect(formatConfiguration(completeConfiguration(cfg('4f3'), parseSpecies('Nd IV')), { compactCore: true })).toBe('[Xe] 4f3');
		expect(formatConfiguration(completeConfiguration(cfg('4f3')), { compactCore: true })).toBe('[Xe] 4f3');
		expect(implied('3d6 4s', 'Fe II')).toBe(formatConfiguration(cfg('[Ar]')));
	});

	it('Pb I 6s2 6p2 implies [Xe] 4f14 5d10 from the Pb ground configuration', () => {
		expect(formatConfiguration(completeConfiguration(cfg('6s2 6p2'), parseSpecies('Pb I')), { compactCore: true })).toBe(
			'[Xe] 4f14 5d10 6s2 6p2'
		);
	});

	it('the excited Ca I 3d 4p does not assume the ground 4s2; a written core or 1s implies nothing', () => {
		expect(formatConfiguration(completeConfiguration(cfg('3d 4p'), parseSpecies('Ca I')), { compactCore: true })).toBe('[Ar] 3d 4p');
		expect(implied('[Ar] 4p', 'K I')).toBe('');
		expect(implied('1s 2p', 'He I')).toBe('');
	});
});

describe('electrons against Z − charge', () => {
	it('O III with 2p4 warns: 8 counted with 1s2 2s2 assumed, O III has 6', () => {
		const c = checkElectrons(parseSpecies('O III'), cfg('2p4'));
		expect(c).toMatchObject({ counted: 8, expected: 6, assumed: '1s2 2s2' });
		expect(c.warning).toMatch(
			/O III has 6 electrons \(Z = 8, charge 2\), but 2p4 holds 8 with the closed subshells it implies \(1s2 2s2 assumed\)/
		);
	});

	it('Nd IV with 4f2 warns (57 electrons, 56 counted with [Xe] assumed)', () => {
		const c = checkElectrons(parseSpecies('Nd IV'), cfg('4f2'));
		expect(c).toMatchObject({ counted: 56, expected: 57 });
		expect(c.warning).toMatch(/Nd IV has 57 electrons/);
	});

	it('agreeing pairs give no warning: O III 2p2, O III 2s 2p3, Fe II [Ar] 3d6 4s, Nd IV 4f3, Lu I 5d 6s2, Ne I 2p5 3p', () => {
		for (const [s, n] of [
			['O III', '2p2'],
			['O III', '2s 2p3'],
			['Fe II', '[Ar] 3d6 4s'],
			['Fe II', '3d7'],
			['Nd IV', '4f3'],
			['Lu I', '5d 6s2'],
			['La I', '5d 6s2'],
			['Ne I', '2p5 3p'],
			['K I', '3p5 4s2']
		])
			expect(checkElectrons(parseSpecies(s), cfg(n)).warning, `${s} ${n}`).toBeNull();
	});
});

describe('same configuration', () => {
	it('2p2, 1s2 2s2 2p2, [He] 2s2 2p2 and 2s2.2p2 are one configuration', () => {
		for (const other of ['1s2 2s2 2p2', '[He] 2s2 2p2', '2s2.2p2', '2p²'])
			expect(sameConfiguration(cfg('2p2'), cfg(other)), other).toBe(true);
	});

	it('2p2 and 2p4 differ, 4f3 and 4f2 differ, [Ar] 4s and [Ar] 3d10 4s differ, 2p2 and 1s2 2p2 differ', () => {
		expect(sameConfiguration(cfg('2p2'), cfg('2p4'))).toBe(false);
		expect(sameConfiguration(cfg('4f3'), cfg('4f2'))).toBe(false);
		expect(sameConfiguration(cfg('[Ar] 4s'), cfg('[Ar] 3d10 4s'))).toBe(false);
		expect(sameConfiguration(cfg('2p2'), cfg('1s2 2p2'))).toBe(false);
	});

	it('the order of writing does not matter: 4s 3d6 is 3d6 4s', () => {
		expect(sameConfiguration(cfg('4s 3d6'), cfg('[Ar] 3d6 4s1'))).toBe(true);
	});
});
