import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MAX_PARENTAGE_OCCURRENCES, onTypedParents, parentageOf, type ParentagePath } from './parentage';
import { configurationOf, parseConfiguration } from './parse';
import { termsOf } from './terms';
import { termDisplay } from './display';

const labels = (config: string) => parentageOf(parseConfiguration(config)).map((p) => p.label);
const onParent = (paths: ParentagePath[], parent: string) => paths.filter((p) => p.label.startsWith(parent)).map((p) => p.label);

describe('parentage of Fe II 3d⁶ 4s', () => {
	const paths = parentageOf(parseConfiguration('[Ar] 3d6 4s'));

	it('has 24 term occurrences: each of the 16 terms of d⁶ gives S ± ½ (one term for S = 0)', () => {
		// d⁶ terms ⁵D ³H ³G ³F(2) ³D ³P(2) ¹I ¹G(2) ¹F ¹D(2) ¹S(2): Condon & Shortley (1935), table of
		// equivalent-electron terms (from memory); 8 triplet/quintet occurrences × 2 + 8 singlets × 1 = 24.
		expect(paths).toHaveLength(24);
	});

	it('3d⁶(⁵D)4s gives ⁶D and ⁴D, the a⁶D and a⁴D terms of Fe II', () => {
		// Fe II a⁶D (ground) and a⁴D are 3d⁶(⁵D)4s (Moore's tables / NIST ASD, from memory).
		expect(onParent(paths, '3d⁶(⁵D)4s').sort()).toEqual(['3d⁶(⁵D)4s ⁴D', '3d⁶(⁵D)4s ⁶D']);
	});

	it('3d⁶(³H)4s gives ⁴H and ²H; the two ³P of d⁶ are told apart by seniority 2 and 4', () => {
		// Fe II a⁴H is 3d⁶(³H)4s (NIST ASD, from memory). d⁶ ³P has v = 2 and v = 4 (Racah 1943; Nielson & Koster 1963).
		expect(onParent(paths, '3d⁶(³H)4s').sort()).toEqual(['3d⁶(³H)4s ²H', '3d⁶(³H)4s ⁴H']);
		expect(paths.filter((p) => p.twoS === 3 && p.L === 1).map((p) => p.label)).toEqual(['3d⁶(³P, v=2)4s ⁴P', '3d⁶(³P, v=4)4s ⁴P']);
	});

	it('paths carry the parent of each open subshell and the intermediates, the last being the term', () => {
		const sextet = paths.find((p) => p.twoS === 5)!;
		expect(sextet.parents.map((p) => [p.twoS, p.L, p.seniority])).toEqual([
			[4, 2, 4],
			[1, 0, 1]
		]);
		expect(sextet.intermediates).toEqual([
			{ twoS: 4, L: 2 },
			{ twoS: 5, L: 2 }
		]);
	});
});

describe('parentage labels of other configurations', () => {
	it('3d⁵ 4s 4p: the one ⁸P° is 3d⁵(⁶S)4s(⁷S)4p ⁸P° (Mn I z⁸P°)', () => {
		// Mn I z⁸P° belongs to 3d⁵(⁶S)4s4p (NIST ASD, from memory); coupled here in configuration order.
		expect(labels('3d5 4s 4p').filter((l) => l.endsWith('⁸P°'))).toEqual(['3d⁵(⁶S)4s(⁷S)4p ⁸P°']);
	});

	it('4f² 5d: ⁴K comes only from 4f²(³H), as in Pr III', () => {
		// Martin, Zalubas & Hagan (1978), Pr III 4f²5d terms (from memory); ³H + d is the only way to L = 7, S = 3/2.
		expect(labels('4f2 5d').filter((l) => l.endsWith('⁴K'))).toEqual(['4f²(³H)5d ⁴K']);
	});

	it('Gd I 4f⁷ 5d 6s²: ⁹D° has the parent ⁸S° of the half-full f shell', () => {
		// Gd I ground level 4f⁷(⁸S°)5d6s² ⁹D°₂ (Martin, Zalubas & Hagan 1978, from memory).
		expect(labels('[Xe] 4f7 5d 6s2').filter((l) => l.endsWith('⁹D°'))).toEqual(['4f⁷(⁸S°)5d ⁹D°']);
	});

	it('3d⁴ 4s: ⁴F twice, from the ³F of d⁴ with v = 2 and with v = 4', () => {
		// d⁴ ³F occurs twice, seniorities 2 and 4 (Racah 1943; Nielson & Koster 1963, from memory).
		expect(labels('3d4 4s').filter((l) => l.endsWith('⁴F'))).toEqual(['3d⁴(³F, v=2)4s ⁴F', '3d⁴(³F, v=4)4s ⁴F']);
	});

	it('4f³ 6s: the two ²D of f³ with the same seniority 3 get an index', () => {
		// f³ ²D occurs twice, both with v = 3 (Nielson & Koster 1963 label them by U = (20), (21); from memory).
		// f³ has odd parity (Σl = 9), so the parent and the terms carry °.
		expect(labels('4f3 6s').filter((l) => l.startsWith('4f³(²D') && l.endsWith('¹D°'))).toEqual([
			'4f³(²D°, v=3, #1)6s ¹D°',
			'4f³(²D°, v=3, #2)6s ¹D°'
		]);
	});

	it('2s 2p gives ¹P° and ³P° without a parent term for the lone s electron', () => {
		// 2s2p ³P°, ¹P° (Condon & Shortley 1935, terms of non-equivalent electrons).
		expect(labels('1s2 2s 2p')).toEqual(['2s2p ¹P°', '2s2p ³P°']);
	});

	it('one open subshell: the label is the subshell and the term, seniority only where a term repeats', () => {
		// d³ terms ²P ²D(2) ²F ²G ²H ⁴P ⁴F, ²D with v = 1 and 3 (Condon & Shortley 1935; Racah 1943).
		expect(labels('3d3').filter((l) => l.includes('²D'))).toEqual(['3d³ ²D (v=1)', '3d³ ²D (v=3)']);
		expect(labels('3d3')).toContain('3d³ ⁴F');
	});

	it('closed subshells only: one path, ¹S', () => {
		expect(labels('1s2 2s2 2p6')).toEqual(['¹S']);
	});
});

