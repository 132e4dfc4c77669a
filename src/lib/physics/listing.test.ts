import { describe, expect, it } from 'vitest';
import { combinations } from 'combinatorial-generators';
import {
	DETERMINANT_LIST_LIMIT,
	MAX_MICROSTATE_PAGE,
	iterateMicrostates,
	listMicrostates,
	spinOrbitalAt,
	unrankCombination
} from './listing';
import { binomial, countAt, microstateGrid } from './microstates';
import { parseConfiguration } from './parse';

describe('paginated microstates', () => {
	it('p2 has 15 microstates; the first is m_l = 1↑ 1↓ (M_L = 2, M_S = 0)', () => {
		// C(6,2) = 15 (general fact); first in the documented order.
		const page = listMicrostates(parseConfiguration('2p2'), { offset: 0, limit: 3 });
		expect(page.total).toBe(15n);
		expect(page.items).toHaveLength(3);
		expect(page.items[0].spinOrbitals).toEqual([
			[
				{ n: 2, l: 1, ml: 1, twoMs: 1 },
				{ n: 2, l: 1, ml: 1, twoMs: -1 }
			]
		]);
		expect(page.items[0].ML).toBe(2);
		expect(page.items[0].twoMS).toBe(0);
	});

	it('the tally of all listed microstates of 3d2 4p equals the (M_L, M_S) grid', () => {
		const cfg = parseConfiguration('3d2 4p');
		const grid = microstateGrid(cfg);
		const tally = new Map<string, bigint>();
		let n = 0n;
		for (const m of iterateMicrostates(cfg)) {
			const k = `${m.ML},${m.twoMS}`;
			tally.set(k, (tally.get(k) ?? 0n) + 1n);
			n++;
		}
		expect(n).toBe(45n * 6n);
		for (const [k, v] of tally) {
			const [ML, twoMS] = k.split(',').map(Number);
			expect(countAt(grid, ML, twoMS)).toBe(v);
		}
	});

	it('a page at an offset equals the same slice of the full listing', () => {
		const cfg = parseConfiguration('2p3 3d');
		const all = [...iterateMicrostates(cfg)];
		const page = listMicrostates(cfg, { offset: 117, limit: 40 });
		expect(page.items).toEqual(all.slice(117, 157));
		expect(page.items[0].index).toBe(117n);
	});

	it('no microstate is listed twice (2p3 3d)', () => {
		const seen = new Set<string>();
		for (const m of iterateMicrostates(parseConfiguration('2p3 3d'))) seen.add(JSON.stringify(m.spinOrbitals));
		expect(seen.size).toBe(20 * 10);
	});

	it('closed subshells are left out unless asked for', () => {
		const cfg = parseConfiguration('[He] 2s 2p');
		expect(listMicrostates(cfg, { limit: 1 }).items[0].spinOrbitals).toHaveLength(2);
		expect(listMicrostates(cfg, { limit: 1, includeClosed: true }).items[0].spinOrbitals).toHaveLength(3);
	});

	it('a far page of a huge configuration is reached directly (4f7 5g9 6h11, offset 10^13)', () => {
		const cfg = parseConfiguration('4f7 5g9 6h11');
		const page = listMicrostates(cfg, { offset: 10n ** 13n, limit: 2 });
		expect(page.total).toBe(3432n * 48620n * 705432n);
		expect(page.items.map((i) => i.index)).toEqual([10n ** 13n, 10n ** 13n + 1n]);
		for (const item of page.items) {
			expect(item.spinOrbitals.map((s) => s.length)).toEqual([7, 9, 11]);
			expect(item.ML).toBe(item.spinOrbitals.flat().reduce((a, o) => a + o.ml, 0));
		}
	});

	it('an offset past the end gives an empty page', () => {
		expect(listMicrostates(parseConfiguration('2p2'), { offset: 15 }).items).toEqual([]);
	});

	it(`limit above ${MAX_MICROSTATE_PAGE} and a negative offset are refused`, () => {
		const cfg = parseConfiguration('2p2');
		expect(() => listMicrostates(cfg, { limit: 501 })).toThrow(/from 0 to 500/);
		expect(() => listMicrostates(cfg, { offset: -1 })).toThrow(/non-negative integer/);
	});
});

describe('unranking determinants', () => {
	it('unranking agrees with the lexicographic order of combinations (C(10, 5) = 252, all ranks)', () => {
		const all = [
			...combinations(
				Array.from({ length: 10 }, (_, i) => i),
				5
			)
		];
		all.forEach((c, k) => expect(unrankCombination(10, 5, BigInt(k))).toEqual(c));
	});

	it(`unranking agrees with combinations for g9, a subshell above the list limit of ${DETERMINANT_LIST_LIMIT}`, () => {
		expect(binomial(18, 9) > BigInt(DETERMINANT_LIST_LIMIT)).toBe(true);
		let k = 0n;
		for (const c of combinations(
			Array.from({ length: 18 }, (_, i) => i),
			9
		)) {
			if (k % 97n === 0n) expect(unrankCombination(18, 9, k)).toEqual(c);
			k++;
		}
		expect(k).toBe(48620n);
	});

	it('rank out of range is refused', () => {
		expect(() => unrankCombination(4, 2, 6n)).toThrow(/from 0 to 5/);
	});

	it('spin-orbital order: (1,↑) (1,↓) (0,↑) (0,↓) (−1,↑) (−1,↓) for p', () => {
		expect([0, 1, 2, 3, 4, 5].map((i) => spinOrbitalAt(1, i))).toEqual([
			{ ml: 1, twoMs: 1 },
			{ ml: 1, twoMs: -1 },
			{ ml: 0, twoMs: 1 },
			{ ml: 0, twoMs: -1 },
			{ ml: -1, twoMs: 1 },
			{ ml: -1, twoMs: -1 }
		]);
	});
});
