import { describe, expect, it } from 'vitest';
import { parseMatchBody, parseTypesParam } from './lines-validation';
import { ServiceError } from './errors';

const level = (energy: number, J: number | string, parity: 'even' | 'odd', extra: Record<string, unknown> = {}) => ({
	energy,
	J,
	parity,
	...extra
});

function message(run: () => unknown): string {
	try {
		run();
	} catch (e) {
		expect(e).toBeInstanceOf(ServiceError);
		return (e as ServiceError).message;
	}
	throw new Error('did not throw');
}

describe('POST /api/v1/match body', () => {
	it('turns J fractions and term symbols into the engine’s doubled integers', () => {
		const body = parseMatchBody({
			levels: [level(0, '3/2', 'even', { term: '2D' }), level(100, 0.5, 'odd', { term: '2P°', uncertainty: 0.01 })],
			lines: [{ wavelength: 1e6, unit: 'cm-1', medium: 'vacuum' }]
		});
		expect(body.levels.map((l) => [l.twoJ, l.term])).toEqual([
			[3, { twoS: 1, L: 2 }],
			[1, { twoS: 1, L: 1 }]
		]);
		expect(body.types).toEqual(['E1']);
		expect(body.tolerance).toEqual({ kind: 'combined', factor: undefined });
	});
	it('a tolerance without a unit is in cm⁻¹; mA is accepted', () => {
		const base = { levels: [level(0, 0, 'even'), level(1, 1, 'odd')], lines: [] };
		expect(parseMatchBody({ ...base, tolerance: 0.5 }).tolerance).toEqual({ kind: 'cm-1', value: 0.5 });
		expect(parseMatchBody({ ...base, tolerance: 3, toleranceUnit: 'mA' }).tolerance).toEqual({ kind: 'mA', value: 3 });
	});
	it('names the field at fault and what is allowed', () => {
		const base = { levels: [level(0, 0, 'even'), level(1, 1, 'odd')] };
		expect(message(() => parseMatchBody({ ...base, lines: [{ wavelength: 5000, unit: 'pc' }] }))).toMatch(
			/^lines\[0\]\.unit: unit must be one of "A", "nm", "um", "cm-1"/
		);
		expect(message(() => parseMatchBody({ levels: [level(0, '5/3', 'even'), level(1, 1, 'odd')], lines: [] }))).toMatch(
			/^levels\[0\]\.J: J = "5\/3" is not allowed/
		);
		expect(message(() => parseMatchBody({ levels: [level(0, 1, 'even', { term: '3P°' }), level(1, 1, 'odd')], lines: [] }))).toMatch(
			/odd but the level's parity is even/
		);
		expect(message(() => parseMatchBody({ ...base, lines: [], types: ['E3'] }))).toMatch(
			/types\[0\]: a transition type must be one of E1, M1, E2/
		);
		expect(message(() => parseMatchBody({ levels: [], lines: [] }))).toMatch(/at least two levels/);
	});
});

describe('types query parameter', () => {
	it('defaults to E1, accepts lists, refuses unknown types', () => {
		expect(parseTypesParam(null)).toEqual(['E1']);
		expect(parseTypesParam('e1, M1,E2,M1')).toEqual(['E1', 'M1', 'E2']);
		expect(message(() => parseTypesParam('E1,X'))).toMatch(/"X" is not a transition type/);
	});
});
