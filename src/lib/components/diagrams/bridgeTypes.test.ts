/**
 * The Coupling bridge read one J at a time. 2p 3p has 10 levels: J = 0 ×2, 1 ×4, 2 ×3, 3 ×1
 * (¹S₀ ³P₀; ¹P₁ ³S₁ ³P₁ ³D₁; ¹D₂ ³P₂ ³D₂; ³D₃ — Condon & Shortley 1935, ch. VII, terms of np n'p).
 */
import { describe, expect, it } from 'vitest';
import { bridgeForJ, countsAgree, countsByJ } from './bridgeTypes';
import { couplingBridge } from '$lib/physics/bridge';
import { parseConfiguration } from '$lib/physics/parse';
import { halfString } from '$lib/physics/half';
import type { BridgeResponse } from '$lib/api/types';

function bridgeOf(config: string): BridgeResponse {
	const b = couplingBridge(parseConfiguration(config));
	return {
		configuration: { notation: config, pretty: config, parity: 'even' },
		schematic: true,
		ls: b.ls.map((x) => ({ label: x.label, J: halfString(x.twoJ) })),
		jj: b.jj.map((x) => ({ label: x.label, J: halfString(x.twoJ), group: '', subshells: '', spinOrbitWeight: x.spinOrbitWeight })),
		links: b.links.map((l) => ({ J: halfString(l.twoJ), ls: l.ls, jj: l.jj }))
	};
}

describe('bridge filtered by J', () => {
	it('2p 3p J = 1 keeps the 4 levels of each side and their 4 links, renumbered', () => {
		const all = bridgeOf('2p 3p');
		expect(Object.fromEntries(countsByJ(all.ls))).toEqual({ '0': 2, '1': 4, '2': 3, '3': 1 });
		const one = bridgeForJ(all, '1');
		expect(one.ls).toHaveLength(4);
		expect(one.jj).toHaveLength(4);
		expect(one.links).toHaveLength(4);
		for (const l of one.links) {
			expect(one.ls[l.ls].J).toBe('1');
			expect(one.jj[l.jj].J).toBe('1');
		}
		expect(countsAgree(one)).toBe(true);
		expect(bridgeForJ(all, null)).toBe(all);
	});
});
