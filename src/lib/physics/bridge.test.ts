import { describe, expect, it } from 'vitest';
import { couplingBridge } from './bridge';
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
