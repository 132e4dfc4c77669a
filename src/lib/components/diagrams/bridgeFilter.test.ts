/**
 * Filtering the Coupling bridge by J. Check values: the LS levels of 2p 3d are ¹P₁ ³P₀,₁,₂ ¹D₂
 * ³D₁,₂,₃ ¹F₃ ³F₂,₃,₄ (non-equivalent p d, Condon & Shortley 1935, ch. VII), so by J: 0 → 1,
 * 1 → 3, 2 → 4, 3 → 3, 4 → 1 level, 12 in all; jj and jK have the same count of each J (Cowan 1981,
 * sec. 4.12). The bridge itself comes from the engine (the API's compute task).
 */
import { describe, expect, it } from 'vitest';
import { TASKS } from '../../server/compute/tasks';
import { bridgeForJ, bridgeJValues } from './bridgeFilter';
import type { BridgeResponse } from '$lib/api/types';

const full = TASKS.bridge.run({ config: '2p 3d' }) as BridgeResponse;

describe('Coupling bridge filtered by J', () => {
	it('2p 3d has J = 0…4 with 1, 3, 4, 3, 1 levels', () => {
		expect(bridgeJValues(full)).toEqual([
			{ J: '0', count: 1 },
			{ J: '1', count: 3 },
			{ J: '2', count: 4 },
			{ J: '3', count: 3 },
			{ J: '4', count: 1 }
		]);
	});

	it('J = 1 and 3 keep 6 levels on every side, every link between kept levels of its own J', () => {
		const part = bridgeForJ(full, ['1', '3']);
		expect([part.ls.length, part.jj.length, part.jk?.length]).toEqual([6, 6, 6]);
		expect(part.ls.every((l) => l.J === '1' || l.J === '3')).toBe(true);
		expect(part.links).toHaveLength(6);
		expect(part.jkLinks).toHaveLength(6);
		for (const l of part.links) {
			expect(part.ls[l.ls].J).toBe(l.J);
			expect(part.jj[l.jj].J).toBe(l.J);
		}
		for (const l of part.jkLinks) expect([part.ls[l.ls].J, part.jk![l.jk].J, part.jj[l.jj].J]).toEqual([l.J, l.J, l.J]);
	});

	it('keeps the schematic order of each column and the labels of the full bridge', () => {
		const part = bridgeForJ(full, ['2']);
		expect(part.ls.map((l) => l.label)).toEqual(full.ls.filter((l) => l.J === '2').map((l) => l.label));
		expect(part.jj.map((l) => l.label)).toEqual(full.jj.filter((l) => l.J === '2').map((l) => l.label));
		// Each kept link joins the same two levels as in the full bridge.
		const named = (d: typeof full) => d.links.map((l) => `${d.ls[l.ls].label}—${d.jj[l.jj].label}`);
		expect(named(part)).toEqual(named(full).filter((_, k) => full.links[k].J === '2'));
	});

	it('no choice or an empty choice keeps the whole bridge', () => {
		expect(bridgeForJ(full, null)).toBe(full);
		expect(bridgeForJ(full, [])).toBe(full);
	});
});
