import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Fraction from 'fraction.js';
import {
	MAX_TRANSITION_PAIRS,
	jParityAllows,
	lsVerdict,
	multipletLabel,
	multipletLines,
	termSymbol,
	parseTermSymbol,
	transitionsBetween,
	type LsTerm,
	type SpectralLevel
} from './transitions';

const d = (x: number) => Math.round(2 * x);
const T = (S: number, L: number): LsTerm => ({ twoS: d(S), L });

/** Strengths of a multiplet as { "Jlow–Jup": exact } for easy comparison with printed tables. */
function table(type: 'E1' | 'E2', lower: LsTerm, upper: LsTerm): Record<string, string> {
	const lines = multipletLines(type, lower, upper);
	if (!lines) throw new Error('no multiplet');
	return Object.fromEntries(lines.map((l) => [`${l.twoJLower / 2}–${l.twoJUpper / 2}`, l.strength.exact]));
}

describe('selection rules on J and parity (Condon & Shortley 1935 ch. IV; Cowan 1981 ch. 14; Sobelman 1979 ch. 9)', () => {
	it('E1 needs a parity change, ΔJ = 0, ±1 and not 0–0', () => {
		expect(jParityAllows('E1', d(1), 'even', d(2), 'odd')).toBe(true);
		expect(jParityAllows('E1', d(1), 'even', d(1), 'odd')).toBe(true);
		expect(jParityAllows('E1', d(0), 'even', d(0), 'odd')).toBe(false);
		expect(jParityAllows('E1', d(1), 'even', d(3), 'odd')).toBe(false);
		expect(jParityAllows('E1', d(1), 'even', d(2), 'even')).toBe(false);
		expect(jParityAllows('E1', d(0.5), 'even', d(0.5), 'odd')).toBe(true);
	});
	it('M1 keeps parity, ΔJ = 0, ±1 and not 0–0', () => {
		expect(jParityAllows('M1', d(1), 'even', d(2), 'even')).toBe(true);
		expect(jParityAllows('M1', d(0), 'odd', d(0), 'odd')).toBe(false);
		expect(jParityAllows('M1', d(1), 'even', d(2), 'odd')).toBe(false);
	});
	it('E2 keeps parity, ΔJ ≤ 2, and forbids 0–0, 1/2–1/2 and 0–1', () => {
		expect(jParityAllows('E2', d(0), 'even', d(2), 'even')).toBe(true);
		expect(jParityAllows('E2', d(0), 'even', d(1), 'even')).toBe(false);
		expect(jParityAllows('E2', d(0), 'even', d(0), 'even')).toBe(false);
		expect(jParityAllows('E2', d(0.5), 'even', d(0.5), 'even')).toBe(false);
		expect(jParityAllows('E2', d(0.5), 'even', d(1.5), 'even')).toBe(true);
		expect(jParityAllows('E2', d(1), 'even', d(1), 'even')).toBe(true);
		expect(jParityAllows('E2', d(1), 'even', d(4), 'even')).toBe(false);
	});
	it('the rules are symmetric in the two levels (property)', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 0, max: 12 }),
				fc.integer({ min: 0, max: 12 }),
				fc.constantFrom('E1', 'M1', 'E2' as const),
				(a, b, type) => {
					return jParityAllows(type, a, 'even', b, 'odd') === jParityAllows(type, b, 'odd', a, 'even');
				}
			)
		);
	});
});

describe('LS rules: ΔS = 0, ΔL = 0, ±1 (not 0–0) for E1; intercombination lines flagged', () => {
	it('³P–³D° is LS-allowed, ³P–¹P° is an intercombination line, ²S–²S° and ²S–²D° break the L rule', () => {
		expect(lsVerdict('E1', T(1, 1), T(1, 2), false)).toEqual({
			spinConserved: true,
			orbitalAllowed: true,
			allowed: true,
			intercombination: false
		});
		expect(lsVerdict('E1', T(1, 1), T(0, 1), false)).toMatchObject({ allowed: false, intercombination: true });
		expect(lsVerdict('E1', T(0.5, 0), T(0.5, 0), false)).toMatchObject({ allowed: false, orbitalAllowed: false });
		expect(lsVerdict('E1', T(0.5, 0), T(0.5, 2), false)).toMatchObject({ allowed: false, orbitalAllowed: false });
	});
	it('M1 connects levels of one term only; E2 allows ΔL ≤ 2 (¹D–¹S, the nebular O III 4363-type auroral line)', () => {
		expect(lsVerdict('M1', T(1, 1), T(1, 1), true).allowed).toBe(true);
		expect(lsVerdict('M1', T(1, 1), T(0, 2), false).allowed).toBe(false);
		expect(lsVerdict('E2', T(0, 2), T(0, 0), false).allowed).toBe(true);
	});
	it('intercombination lines are listed, flagged, with no LS strength', () => {
		const lower: SpectralLevel[] = [{ twoJ: 0, parity: 'even', term: T(0, 0) }];
		const upper: SpectralLevel[] = [{ twoJ: d(1), parity: 'odd', term: T(1, 1) }];
		const [t] = transitionsBetween(lower, upper, { types: ['E1'] });
		expect(t.ls?.intercombination).toBe(true);
		expect(t.strength).toBeNull();
		expect(t.multiplet).toBe('¹S–³P°');
	});
});

