import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ENUMERATION_LIMIT, termsByEnumeration } from './enumerate';
import { termSummary, termsOf } from './terms';
import { microstateTotal } from './microstates';
import { configurationOf, parseConfiguration } from './parse';

/** Largest configuration drawn in the property test. */
const PROPERTY_MAX_MICROSTATES = 100_000n;

describe('terms by enumeration and peeling', () => {
	// Condon & Shortley (1935) ch. VII, table of terms of equivalent electrons.
	it('p2 gives 1S 1D 3P', () => {
		expect(termSummary(termsByEnumeration(parseConfiguration('2p2')))).toBe('1S 1D 3P');
	});
	it('d3 gives 2P 2D(2) 2F 2G 2H 4P 4F', () => {
		expect(termSummary(termsByEnumeration(parseConfiguration('3d3')))).toBe('2P 2D(2) 2F 2G 2H 4P 4F');
	});
	it('closed shells give 1S', () => {
		expect(termSummary(termsByEnumeration(parseConfiguration('[Ar]')))).toBe('1S');
	});
	it(`refuses more than ${ENUMERATION_LIMIT} microstates`, () => {
		expect(() => termsByEnumeration(parseConfiguration('4f7 5d3 6p3'))).toThrow(/limited to 2000000/);
	});

	it('counting (termsOf) and enumeration agree on random configurations up to 10^5 microstates', () => {
		const subshellArb = fc
			.integer({ min: 1, max: 8 })
			.chain((n) =>
				fc
					.integer({ min: 0, max: Math.min(n - 1, 4) })
					.chain((l) => fc.integer({ min: 1, max: 4 * l + 2 }).map((occupancy) => ({ n, l, occupancy })))
			);
		const configArb = fc
			.uniqueArray(subshellArb, { minLength: 1, maxLength: 4, selector: (s) => `${s.n},${s.l}` })
			.filter((s) => microstateTotal(s) <= PROPERTY_MAX_MICROSTATES);
		fc.assert(
			fc.property(configArb, (subshells) => {
				const cfg = configurationOf(subshells);
				const counted = termsOf(cfg).map((t) => ({ ...t, seniorities: null }));
				expect(termsByEnumeration(cfg)).toEqual(counted);
			}),
			{ numRuns: 60 }
		);
	});
});
