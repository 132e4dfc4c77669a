/**
 * Grotrian layout. What it must do is the usual drawing convention of such diagrams (Grotrian 1928;
 * e.g. the term diagrams in Herzberg, Atomic Spectra and Atomic Structure, 1944, ch. I — from
 * memory): a column per term, spin systems side by side, energy upwards, lines drawn between the
 * two levels they join. The levels are the invented demo list of the Line matcher.
 */
import { describe, expect, it } from 'vitest';
import { grotrianLayout, grotrianLevels, type GrotrianLevel } from './grotrian';

const t = (mult: number, L: number) => ({ twoS: mult - 1, L });
// Invented light ion (src/lib/lines/demo.ts): 2p² ³P₀,₁,₂ ¹D₂ ¹S₀ and 2p3s ³P°₀,₁,₂ ¹P°₁.
const levels: GrotrianLevel[] = [
	{ energy: 0, twoJ: 0, parity: 'even', term: t(3, 1) },
	{ energy: 118.9, twoJ: 2, parity: 'even', term: t(3, 1) },
	{ energy: 322.4, twoJ: 4, parity: 'even', term: t(3, 1) },
	{ energy: 15840.6, twoJ: 4, parity: 'even', term: t(1, 2) },
	{ energy: 33702.2, twoJ: 0, parity: 'even', term: t(1, 0) },
	{ energy: 44269.8, twoJ: 0, parity: 'odd', term: t(3, 1) },
	{ energy: 44310.35, twoJ: 2, parity: 'odd', term: t(3, 1) },
	{ energy: 46980.2, twoJ: 2, parity: 'odd', term: t(1, 1) },
	{ energy: 50000, twoJ: 3, parity: 'odd', label: 'unassigned' }
];

describe('Grotrian layout', () => {
	const layout = grotrianLayout(levels, [
		{ lower: 1, upper: 6, weight: 1 },
		{ lower: 3, upper: 7, weight: 0.2 },
		{ lower: 0, upper: 99 }
	]);
	const col = (key: string) => layout.columns.find((c) => c.key === key)!;

	it('one column per term and parity: singlets left of triplets, S P D within a system, even before odd', () => {
		expect(layout.columns.map((c) => `${c.multiplicity ?? '-'}${c.letter ?? ''}${c.odd ? '°' : ''}`)).toEqual([
			'1S',
			'1P°',
			'1D',
			'3P',
			'3P°',
			'-°'
		]);
		expect(layout.columns.map((c) => c.x)).toEqual([...layout.columns.map((c) => c.x)].sort((a, b) => a - b));
	});

	it('energy upwards: a higher level is drawn higher (smaller y); the three ³P levels share a column', () => {
		const ys = layout.bars.map((b) => b.y);
		for (let i = 0; i + 1 < 5; i++) expect(ys[i + 1]).toBeLessThan(ys[i]);
		const x3P = col('3|1|even').x;
		expect(layout.bars.slice(0, 3).every((b) => (b.x1 + b.x2) / 2 === x3P)).toBe(true);
		expect(layout.bars[8].title).toBe('unassigned J = 3/2 at 50000 cm⁻¹');
	});

	it('a line joins the centres of its two bars, its width grows with its weight; a line to no level is counted, not drawn', () => {
		const [strong, weak] = layout.links;
		expect(strong).toMatchObject({ x1: col('3|1|even').x, y1: layout.bars[1].y, x2: col('3|1|odd').x, y2: layout.bars[6].y });
		expect(strong.width).toBeGreaterThan(weak.width);
		expect(layout.links).toHaveLength(2);
		expect(layout.skipped).toBe(1);
	});

	it('ticks of 1, 2 or 5 × 10ⁿ cm⁻¹ cover the range from the ground level', () => {
		expect(layout.ticks[0].energy).toBe(0);
		expect(layout.ticks.map((k) => k.energy)).toEqual([0, 10000, 20000, 30000, 40000, 50000]);
	});

	it('reads a level list as typed: J 3/2 and 1.5 are the same, "3P" and "²D°" are terms, an unreadable term goes to "other"', () => {
		const read = grotrianLevels([
			{ energy: 0, J: '3/2', parity: 'odd', term: '2P°' },
			{ energy: 10, J: '1.5', parity: 'even', term: '²D' },
			{ energy: 20, J: '2', parity: 'even', term: 'x?' }
		]);
		expect(read.map((l) => [l.twoJ, l.term])).toEqual([
			[3, { twoS: 1, L: 1 }],
			[3, { twoS: 1, L: 2 }],
			[4, null]
		]);
	});

	it('J labels of levels closer than a label step aside (³P₀,₁,₂ at 0, 119, 322 cm⁻¹ on a 50 000 cm⁻¹ scale)', () => {
		const [p0, p1, p2, d] = layout.bars;
		expect([p0.labelDx, p1.labelDx, p2.labelDx]).toEqual([2, 18, 34]);
		expect(d.labelDx).toBe(2);
	});
});
