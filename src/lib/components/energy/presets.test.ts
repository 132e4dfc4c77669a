import { describe, expect, it } from 'vitest';
import { LITERATURE_PRESETS, presetsFor, typicalValue } from './presets';

describe('literature starting sets', () => {
	it('turn a d^n set given as Racah B, C into F², F⁴ (F² = 49B + 7C, F⁴ = 63C/5; Racah 1942)', () => {
		const [v3] = presetsFor(['F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)']).filter((p) => p.id === 'v3-3d2');
		// B = 861, C = 4165 as the set's note quotes: 49·861 + 7·4165 = 71 344; 63·4165/5 = 52 479.
		expect(v3.values).toEqual({ 'F2(3d,3d)': 71344, 'F4(3d,3d)': 52479, 'zeta(3d)': 209 });
	});

	it('are offered only for the exact set of parameters they were made for', () => {
		expect(presetsFor(['F2(2p,2p)', 'zeta(2p)']).map((p) => p.id)).toEqual(['c1-2p2']);
		expect(presetsFor(['F2(2p,2p)', 'zeta(2p)', 'G1(2p,3s)'])).toEqual([]);
	});

	it('each say where their numbers come from and which configuration they belong to', () => {
		for (const p of LITERATURE_PRESETS) {
			expect(p.note.length, p.id).toBeGreaterThan(30);
			expect(p.config, p.id).toMatch(/^\d[spdf]\d+$/);
			expect(p.ids.sort(), p.id).toEqual(Object.keys(p.values).sort());
		}
	});

	it('typical magnitudes fall with k and are positive (common practice, no source)', () => {
		expect(typicalValue('F2(3d,3d)')).toBeGreaterThan(typicalValue('F4(3d,3d)'));
		expect(typicalValue('G1(2p,3s)')).toBeGreaterThan(0);
		expect(typicalValue('zeta(4f)')).toBe(1000);
	});
});
