import { describe, expect, it } from 'vitest';
import { couplingSweep } from '$lib/physics/sweep';
import { parametersBody } from '$lib/components/energy/parameters';
import { presetsFor, presetValues, startingPreset } from '$lib/components/energy/presets';
import { spreadLabels, sweepBox, sweepLayout, sweepLsText, sweepJjText } from './sweepLayout';

// The Energy solver's own start for 2p2: the C I set (F² = 42 500, ζ = 27 cm⁻¹), so F2 = F²/25 = 1700.
const ids = ['F2(2p,2p)', 'zeta(2p)'];
const preset = startingPreset(presetsFor(ids), '[He] 2s2 2p2', '2p2');
const parameters = parametersBody(presetValues(ids, preset), 0);
const sweep = couplingSweep('2p2', parameters, { points: 61 });
const box = sweepBox(sweep.curves.length);
const layout = sweepLayout(sweep, null, box);
const F2 = 42500 / 25;
const zeta = 27;

describe('the starting set the Coupling bridge shares with the Energy solver', () => {
	it('is the literature set derived for 2p2, and typical magnitudes for another configuration', () => {
		expect(preset?.id).toBe('c1-2p2');
		expect(startingPreset(presetsFor(['F2(3p,3p)', 'zeta(3p)']), '3p2', '3p2')).toBeNull();
		expect(presetValues(['zeta(4f)'], null)).toEqual({ 'zeta(4f)': 1000 }); // typicalValue, common practice, no source
	});
});

describe('sweep curve layout of 2p2', () => {
	it('draws one continuous polyline per level (p²: 5), 61 points, x from the LS end to the jj end', () => {
		expect(layout.curves).toHaveLength(5); // ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII)
		for (const c of layout.curves) {
			expect(c.points).toHaveLength(61);
			expect(c.points[0].x).toBe(box.x0);
			expect(c.points[60].x).toBe(box.x1);
			for (let k = 1; k < 61; k++) expect(c.points[k].x).toBeGreaterThan(c.points[k - 1].x);
			expect(c.polyline.split(' ')).toHaveLength(61);
		}
	});

	it('never crosses two curves of equal J (non-crossing rule, von Neumann & Wigner 1929)', () => {
		for (const J of ['0', '1', '2']) {
			const same = layout.curves.filter((c) => c.J === J).sort((a, b) => a.rank - b.rank);
			for (let r = 1; r < same.length; r++)
				for (let k = 0; k < 61; k++) expect(same[r].points[k].y, `J = ${J}, point ${k}`).toBeLessThan(same[r - 1].points[k].y);
		}
	});

	it('orders the LS end as p² at ζ = 0: ³P = F0 − 5F2, ¹D = F0 + F2, ¹S = F0 + 10F2, F2 = F²/25 (Condon & Shortley 1935)', () => {
		const byHeight = [...layout.left].sort((a, b) => b.y - a.y);
		expect(byHeight.map((l) => l.text.replace(/[₀-₉]/g, ''))).toEqual(['³P', '³P', '³P', '¹D', '¹S']);
		// Read back from the drawn heights through the axis: ¹D − ³P = 6F2, ¹S − ³P = 15F2.
		const P = layout.energyAt(byHeight[0].y);
		expect(layout.energyAt(byHeight[3].y) - P).toBeCloseTo(6 * F2, 6);
		expect(layout.energyAt(byHeight[4].y) - P).toBeCloseTo(15 * F2, 6);
		// The degenerate ³P labels are nudged apart, never overlapping, J increasing upwards (layout choice, no source).
		expect([...layout.left].sort((a, b) => b.labelY - a.labelY).map((l) => l.text)).toEqual(['³P₀', '³P₁', '³P₂', '¹D₂', '¹S₀']);
		const ys = layout.left.map((l) => l.labelY).sort((a, b) => a - b);
		for (let i = 1; i < ys.length; i++) expect(ys[i] - ys[i - 1]).toBeGreaterThanOrEqual(box.labelGap - 1e-9);
	});

	it('groups the jj end of p² into (1/2,1/2), (1/2,3/2), (3/2,3/2) with 1, 2, 2 levels: J = 0; 1, 2; 2, 0', () => {
		// One-electron energies −ζ (j = 1/2) and +ζ/2 (j = 3/2): pairs at −2ζ, −ζ/2, +ζ (Condon & Shortley 1935, ch. X).
		const right = [...layout.right].sort((a, b) => a.energy - b.energy);
		expect(right.map((g) => [g.text, g.count, [...g.J].sort()])).toEqual([
			['2p₁/₂²', 1, ['0']],
			['2p₁/₂ 2p₃/₂', 2, ['1', '2']],
			['2p₃/₂²', 2, ['0', '2']]
		]);
		expect(right[1].energy - right[0].energy).toBeCloseTo(1.5 * zeta, 6);
		// Each curve carries its two end energies for the text table: ¹S₀ ends in (3/2)², the top group.
		const S = layout.curves.find((c) => c.lsText === '¹S₀')!;
		expect(S.jjText).toBe('2p₃/₂²');
		expect(S.jjEnergy).toBeCloseTo(right[2].energy, 9);
		expect(S.lsEnergy).toBeCloseTo(layout.left.find((l) => l.text === '¹S₀')!.energy, 9);
		expect(right[2].energy - right[1].energy).toBeCloseTo(1.5 * zeta, 6);
	});

	it('draws only the chosen J, its axis spanning those curves (J = 2: ³P₂ and ¹D₂)', () => {
		const two = sweepLayout(sweep, ['2'], box);
		expect(two.curves.map((c) => c.lsText)).toEqual(['³P₂', '¹D₂']);
		const ys = two.curves.flatMap((c) => c.points.map((p) => p.y));
		expect(Math.min(...ys)).toBeCloseTo(box.top, 6);
		expect(Math.max(...ys)).toBeCloseTo(box.bottom, 6);
		expect(two.ticks.length).toBeGreaterThan(2);
		for (const t of two.ticks) expect(Number.isInteger(t.value)).toBe(true); // cm⁻¹ at round steps
	});
});

