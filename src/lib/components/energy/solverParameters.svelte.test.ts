/**
 * The Builder's store of the Energy solver's parameters per configuration. The check values are the
 * solver's own bookkeeping (common practice, no source): what is kept comes back unchanged, a set
 * belongs to one configuration and one list of parameter ids, and F^k, G^k are scaled as sent.
 * The 2p² starting values are the C I set of literature-presets.json (its note names the source).
 */
import { describe, expect, it } from 'vitest';
import { flushSync } from 'svelte';
import { isEdited, solverBody, SOLVER_STORAGE_KEY, SolverParameters, type SolverSet } from './solverParameters.svelte';
import { presetsFor, presetValues, startingPreset } from './presets';

const IDS = ['F2(2p,2p)', 'zeta(2p)'];

function startOf2p2(): SolverSet {
	const preset = startingPreset(presetsFor(IDS), '2p2', '2p2');
	const values = presetValues(IDS, preset);
	return { ids: IDS, presetId: preset?.id ?? 'typical', values, Eav: 0, scale: 100, start: { values: { ...values }, Eav: 0 } };
}

describe('SolverParameters', () => {
	it('a configuration not kept yet has no set (the solver starts from its preset)', () => {
		const store = new SolverParameters();
		expect(store.get('2p2')).toBeNull();
	});

	it('an edited value comes back for the same configuration, with the text trimmed as the key', () => {
		const store = new SolverParameters();
		const set = startOf2p2();
		set.values['F2(2p,2p)'] = 40000;
		store.keep('2p2', set);
		flushSync();
		const back = store.get(' 2p2 ', IDS);
		expect(back?.values['F2(2p,2p)']).toBe(40000);
		expect(back?.presetId).toBe(set.presetId);
		expect(back && isEdited(back)).toBe(true);
	});

	it('a set belongs to one configuration and its parameter ids', () => {
		const store = new SolverParameters();
		store.keep('2p2', startOf2p2());
		expect(store.get('2p3')).toBeNull();
		expect(store.get('2p2', ['F2(2p,2p)'])).toBeNull();
		expect(store.get('2p2', IDS)).not.toBeNull();
		store.forget('2p2');
		expect(store.get('2p2')).toBeNull();
	});

	it('keeps a copy: later changes to the caller’s object do not change the kept set', () => {
		const store = new SolverParameters();
		const set = startOf2p2();
		const before = set.values['F2(2p,2p)'];
		store.keep('2p2', set);
		set.values['F2(2p,2p)'] = 1;
		expect(store.get('2p2')?.values['F2(2p,2p)']).toBe(before);
	});

	it('the starting set is not edited; E_av or the scaling alone makes it edited', () => {
		const set = startOf2p2();
		expect(isEdited(set)).toBe(false);
		expect(isEdited({ ...set, Eav: 100 })).toBe(true);
		expect(isEdited({ ...set, scale: 85 })).toBe(true);
	});

	it('the body scales F^k by the scaling, not ζ', () => {
		const set = { ...startOf2p2(), values: { 'F2(2p,2p)': 40000, 'zeta(2p)': 30 }, scale: 50, Eav: 7 };
		expect(solverBody(set)).toEqual({ Eav: 7, F: [{ k: 2, a: '2p', b: '2p', value: 20000 }], G: [], zeta: [{ shell: '2p', value: 30 }] });
	});

	it('with a storage, a kept set survives a new store (a reload of the page); malformed entries are dropped', () => {
		const data = new Map<string, string>();
		const storage = { getItem: (k: string) => data.get(k) ?? null, setItem: (k: string, v: string) => void data.set(k, v) };
		const set = startOf2p2();
		set.values['F2(2p,2p)'] = 31000;
		new SolverParameters(storage).keep('2p2', set);
		const saved = JSON.parse(data.get(SOLVER_STORAGE_KEY)!);
		saved['3d2'] = { ids: 'not a list' };
		data.set(SOLVER_STORAGE_KEY, JSON.stringify(saved));
		const again = new SolverParameters(storage);
		expect(again.get('2p2', IDS)?.values['F2(2p,2p)']).toBe(31000);
		expect(again.get('3d2')).toBeNull();
		again.forget('2p2');
		expect(new SolverParameters(storage).get('2p2')).toBeNull();
	});

	it('unreadable storage starts empty instead of failing', () => {
		const storage = { getItem: () => '{not json', setItem: () => {} };
		expect(new SolverParameters(storage).get('2p2')).toBeNull();
	});
});
