import { describe, expect, it } from 'vitest';
import { MAX_FINDER_LEVEL_PAIRS, electronJump, transitionFinder } from './finder';
import { parseConfiguration } from './parse';

const lineList = (m: { lines: { JLower: string; JUpper: string; strength: { exact: string } | null }[] }) =>
	m.lines.map((l) => `${l.JLower}–${l.JUpper}${l.strength ? ` ${l.strength.exact}` : ''}`);

describe('Transition finder between two configurations', () => {
	it('3s → 3p: one multiplet ²S–²P° with lines 4 : 2 (the alkali doublet 2 : 1; Condon & Shortley 1935 ch. IX)', () => {
		const r = transitionFinder('3s', '3p', ['E1']);
		expect(r.jump).toEqual({ from: '3s', to: '3p', deltaL: 1 });
		expect(r.oneElectronE1).toBe(true);
		expect(r.multiplets).toHaveLength(1);
		expect(r.multiplets[0]).toMatchObject({ label: '²S–²P°', type: 'E1', lsAllowed: true, intercombination: false });
		expect(lineList(r.multiplets[0])).toEqual(['1/2–3/2 4', '1/2–1/2 2']);
		expect(r.energies).toBe('unknown');
	});

	it('2p² → 2p 3s: ³P–³P°, ¹D–¹P°, ¹S–¹P° allowed; the ΔS ≠ 0 multiplets listed as intercombination lines', () => {
		// 2p² gives ¹S ¹D ³P, 2p3s gives ¹P° ³P° (Condon & Shortley 1935 ch. VII).
		const r = transitionFinder('1s2 2s2 2p2', '1s2 2s2 2p 3s', ['E1']);
		expect(r.jump).toEqual({ from: '2p', to: '3s', deltaL: -1 });
		const byLabel = Object.fromEntries(r.multiplets.map((m) => [m.label, m]));
		expect(Object.keys(byLabel).sort()).toEqual(['¹D–¹P°', '¹D–³P°', '¹S–¹P°', '¹S–³P°', '³P–¹P°', '³P–³P°'].sort());
		expect(byLabel['³P–³P°'].lsAllowed).toBe(true);
		expect(byLabel['³P–³P°'].lines).toHaveLength(6); // 9 J pairs less 0–0, 0–2, 2–0
		expect(byLabel['¹S–³P°']).toMatchObject({ intercombination: true, lsAllowed: false });
		expect(lineList(byLabel['¹S–³P°'])).toEqual(['0–1']); // only J = 0 → 1 survives the J rule
		expect(byLabel['³P–¹P°'].lines.every((l) => l.strength === null)).toBe(true);
	});

	it('flags E1 between configurations that do not differ by one electron with Δl = ±1', () => {
		expect(transitionFinder('3s', '4s', ['E2']).oneElectronE1).toBe(false);
		expect(electronJump(parseConfiguration('3d2'), parseConfiguration('4s2'))).toBeNull();
	});
});

describe('forbidden lines within one configuration', () => {
	it('2p²: the nebular lines ³P₁,₂–¹D₂ (M1, intercombination), ¹D₂–¹S₀ (E2) and ³P₁–¹S₀ (M1) (the [O III] 4959/5007, 4363, 2321 Å lines, from memory)', () => {
		const r = transitionFinder('2p2', '2p2', ['M1', 'E2']);
		expect(r.within).toBe(true);
		const m1 = r.multiplets.filter((m) => m.type === 'M1').flatMap((m) => lineList(m).map((l) => `${m.label} ${l}`));
		expect(m1.sort()).toEqual(['³P–³P 0–1', '³P–³P 1–2', '³P–¹D 1–2', '³P–¹D 2–2', '³P–¹S 1–0'].sort());
		expect(r.multiplets.find((m) => m.type === 'M1' && m.label === '³P–¹D')).toMatchObject({ intercombination: true, lsAllowed: false });
		const e2 = r.multiplets.find((m) => m.type === 'E2' && m.label === '¹D–¹S')!;
		expect(e2.lsAllowed).toBe(true);
		// A one-line multiplet carries the whole total (2S+1)(2L+1)(2L′+1) = 1·5·1 = 5.
		expect(lineList(e2)).toEqual(['2–0 5']);
	});
});

describe('budget', () => {
	it(`refuses more than ${MAX_FINDER_LEVEL_PAIRS} level pairs (4f⁷5d6s: 215 J levels of distinct terms, 4f⁷5d6p: 245)`, () => {
		expect(() => transitionFinder('4f7 5d 6s', '4f7 5d 6p', ['E1'])).toThrow(new RegExp(`at most ${MAX_FINDER_LEVEL_PAIRS}`));
	});
});
