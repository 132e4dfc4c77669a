/**
 * The Builder's state: the Rail and the notation text stay in sync, occupancies keep to the Pauli
 * limit, and a core blocks the subshells it holds. Capacities 2(2l+1) and the noble-gas cores are
 * general facts of the field (Condon & Shortley 1935; the NIST/CRC ground configurations of He … Rn).
 */
import { describe, expect, it } from 'vitest';
import { flushSync } from 'svelte';
import { BuilderState } from './builder.svelte';

const keys = (b: BuilderState) => b.rail.map((c) => `${c.key}${c.kind === 'subshell' ? c.occupancy : ''}`);

describe('BuilderState', () => {
	it('typing "[Ar] 3d5 4s" puts the core, 3d⁵ and 4s on the Rail and keeps the text as typed', () => {
		const b = new BuilderState('[Ar] 3d5 4s');
		expect(keys(b)).toEqual(['[Ar]', '3d5', '4s1']);
		expect(b.text).toBe('[Ar] 3d5 4s');
		expect(b.valid).toBe('[Ar] 3d5 4s');
	});

	it('a text that does not parse keeps the Rail of the last good text and reports the token', () => {
		const b = new BuilderState('2p3');
		b.setText('2p7');
		flushSync();
		expect(keys(b)).toEqual(['2p3']);
		expect(b.valid).toBeNull();
		expect(b.check.problem?.token).toBe('2p7');
		expect(b.check.problem?.message).toMatch(/at most 6/);
	});

	it('stepping a p chip stops at 6 electrons and at 1 (a p subshell holds 2(2·1+1) = 6)', () => {
		const b = new BuilderState('2p5');
		const id = b.rail[0].id;
		b.step(id, +1);
		b.step(id, +1);
		expect(b.text).toBe('2p6');
		b.setText('2p1');
		b.step(b.rail[0].id, -1);
		// Below 1 the step is refused: the text stays as typed.
		expect(b.text).toBe('2p1');
	});

	it('the [Ne] core blocks 2p and 2s but not 3s; a second core replaces the first', () => {
		const b = new BuilderState('[Ne] 3s');
		expect(b.blockedReason('2p')).toMatch(/inside the \[Ne\] core/);
		expect(b.blockedReason('3s')).toMatch(/already on the Rail/);
		expect(b.blockedReason('3p')).toBeNull();
		b.add('[Ar]');
		expect(keys(b)).toEqual(['[Ar]', '3s1']);
	});

	it('adding and removing chips rewrites the text from the Rail', () => {
		const b = new BuilderState('');
		b.add('3d');
		b.add('4s');
		expect(b.text).toBe('3d 4s');
		b.remove(b.rail[0].id);
		expect(b.text).toBe('4s');
		expect(b.announcement).toMatch(/3d removed/);
	});

	it('dropping a subshell that is already on the Rail does not add it twice', () => {
		const b = new BuilderState('3d2');
		const twin = { ...b.rail[0], id: 'tray-x' };
		b.drop([...b.rail, twin], 'tray-x');
		expect(keys(b)).toEqual(['3d2']);
	});

	it('clearing the text empties the Rail', () => {
		const b = new BuilderState('4f7');
		b.setText('  ');
		expect(b.rail).toEqual([]);
		expect(b.valid).toBeNull();
	});
});
