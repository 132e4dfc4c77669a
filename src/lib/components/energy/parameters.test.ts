/** The form's values ⇄ the API's parameter lists, and the fit's default list from notes (common practice, no source). */
import { describe, expect, it } from 'vitest';
import { observedText, parametersBody, parametersValues } from './parameters';

describe('parameter lists', () => {
	it('parametersValues undoes parametersBody (unscaled)', () => {
		const values = { 'F2(3d,3d)': 61600, 'F4(3d,3d)': 40320, 'G1(3d,4s)': 2000, 'zeta(3d)': 80 };
		expect(parametersValues(parametersBody(values, 12.5))).toEqual({ values, Eav: 12.5 });
	});

	it('the observed list leaves disputed and empty notes out and gives a missing uncertainty as 1', () => {
		const note = (observedEnergy: number | null, uncertainty: number | null, status = 'proposed') => ({
			observedEnergy,
			uncertainty,
			status
		});
		const text = observedText([
			{ J: '2', term: '3F', annotation: note(0, 0.5) },
			{ J: '0', term: '3P', annotation: note(12000, null) },
			{ J: '0', term: '1S', annotation: note(40000, 2, 'disputed') },
			{ J: '4', term: '1G', annotation: note(null, null) },
			{ J: '4', term: '3F', annotation: null }
		]);
		expect(text).toBe('2 0 0.5 3F\n0 12000 1 3P');
	});
});
