import { describe, expect, it } from 'vitest';
import { HUND_CAUTION, hundGround, hundOrder, hundWording } from './hund';
import { levelLabel } from './terms';
import { parseConfiguration } from './parse';
import { groundConfiguration } from './elements';

/** "3P0"-style label of the Hund ground level. */
function ground(text: string): string {
	const h = hundGround(parseConfiguration(text));
	return levelLabel(h.term, h.twoJ);
}

describe("Hund's rules for one open subshell (rigorous)", () => {
	// Observed ground levels of neutral atoms: NIST Atomic Spectra Database / CRC Handbook
	// periodic table of ground levels (from memory). Hund's rules reproduce each of them.
	const atoms: [string, string, string][] = [
		['C', '[He] 2s2 2p2', '3P0'],
		['N', '[He] 2s2 2p3', '4S3/2'],
		['O', '[He] 2s2 2p4', '3P2'],
		['F', '[He] 2s2 2p5', '2P3/2'],
		['Ti', '[Ar] 3d2 4s2', '3F2'],
		['V', '[Ar] 3d3 4s2', '4F3/2'],
		['Mn', '[Ar] 3d5 4s2', '6S5/2'],
		['Fe', '[Ar] 3d6 4s2', '5D4'],
		['Co', '[Ar] 3d7 4s2', '4F9/2'],
		['Ni', '[Ar] 3d8 4s2', '3F4']
	];
	for (const [symbol, cfg, level] of atoms) {
		it(`${symbol} ${cfg} has ground level ${level}`, () => {
			expect(ground(cfg)).toBe(level);
			expect(hundGround(parseConfiguration(cfg)).rigorous).toBe(true);
			// The ground configuration module agrees with the configuration used here.
			expect(groundConfiguration(symbol).configuration.subshells).toEqual(parseConfiguration(cfg).subshells);
		});
	}

	// Trivalent lanthanide ions, 4f^n: Kittel, Introduction to Solid State Physics, table of
	// effective magneton numbers of trivalent lanthanide ions (ground levels column); Ashcroft &
	// Mermin (1976) ch. 31, table of Ln³⁺ ground levels (from memory).
	const ions: [string, string, string][] = [
		['Ce³⁺', '[Xe] 4f', '2F5/2'],
		['Nd³⁺', '[Xe] 4f3', '4I9/2'],
		['Sm³⁺', '[Xe] 4f5', '6H5/2'],
		['Eu³⁺', '[Xe] 4f6', '7F0'],
		['Gd³⁺', '[Xe] 4f7', '8S7/2'],
		['Tb³⁺', '[Xe] 4f8', '7F6'],
		['Dy³⁺', '[Xe] 4f9', '6H15/2'],
		['Ho³⁺', '[Xe] 4f10', '5I8'],
		['Er³⁺', '[Xe] 4f11', '4I15/2'],
		['Yb³⁺', '[Xe] 4f13', '2F7/2']
	];
	for (const [label, cfg, level] of ions) {
		it(`${label} ${cfg} has ground level ${level}`, () => {
			expect(ground(cfg)).toBe(level);
			expect(hundGround(parseConfiguration(cfg)).rigorous).toBe(true);
		});
	}

	it('closed shells only give 1S0, rigorous', () => {
		const h = hundGround(parseConfiguration('[Ne]'));
		expect(levelLabel(h.term, h.twoJ)).toBe('1S0');
		expect(h.rigorous).toBe(true);
	});

	it('the reason names the open subshell and the filling', () => {
		expect(hundGround(parseConfiguration('[Ar] 3d6 4s2')).reason).toMatch(/3d6.*more than half full/);
	});
});

