import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseLevelList, parseLineList } from './lists';
import { DEMO_LEVELS, DEMO_LINES } from './demo';

describe('pasted level lists', () => {
	it('reads the invented demo list: 12 levels, J as text, parity, term and label', () => {
		const r = parseLevelList(DEMO_LEVELS);
		expect(r.problems).toEqual([]);
		expect(r.rows).toHaveLength(12);
		expect(r.rows[2]).toEqual({ energy: 322.4, J: '2', parity: 'even', term: '3P', label: '2p2 3P2', uncertainty: 0.01 });
	});
	it('names row, column and what is allowed; a list with any problem gives no rows', () => {
		const r = parseLevelList('energy,J,parity\n0,0,even\nabc,5/3,up');
		expect(r.rows).toEqual([]);
		expect(r.problems.map((p) => [p.row, p.column])).toEqual([
			[2, 'energy'],
			[2, 'J'],
			[2, 'parity']
		]);
		expect(r.problems[2].message).toMatch(/even or odd/);
		expect(parseLevelList('energy,J\n0,0').problems[0].message).toMatch(/needs a column "parity"/);
		expect(parseLevelList('energy,J,parity,colour\n0,0,e').problems[0].message).toMatch(/unknown column "colour"/);
	});
});

describe('pasted line lists', () => {
	it('reads the invented demo list: 21 lines, air from 2000 Å and vacuum below', () => {
		const r = parseLineList(DEMO_LINES, { unit: 'A', medium: 'air' });
		expect(r.problems).toEqual([]);
		expect(r.rows).toHaveLength(21);
		expect(r.rows.filter((l) => l.medium === 'vacuum').every((l) => l.wavelength < 2000)).toBe(true);
	});
	it('fills unit and medium from the defaults and refuses unknown ones', () => {
		expect(parseLineList('wavelength\n500.1', { unit: 'nm', medium: 'vacuum' }).rows).toEqual([
			{ wavelength: 500.1, unit: 'nm', medium: 'vacuum' }
		]);
		const bad = parseLineList('wavelength,unit\n-3,furlong', { unit: 'A', medium: 'air' });
		expect(bad.problems.map((p) => p.column)).toEqual(['wavelength', 'unit']);
	});
	it('never throws on arbitrary text, and either reads every row or none (property)', () => {
		fc.assert(
			fc.property(fc.string({ maxLength: 300 }), (text) => {
				const r = parseLineList('wavelength,unit,medium\n' + text, { unit: 'A', medium: 'air' });
				return r.problemCount > 0 ? r.rows.length === 0 : r.problems.length === 0;
			})
		);
	});
});