describe('parentage budget', () => {
	it(`more than ${MAX_PARENTAGE_OCCURRENCES} term occurrences is refused with the count`, () => {
		// 4f⁷ 5d⁵: 119 f⁷ occurrences × many d⁵ couplings, far over the limit.
		expect(() => parentageOf(parseConfiguration('4f7 5d5'))).toThrow(/term occurrences; parentage is listed for at most/);
	});
});

describe('parentage against the count grid (property)', () => {
	// n, l pairs with room for several open subshells at once; occupancies drawn below capacity.
	const SHELLS = [
		[2, 1],
		[3, 2],
		[4, 0],
		[4, 1],
		[4, 3],
		[5, 0],
		[5, 2],
		[6, 1]
	] as const;
	const configArb = fc
		.subarray([...SHELLS], { minLength: 1, maxLength: 3 })
		.chain((shells) =>
			fc.tuple(...shells.map(([n, l]) => fc.integer({ min: 1, max: 4 * l + 1 }).map((occupancy) => ({ n, l, occupancy }))))
		);

	it('for ~200 random configurations the paths ending in each term number that term’s count', () => {
		// Sequential coupling spans the LS space (Condon & Shortley 1935, ch. VII): path counts = grid counts.
		fc.assert(
			fc.property(configArb, (subshells) => {
				const cfg = configurationOf(subshells);
				const terms = termsOf(cfg);
				fc.pre(terms.reduce((a, t) => a + t.count, 0) <= 1500);
				const paths = parentageOf(cfg);
				const counted = new Map<string, number>();
				for (const p of paths) counted.set(termDisplay(p.twoS, p.L, false), (counted.get(termDisplay(p.twoS, p.L, false)) ?? 0) + 1);
				expect(Object.fromEntries(counted)).toEqual(Object.fromEntries(terms.map((t) => [termDisplay(t.twoS, t.L, false), t.count])));
				for (const p of paths) {
					expect(p.parents).toHaveLength(cfg.subshells.filter((s) => s.occupancy < 4 * s.l + 2).length);
					expect(p.intermediates.at(-1)).toEqual({ twoS: p.twoS, L: p.L });
				}
			}),
			{ numRuns: 200 }
		);
	}, 120_000);
});

describe('parents typed with the configuration', () => {
	const pick = (text: string) => {
		const cfg = parseConfiguration(text);
		const paths = parentageOf(cfg);
		const on = onTypedParents(cfg, paths);
		return paths.filter((_, i) => on[i]).map((p) => p.label);
	};

	it('3d6(5D) 4s keeps the ⁶D and ⁴D built on ⁵D (Fe II a⁶D, a⁴D, NIST ASD from memory)', () => {
		expect(pick('3d6(5D) 4s').sort()).toEqual(['3d⁶(⁵D)4s ⁴D', '3d⁶(⁵D)4s ⁶D']);
		expect(pick('[Ar] 3d⁶(⁵D)4s')).toHaveLength(2);
	});

	it('a seniority picks one of two equal parents: 3d4(3F, v=4) 4s', () => {
		// d⁴ ³F with v = 2 and v = 4 (Racah 1943).
		expect(pick('3d4(3F, v=4) 4s')).toEqual(['3d⁴(³F, v=4)4s ²F', '3d⁴(³F, v=4)4s ⁴F']);
	});

	it('an intermediate after a lone electron: 3d5(6S) 4s(7S) 4p gives ⁸P°, ⁶P°', () => {
		// ⁷S + p: S = 3 ± ½, L = 1 (vector model).
		expect(pick('3d5(6S) 4s(7S) 4p').sort()).toEqual(['3d⁵(⁶S)4s(⁷S)4p ⁶P°', '3d⁵(⁶S)4s(⁷S)4p ⁸P°']);
	});

	it('a term the subshell does not have is refused with the terms it has', () => {
		expect(() => pick('3d6(7D) 4s')).toThrow(/3d⁶ has no term ⁷D: its terms are ⁵D; ³H; /);
		expect(() => pick('3d5(6S) 4s(3S) 4p')).toThrow(/no term of this configuration is built on the parent terms as typed/);
	});
});
