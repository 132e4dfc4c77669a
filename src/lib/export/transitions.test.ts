import { describe, expect, it } from 'vitest';
import { transitionFinder } from '../physics/finder';
import { render } from './table';
import { transitionColumns, transitionRows } from './transitions';

describe('Transition finder export', () => {
	const result = transitionFinder('3s', '3p', ['E1']);
	const rows = transitionRows(result);
	it('one row per line: ²S₁/₂–²P°₃/₂ with S = 4 (share 2/3) and ²S₁/₂–²P°₁/₂ with S = 2 (the 2 : 1 doublet)', () => {
		expect(rows.map((r) => [r.lowerTerm + r.JLower, r.upperTerm + r.JUpper, r.strength, r.share])).toEqual([
			['²S1/2', '²P°3/2', '4', '2/3'],
			['²S1/2', '²P°1/2', '2', '1/3']
		]);
	});
	it('CSV has a header and the exact strengths; LaTeX writes the terms as math and fractions with \\tfrac', () => {
		const csv = render('csv', rows, transitionColumns, 'caption');
		expect(csv.split('\r\n')[0]).toBe(
			'multiplet,type,lower,J_lower,upper,J_upper,strength,strength_decimal,share,ls_allowed,intercombination'
		);
		expect(csv).toContain('²S–²P°,E1,²S1/2,1/2,²P°3/2,3/2,4,4,2/3,yes,no');
		const tex = render('tex', rows, transitionColumns, 'E1 lines 3s–3p');
		expect(tex).toContain('$^{2}\\mathrm{S}_{1/2}$ & $^{2}\\mathrm{P}^{\\circ}_{3/2}$ & 4 & 4 & $\\tfrac{2}{3}$ & allowed');
		expect(JSON.parse(render('json', rows, transitionColumns, '', { lower: '3s' })).rows).toHaveLength(2);
	});
});
