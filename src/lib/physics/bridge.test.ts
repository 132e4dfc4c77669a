import { describe, expect, it } from 'vitest';
import { couplingBridge, parseZetaList } from './bridge';
import { parseConfiguration } from './parse';

const pair = (b: ReturnType<typeof couplingBridge>, lsLabel: string) => {
	const i = b.ls.findIndex((x) => x.label === lsLabel);
	const link = b.links.find((l) => l.ls === i)!;
	return b.jj[link.jj].level.subshellLabel + ' ' + b.jj[link.jj].level.couplingLabel;
};

describe('Coupling bridge (non-crossing rule)', () => {
	it('p²: ³P₀ ↔ p1/2², ¹S₀ ↔ p3/2², ³P₂ ↔ (1/2, 3/2)₂, ¹D₂ ↔ p3/2² J = 2', () => {
		// The p² LS–jj correlation diagram (Condon & Shortley 1935, ch. XI; Cowan 1981 §4-12) — from memory
		// of those figures; it follows from Hund's order on the left and spin–orbit order on the right.
		const b = couplingBridge(parseConfiguration('2p2'));
		expect(b.links).toHaveLength(5);
		expect(pair(b, '3P0')).toMatch(/^2p1\/2\^2 /);
		expect(pair(b, '1S0')).toMatch(/^2p3\/2\^2 /);
		expect(pair(b, '3P2')).toContain('2p1/2 2p3/2');
		expect(pair(b, '1D2')).toMatch(/^2p3\/2\^2 /);
	});

	it('np n′p joins 10 levels on each side, every link of equal J', () => {
		// Two inequivalent p electrons: ¹S ¹P ¹D ³S ³P ³D → 10 levels (Condon & Shortley ch. VII).
		const b = couplingBridge(parseConfiguration('2p 3p'));
		expect(b.ls).toHaveLength(10);
		expect(b.jj).toHaveLength(10);
		expect(b.links).toHaveLength(10);
		for (const l of b.links) expect(b.ls[l.ls].twoJ).toBe(b.jj[l.jj].twoJ);
		expect(new Set(b.links.map((l) => l.jj)).size).toBe(10);
	});

	it('p⁵: the j = 3/2 hole lies lowest on the jj side (²P₃/₂ ground, inverted)', () => {
		// Halogen-like p⁵ has an inverted ²P, ground ²P₃/₂ (NIST/CRC ground levels of F, Cl).
		const b = couplingBridge(parseConfiguration('2p5'));
		expect(b.ls[0].label).toBe('2P3/2');
		expect(b.jj[0].twoJ).toBe(3);
	});
});

describe('Coupling bridge with jK and one ζ per subshell', () => {
	it('2p⁵ 3p: the jj side groups by the core j, six levels on the 2p3/2 hole below four on the 2p1/2 hole', () => {
		// Ne I 2p⁵3p: ten levels in two groups by the core ²P°₃/₂ (six) and ²P°₁/₂ (four), because ζ(2p) ≫ ζ(3p)
		// (Cowan 1981 sec. 4.12, from memory). j = 3/2 hole with 3p1/2 gives J = 1, 2 and with 3p3/2 J = 0…3 (vector model).
		const b = couplingBridge(parseConfiguration('2p5 3p'));
		const coreOf = (x: (typeof b.jj)[number]) => (x.level.subshellLabel.includes('2p3/2^3') ? 'core 3/2' : 'core 1/2');
		expect(b.jj.map(coreOf)).toEqual([...Array(6).fill('core 3/2'), ...Array(4).fill('core 1/2')]);
		expect(b.zeta).toEqual([
			{ n: 2, l: 1, zeta: 1 },
			{ n: 3, l: 1, zeta: 1 / 45 }
		]);
	});

	it('2p⁵ 3p has a jK column of 10 levels, joined to both sides with equal J', () => {
		const b = couplingBridge(parseConfiguration('2p5 3p'));
		expect(b.jk).toHaveLength(10);
		expect(b.jkLinks).toHaveLength(10);
		for (const l of b.jkLinks) {
			expect(b.jk![l.jk].twoJ).toBe(l.twoJ);
			expect(b.ls[l.ls].twoJ).toBe(l.twoJ);
			expect(b.jj[l.jj].twoJ).toBe(l.twoJ);
		}
		// The jK column in core order: the first six on ²P°₃/₂ (K = 1/2, 3/2, 5/2), as the jj side.
		expect(b.jk!.slice(0, 6).every((x) => x.core.twoJ === 3)).toBe(true);
	});

	it('a ζ chosen by the user changes the jj order; jK does not apply to 2p² and says why', () => {
		const equal = couplingBridge(parseConfiguration('2p5 3p'), [{ n: 3, l: 1, zeta: 1 }]);
		expect(equal.jj.map((x) => x.spinOrbitWeight)).not.toEqual(
			couplingBridge(parseConfiguration('2p5 3p')).jj.map((x) => x.spinOrbitWeight)
		);
		const b = couplingBridge(parseConfiguration('2p2'));
		expect(b.jk).toBeNull();
		expect(b.jkReason).toMatch(/jK coupling needs/);
		expect(() => couplingBridge(parseConfiguration('2p5 3p'), [{ n: 4, l: 0, zeta: 1 }])).toThrow(/not open here/);
		expect(() => couplingBridge(parseConfiguration('2p5 3p'), [{ n: 3, l: 1, zeta: -1 }])).toThrow(/positive/);
	});
});

describe('ζ as written in the API', () => {
	it('reads 2p:1,3p:0.022 and refuses what it cannot read', () => {
		expect(parseZetaList('2p:1, 3p:0.022')).toEqual([
			{ n: 2, l: 1, zeta: 1 },
			{ n: 3, l: 1, zeta: 0.022 }
		]);
		expect(parseZetaList('')).toEqual([]);
		expect(() => parseZetaList('2p=1')).toThrow(/write subshell:value pairs/);
	});
});

describe('a bridge too large for its jK column', () => {
	it('4f7 5d 6p keeps its LS and jj sides and says why the jK column is left out (over the jK listing limit)', () => {
		const b = couplingBridge(parseConfiguration('4f7 5d 6p'));
		expect(b.jk).toBeNull();
		expect(b.jkReason).toMatch(/jK column is left out: .*at most \d+ are listed/);
		expect(b.links.length).toBe(b.ls.length);
	});
});