describe("Hund's rules for several open subshells (heuristic)", () => {
	it('3d5 4s gives 7S3, not rigorous (Cr I ground level 7S3)', () => {
		// Cr I ground level a⁷S₃ (NIST ASD, from memory); 504 microstates, two open subshells.
		const h = hundGround(parseConfiguration('[Ar] 3d5 4s'));
		expect(levelLabel(h.term, h.twoJ)).toBe('7S3');
		expect(h.rigorous).toBe(false);
		expect(h.reason).toMatch(/heuristic/);
	});

	it('3d6 4s gives 6D9/2 (Fe II ground level a6D9/2)', () => {
		// Fe II ground level a⁶D₉/₂ (NIST ASD, from memory).
		expect(ground('[Ar] 3d6 4s')).toBe('6D9/2');
	});

	it('3d2 4s gives 4F3/2 (Ti II ground level a4F3/2)', () => {
		// Ti II ground level a⁴F₃/₂ (NIST ASD, from memory).
		expect(ground('[Ar] 3d2 4s')).toBe('4F3/2');
	});

	it('4f7 5d 6s2 gives 9D2 (Gd I ground level 9D°2)', () => {
		// Gd I ground level ⁹D°₂ (NIST ASD, from memory).
		expect(ground('[Xe] 4f7 5d 6s2')).toBe('9D2');
	});

	it('4f 5d 6s2 gives 3H4, but Ce I is observed as 1G°4: the heuristic breaks', () => {
		// Ce I ground level ¹G°₄ (NIST ASD, from memory): a known failure of the simple rules.
		const h = hundGround(parseConfiguration('[Xe] 4f 5d 6s2'));
		expect(levelLabel(h.term, h.twoJ)).toBe('3H4');
		expect(h.rigorous).toBe(false);
	});
});

describe('heuristic order of terms', () => {
	it('p2: 3P (J = 0, 1, 2), then 1D, then 1S', () => {
		// Observed order in C I: ³P₀ < ³P₁ < ³P₂ < ¹D₂ < ¹S₀ (NIST ASD, from memory).
		const order = hundOrder(parseConfiguration('2p2'));
		expect(order.map((t) => `${t.term.twoS + 1}${t.term.L}:${t.twoJs.join(',')}`)).toEqual(['31:0,2,4', '12:4', '10:0']);
		expect(order[0].order).toBe('normal');
	});

	it('p4: 3P inverted (J = 2, 1, 0) first', () => {
		// Observed order in O I: ³P₂ < ³P₁ < ³P₀ (NIST ASD, from memory).
		const order = hundOrder(parseConfiguration('2p4'));
		expect(order[0].twoJs).toEqual([4, 2, 0]);
		expect(order[0].order).toBe('inverted');
	});

	it('p3 (half full) leaves the J order undetermined', () => {
		expect(hundOrder(parseConfiguration('2p3')).every((t) => t.order === 'undetermined')).toBe(true);
	});

	it('terms come largest S first, then largest L', () => {
		const order = hundOrder(parseConfiguration('3d3'));
		for (let i = 1; i < order.length; i++) {
			const a = order[i - 1].term;
			const b = order[i].term;
			expect(a.twoS > b.twoS || (a.twoS === b.twoS && a.L >= b.L)).toBe(true);
		}
	});
});

describe('the caution', () => {
	it('says the rules are approximations, rigorous only for one open subshell, and broken by known ground levels', () => {
		expect(HUND_CAUTION).toMatch(/approximations/);
		expect(HUND_CAUTION).toMatch(/single open subshell of equivalent electrons/);
		expect(HUND_CAUTION).toMatch(/known ground levels break the simple rules/);
	});
});

describe('Hund wording: ground level or lowest level (heuristic)', () => {
	it('one open subshell in a ground-like configuration says ground level: 2p2, [Ar] 3d6 4s2', () => {
		// C I 2p² and Fe I 3d⁶4s² are ground configurations (NIST/CRC periodic table).
		expect(hundWording(parseConfiguration('1s2 2s2 2p2')).kind).toBe('ground');
		expect(hundWording(parseConfiguration('[Ar] 3d6 4s2')).phrase).toBe("ground level by Hund's rules");
	});

	it('several open subshells say lowest level (heuristic): 3d6 4s, 2p5 3p', () => {
		expect(hundWording(parseConfiguration('3d6 4s')).phrase).toBe("lowest level by Hund's rules (heuristic)");
		expect(hundWording(parseConfiguration('2p5 3p')).kind).toBe('lowest');
	});

	it('an excited configuration with one open subshell says lowest level: 1s2 2s2 3p2, 2p5 3s2', () => {
		// 2p empty below 3p, 2p open below a full 3s: excited by the Madelung filling order (Madelung 1936).
		expect(hundWording(parseConfiguration('1s2 2s2 3p2')).kind).toBe('lowest');
		expect(hundWording(parseConfiguration('1s2 2s2 2p5 3s2')).kind).toBe('lowest');
	});
});
