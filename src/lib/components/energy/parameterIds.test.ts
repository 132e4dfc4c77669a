import { describe, expect, it } from 'vitest';
import { intermediateLevels } from '$lib/physics/levels-ic';
import { solverParameterIds } from './parameterIds';

describe('the parameter ids the page works out agree with the engine’s answer', () => {
	it.each(['3d2', '2p 3s', '[He] 2s2 2p2', '[Xe] 4f2 5d', '3d5 4s 4p', '4f 5d 6s'])('%s', (text) => {
		const answer = intermediateLevels(text, {});
		expect(solverParameterIds(text)).toEqual({ config: answer.config, ids: answer.parameters.map((p) => p.id) });
	});

	it('names F², F⁴ and ζ for d² (Cowan 1981, ch. 13 — chapter from memory), and G¹ but no F between p and s (k ≤ 2·min(l, l′) = 0)', () => {
		expect(solverParameterIds('3d2')?.ids).toEqual(['F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)']);
		expect(solverParameterIds('2p 3s')?.ids).toEqual(['zeta(2p)', 'G1(2p,3s)']);
	});

	it('is null for text that is not a configuration', () => {
		expect(solverParameterIds('3x2')).toBeNull();
		expect(solverParameterIds('')).toBeNull();
	});
});