describe('stretched sweep of 2p2 (each t on its own scale)', () => {
	const stretched = sweepLayout(sweep, null, box, { stretch: true });
	const height = box.bottom - box.top;

	it('puts the lowest level of every t at the bottom and the highest at the top, with no energy ticks', () => {
		for (let k = 0; k < 61; k++) {
			const ys = stretched.curves.map((c) => c.points[k].y);
			expect(Math.max(...ys), `point ${k}`).toBeCloseTo(box.bottom, 6);
			expect(Math.min(...ys), `point ${k}`).toBeCloseTo(box.top, 6);
		}
		expect(stretched.stretched).toBe(true);
		expect(stretched.ticks).toEqual([]);
	});

	it('opens the jj end: −2ζ, −ζ/2, +ζ sit at the bottom, half-way and the top (Condon & Shortley 1935, ch. X)', () => {
		const right = [...stretched.right].sort((a, b) => a.energy - b.energy);
		expect(right.map((g) => (box.bottom - g.y) / height)).toEqual([0, 0.5, 1].map((v) => expect.closeTo(v, 9)));
		// Unstretched, the same three groups share 3ζ = 81 cm⁻¹ of a 15F2 = 25 500 cm⁻¹ axis.
		const plain = [...layout.right].sort((a, b) => a.energy - b.energy);
		expect((plain[0].y - plain[2].y) / height).toBeLessThan(0.01);
		expect(stretched.ends.jj.spread).toBeCloseTo(3 * zeta, 6);
	});

	it('keeps the order of the levels at every t, so curves of one J still do not cross (von Neumann & Wigner 1929)', () => {
		for (const J of ['0', '1', '2']) {
			const same = stretched.curves.filter((c) => c.J === J).sort((a, b) => a.rank - b.rank);
			for (let r = 1; r < same.length; r++) for (let k = 0; k < 61; k++) expect(same[r].points[k].y).toBeLessThan(same[r - 1].points[k].y);
		}
	});

	it('reads energies back per t: at the LS end ¹S − ³P = 15F2 as without stretch (Condon & Shortley 1935)', () => {
		const byHeight = [...stretched.left].sort((a, b) => b.y - a.y);
		expect(stretched.energyAt(byHeight[4].y, 0) - stretched.energyAt(byHeight[0].y, 0)).toBeCloseTo(15 * F2, 1);
		expect(stretched.ends.ls.spread).toBeCloseTo(layout.ends.ls.spread, 9);
	});
});

describe('sweep labels', () => {
	it('write LS and jj labels with super- and subscripts', () => {
		expect(sweepLsText('3P', '2', false)).toBe('³P₂');
		expect(sweepLsText('2D', '5/2', true)).toBe('²D°₅/₂');
		expect(sweepJjText('2p_{1/2}^2 2p_{3/2}')).toBe('2p₁/₂² 2p₃/₂');
	});
	it('spread crowded labels by the gap and keep their order', () => {
		expect(spreadLabels([100, 100, 100], 10, 0)).toEqual([100, 90, 80]);
		expect(spreadLabels([5, 6], 10, 0)).toEqual([0, 10]); // kept below the top, 5 still above 6
	});
});
