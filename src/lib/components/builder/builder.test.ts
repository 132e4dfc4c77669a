/** The Rail and the notation field show the subshells in the same order (product rule, no source). */
import { describe, expect, it } from 'vitest';
import { BuilderState, railText } from './builder.svelte';

const keys = (b: BuilderState) => b.rail.map((c) => c.key);

describe('Rail and notation in the same order', () => {
	it('a drag that puts 4s before 3d writes "4s 3d5"', () => {
		const b = new BuilderState('3d5 4s');
		expect(keys(b)).toEqual(['3d', '4s']);
		const [d, s] = b.rail;
		b.drop([s, d], s.id);
		expect(keys(b)).toEqual(['4s', '3d']);
		expect(b.text).toBe('4s 3d5');
	});

	it('typing "4s 3d5" puts 4s first on the Rail; a core stays first', () => {
		const b = new BuilderState('3d5 4s');
		b.setText('4s 3d5');
		expect(keys(b)).toEqual(['4s', '3d']);
		b.setText('[Ar] 4s 3d6');
		expect(keys(b)).toEqual(['[Ar]', '4s', '3d']);
		expect(railText(b.rail)).toBe('[Ar] 4s 3d6');
	});

	it('moving a chip with the keyboard rewrites the text in the new order', () => {
		const b = new BuilderState('2p5 3p');
		b.move(b.rail[1].id, -1);
		expect(b.text).toBe('3p 2p5');
	});
});