describe('multiplet labels', () => {
	it('writes ³P–³D° with ° on the odd term', () => {
		expect(multipletLabel(T(1, 1), 'even', T(1, 2), 'odd')).toBe('³P–³D°');
		expect(termSymbol(T(2.5, 3), 'odd')).toBe('⁶F°');
		expect(termSymbol(T(5.5, 0), 'even')).toBe('¹²S');
		expect(termSymbol(T(1, 1), 'odd', { ascii: true })).toBe('3Po');
	});
	it('reads term symbols back: 3P, ²D°, 4Fo; refuses J letters and zero multiplicity', () => {
		expect(parseTermSymbol('3P')).toEqual({ twoS: 2, L: 1, parity: null });
		expect(parseTermSymbol('²D°')).toEqual({ twoS: 1, L: 2, parity: 'odd' });
		expect(parseTermSymbol(' 4Fo ')).toEqual({ twoS: 3, L: 3, parity: 'odd' });
		expect(() => parseTermSymbol('3J')).toThrow(/L letter \(S P D F G H I K/);
		expect(() => parseTermSymbol('0S')).toThrow(/multiplicity/);
	});
});

describe('relative line strengths in LS multiplets, S ∝ (2J+1)(2J′+1){L J S; J′ L′ 1}²', () => {
	it('²S–²P°: ²S₁/₂–²P°₃/₂ : ²S₁/₂–²P°₁/₂ = 2 : 1 (the alkali doublet; Condon & Shortley 1935 ch. IX)', () => {
		// Normalised to (2S+1)(2L+1)(2L′+1) = 2·1·3 = 6.
		expect(table('E1', T(0.5, 0), T(0.5, 1))).toEqual({ '0.5–1.5': '4', '0.5–0.5': '2' });
	});
	it('³S–³P°: J′ = 2, 1, 0 as 5 : 3 : 1 (Condon & Shortley 1935 ch. IX; the upper-level weights 2J′+1)', () => {
		expect(table('E1', T(1, 0), T(1, 1))).toEqual({ '1–2': '5', '1–1': '3', '1–0': '1' });
	});
	it("³P–³D°: 84 : 45 : 20 : 15 : 15 : 1 (the classic multiplet table, e.g. Allen's Astrophysical Quantities; from memory)", () => {
		// Total (2S+1)(2L+1)(2L′+1) = 45 = 180/4, so every printed number appears divided by 4.
		const t = table('E1', T(1, 1), T(1, 2));
		const scaled = Object.fromEntries(Object.entries(t).map(([k, v]) => [k, new Fraction(v).mul(4).toFraction()]));
		expect(scaled).toEqual({ '2–3': '84', '2–2': '15', '2–1': '1', '1–2': '45', '1–1': '15', '0–1': '20' });
	});
	it('shares add up to 1 and the strongest line has ofStrongest = 1 (³P–³D°: 84/180 = 7/15)', () => {
		const lines = multipletLines('E1', T(1, 1), T(1, 2))!;
		expect(lines.reduce((a, l) => a.add(new Fraction(l.strength.share)), new Fraction(0)).toFraction()).toBe('1');
		expect(lines[0].strength).toMatchObject({ share: '7/15', ofStrongest: 1 });
		expect(lines[0].strength.shareValue).toBeCloseTo(7 / 15, 15);
	});
	it('LS-forbidden multiplets and M1 have no strengths', () => {
		expect(multipletLines('E1', T(1, 1), T(0, 1))).toBeNull();
		expect(multipletLines('M1', T(1, 1), T(1, 1))).toBeNull();
	});

	// Sum rules (Condon & Shortley 1935 ch. IX §2; Edmonds 1957 eq. 6.2.9 orthogonality): the lines from each
	// lower level J add up to (2J+1)(2L′+1), those into each upper level J′ to (2J′+1)(2L+1).
	const termArb = fc.record({ twoS: fc.integer({ min: 0, max: 7 }), L: fc.integer({ min: 0, max: 5 }) });
	it.each(['E1', 'E2'] as const)('%s: sums over J are proportional to 2J+1 on both sides (property)', (type) => {
		fc.assert(
			fc.property(termArb, fc.integer({ min: -2, max: 2 }), (lower, dL) => {
				const upper = { twoS: lower.twoS, L: lower.L + dL };
				if (upper.L < 0) return true;
				const lines = multipletLines(type, lower, upper);
				if (!lines) return !lsVerdict(type, lower, upper, false).allowed;
				const byLower = new Map<number, Fraction>();
				const byUpper = new Map<number, Fraction>();
				for (const l of lines) {
					const s = new Fraction(l.strength.exact);
					byLower.set(l.twoJLower, (byLower.get(l.twoJLower) ?? new Fraction(0)).add(s));
					byUpper.set(l.twoJUpper, (byUpper.get(l.twoJUpper) ?? new Fraction(0)).add(s));
				}
				const okLower = [...byLower].every(([tj, s]) => s.equals((tj + 1) * (2 * upper.L + 1)));
				const okUpper = [...byUpper].every(([tj, s]) => s.equals((tj + 1) * (2 * lower.L + 1)));
				const total = lines.reduce((a, l) => a.add(new Fraction(l.strength.exact)), new Fraction(0));
				return okLower && okUpper && total.equals((lower.twoS + 1) * (2 * lower.L + 1) * (2 * upper.L + 1));
			})
		);
	});
});

describe('transitionsBetween', () => {
	// 2p² ³P (J = 0, 1, 2) and 2p3s ³P° (J = 0, 1, 2): E1 gives 6 of the 9 pairs (0–0 is forbidden; 0–2 and 2–0 have ΔJ = 2).
	const lower: SpectralLevel[] = [0, 1, 2].map((J) => ({ twoJ: d(J), parity: 'even', term: T(1, 1) }));
	const upper: SpectralLevel[] = [0, 1, 2].map((J) => ({ twoJ: d(J), parity: 'odd', term: T(1, 1) }));
	it('³P–³P°: six E1 lines (0–1, 1–0, 1–1, 1–2, 2–1, 2–2), all LS-allowed', () => {
		const list = transitionsBetween(lower, upper, { types: ['E1'] });
		expect(list.map((t) => `${t.lower}–${t.upper}`)).toEqual(['0–1', '1–0', '1–1', '1–2', '2–1', '2–2']);
		expect(list.every((t) => t.ls?.allowed && t.multiplet === '³P–³P°')).toBe(true);
		// Sum rule: from J = 2 the strengths add to (2J+1)(2L′+1) = 15.
		const fromTwo = list.filter((t) => t.lower === 2).reduce((a, t) => a.add(new Fraction(t.strength!.exact)), new Fraction(0));
		expect(fromTwo.toFraction()).toBe('15');
	});
	it('within one term (forbidden lines of ³P): M1 0–1 and 1–2, E2 0–2 and 1–2', () => {
		const list = transitionsBetween(lower, lower, { types: ['M1', 'E2'], within: true });
		expect(list.map((t) => `${t.type} ${t.lower}–${t.upper}`)).toEqual(['M1 0–1', 'E2 0–2', 'M1 1–2', 'E2 1–2']);
	});
	it('orients pairs by energy within one list', () => {
		const levels: SpectralLevel[] = [
			{ twoJ: 2, parity: 'even', energy: 100 },
			{ twoJ: 4, parity: 'even', energy: 0 }
		];
		expect(transitionsBetween(levels, levels, { types: ['M1'], within: true })).toMatchObject([{ lower: 1, upper: 0, ls: null }]);
	});
	it('states its limits before working and names bad input', () => {
		const many: SpectralLevel[] = Array.from({ length: 1500 }, () => ({ twoJ: 2, parity: 'even' }));
		expect(() => transitionsBetween(many, many)).toThrow(new RegExp(`at most ${MAX_TRANSITION_PAIRS}`));
		expect(() => transitionsBetween([{ twoJ: -1, parity: 'even' }], upper)).toThrow(/lower level 0: 2J must be a non-negative integer/);
		expect(() => transitionsBetween(lower, upper, { types: ['E3' as 'E1'] })).toThrow(/use E1, M1 or E2/);
	});
	it('never lists a pair that breaks the J and parity rules (property)', () => {
		const levelArb = fc.record({ twoJ: fc.integer({ min: 0, max: 8 }), parity: fc.constantFrom('even', 'odd' as const) });
		fc.assert(
			fc.property(fc.array(levelArb, { maxLength: 8 }), fc.array(levelArb, { maxLength: 8 }), (a, b) => {
				const list = transitionsBetween(a, b);
				const count = a
					.flatMap((x) =>
						b.map((y) => ['E1', 'M1', 'E2'].filter((t) => jParityAllows(t as 'E1', x.twoJ, x.parity, y.twoJ, y.parity)).length)
					)
					.reduce((s, n) => s + n, 0);
				return (
					list.length === count &&
					list.every((t) => jParityAllows(t.type, a[t.lower].twoJ, a[t.lower].parity, b[t.upper].twoJ, b[t.upper].parity))
				);
			})
		);
	});
});
