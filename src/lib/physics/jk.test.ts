import { describe, expect, it } from 'vitest';
import { JkNotApplicable, jkLevelCountsByJ, jkLevels, jkSplit } from './jk';
import { parseConfiguration } from './parse';
import { levelCountsByJ } from './terms';
import { L_LETTERS } from './letters';

const levels = (config: string) => jkLevels(parseConfiguration(config));

describe('jK coupling of Ne I 2p⁵ 3p', () => {
	const ne = levels('1s2 2s2 2p5 3p');

	it('has ten levels: K = 1/2, 3/2, 5/2 on ²P°₃/₂ and K = 1/2, 3/2 on ²P°₁/₂', () => {
		// Cowan (1981), sec. 4.12, pair coupling of 2p⁵3p (from memory): K = J_core + l with l = 1.
		const ks = (twoJc: number) => [...new Set(ne.filter((l) => l.core.twoJ === twoJc).map((l) => l.twoK / 2))];
		expect(ne).toHaveLength(10);
		expect(ks(3)).toEqual([0.5, 1.5, 2.5]);
		expect(ks(1)).toEqual([0.5, 1.5]);
	});

	it('the core ²P°₃/₂ level comes first (inverted p⁵), each K giving J = K ± ½', () => {
		// Hund's third rule for a more than half-full p shell: J = 3/2 lowest (Ne II ground ²P°₃/₂, NIST ASD from memory).
		expect(ne.map((l) => l.label)).toEqual([
			'2p⁵(²P°₃/₂)3p ²[1/2]₀',
			'2p⁵(²P°₃/₂)3p ²[1/2]₁',
			'2p⁵(²P°₃/₂)3p ²[3/2]₁',
			'2p⁵(²P°₃/₂)3p ²[3/2]₂',
			'2p⁵(²P°₃/₂)3p ²[5/2]₂',
			'2p⁵(²P°₃/₂)3p ²[5/2]₃',
			'2p⁵(²P°₁/₂)3p ²[1/2]₀',
			'2p⁵(²P°₁/₂)3p ²[1/2]₁',
			'2p⁵(²P°₁/₂)3p ²[3/2]₁',
			'2p⁵(²P°₁/₂)3p ²[3/2]₂'
		]);
	});

	it('odd configurations put ° after [K]: 2p⁵3s ²[3/2]°₂, the lowest excited level of Ne I', () => {
		// Ne I 2p⁵(²P°₃/₂)3s ²[3/2]°₂ (NIST ASD, from memory).
		expect(levels('2p5 3s').map((l) => l.label)).toEqual([
			'2p⁵(²P°₃/₂)3s ²[3/2]°₁',
			'2p⁵(²P°₃/₂)3s ²[3/2]°₂',
			'2p⁵(²P°₁/₂)3s ²[1/2]°₀',
			'2p⁵(²P°₁/₂)3s ²[1/2]°₁'
		]);
	});
});

describe('jK and LS give the same number of levels of each J', () => {
	// Recoupling the same states cannot change the J count (Cowan 1981, sec. 4.12); the LS side is counted
	// independently from the M_J distribution (Condon & Shortley 1935, ch. VII).
	const cases: string[] = [];
	for (const n of [2, 3, 4, 5]) for (let l = 0; l <= 4; l++) cases.push(`${n}p5 ${Math.max(n + 1, l + 1)}${L_LETTERS[l]}`);
	for (const n of [3, 4, 5]) for (let l = 0; l <= 4; l++) cases.push(`${n}d9 ${Math.max(n + 1, l + 1)}${L_LETTERS[l]}`);

	it.each(cases)('%s', (config) => {
		const cfg = parseConfiguration(config);
		expect(Object.fromEntries(jkLevelCountsByJ(jkLevels(cfg)))).toEqual(Object.fromEntries(levelCountsByJ(cfg)));
	});

	it('also for an open core with several terms and subshells: 2p4 3s, 3d6 4s 4p, 2s 2p 3d', () => {
		for (const config of ['2p4 3s', '3d6 4s 4p', '1s2 2s 2p 3d', '4f2 5d']) {
			const cfg = parseConfiguration(config);
			expect(Object.fromEntries(jkLevelCountsByJ(jkLevels(cfg)))).toEqual(Object.fromEntries(levelCountsByJ(cfg)));
		}
	});
});

describe('core labels with parentage', () => {
	it('3d⁶ 4s 4p: the core level carries the core parentage, 3d⁶(⁵D)4s(⁶D₉/₂)4p', () => {
		expect(levels('3d6 4s 4p')[0].label).toBe('3d⁶(⁵D)4s(⁶D₉/₂)4p ²[7/2]°₃');
	});

	it('a repeated core term says which: 3d³(²D₅/₂, v=1)', () => {
		// d³ ²D twice, v = 1 and 3 (Racah 1943).
		const labels = levels('3d3 4s').map((l) => l.label);
		expect(labels).toContain('3d³(²D₅/₂, v=1)4s ²[5/2]₂');
		expect(labels).toContain('3d³(²D₅/₂, v=3)4s ²[5/2]₂');
	});
});

describe('where jK does not apply', () => {
	const reason = (config: string) => {
		try {
			jkSplit(parseConfiguration(config));
		} catch (e) {
			expect(e).toBeInstanceOf(JkNotApplicable);
			return (e as Error).message;
		}
		throw new Error(`expected jK to be refused for ${config}`);
	};

	it('closed shells, one open subshell, or two electrons outside are refused with the reason', () => {
		expect(reason('1s2 2s2 2p6')).toMatch(/every subshell here is closed/);
		expect(reason('2p2')).toMatch(/holds 2 electrons/);
		expect(reason('2p6 3p')).toMatch(/3p is the only open subshell/);
		expect(reason('2p5 3p2')).toMatch(/the last open subshell, 3p2, holds 2 electrons/);
	});
});
