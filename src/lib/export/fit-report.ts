/**
 * Columns of a fit report's export (CSV, JSON, LaTeX): the parameters (value ± σ, free, fixed or
 * linked) and the residuals obs − calc per level. Numbers go out unrounded in JSON; CSV and LaTeX
 * give cm⁻¹ to 0.01 (fits of level energies are quoted so; common practice, no source).
 */
import { latexEscape, type Column } from './table';
import type { FittedParameter, FitResidual } from '../physics/fit';

/** "F2(3d,3d)" → "$F^{2}(3d,3d)$", "zeta(3d)" → "$\zeta_{3d}$", "Eav" → "$E_\mathrm{av}$". */
export function latexParameter(id: string): string {
	if (id === 'Eav') return '$E_\\mathrm{av}$';
	const fg = /^([FG])(\d+)\(([^,]+),([^)]+)\)$/.exec(id);
	if (fg) return `$${fg[1]}^{${fg[2]}}(${fg[3]},${fg[4]})$`;
	const z = /^zeta\(([^)]+)\)$/.exec(id);
	if (z) return `$\\zeta_{${z[1]}}$`;
	return latexEscape(id);
}

/** cm⁻¹ to 0.01; a value that rounds to zero is written 0.00, not -0.00. */
const cm = (v: number | null) => (v === null ? null : (Math.abs(v) < 0.005 ? 0 : v).toFixed(2));
const math = (v: number | null) => (v === null ? '--' : `$${cm(v)}$`);

/** A right-aligned column of energies in cm⁻¹: to 0.01 in CSV and LaTeX, unrounded in JSON. */
function cmColumn<T>(key: string, latex: string, get: (row: T) => number | null): Column<T> {
	return { key, latex, align: 'r', value: (row) => cm(get(row)), jsonValue: get, latexValue: (row) => math(get(row)) };
}

/** The status in words: free, fixed, or linked to another parameter at a ratio. */
const statusText = (p: FittedParameter) =>
	p.status === 'varied' ? `free${p.atBound ? ' (at bound)' : ''}` : p.status === 'linked' ? `linked to ${p.linkedTo}` : 'fixed';

export const fitParameterColumns: Column<FittedParameter>[] = [
	{ key: 'parameter', latex: 'Parameter', value: (p) => p.id, latexValue: (p) => latexParameter(p.id) },
	cmColumn('value_cm-1', 'Value (cm$^{-1}$)', (p) => p.value),
	cmColumn('sigma_cm-1', '$\\sigma$ (cm$^{-1}$)', (p) => p.sigma),
	{
		key: 'status',
		latex: 'Status',
		value: (p) => (p.status === 'varied' ? 'free' : p.status),
		latexValue: (p) => (p.status === 'linked' ? `linked to ${latexParameter(p.linkedTo ?? '')}` : latexEscape(statusText(p)))
	},
	{ key: 'linked_to', inLatex: false, value: (p) => p.linkedTo ?? null },
	{ key: 'ratio', inLatex: false, value: (p) => p.ratio ?? null },
	{ key: 'at_bound', inLatex: false, value: (p) => (p.atBound ? 'yes' : null), jsonValue: (p) => p.atBound ?? false }
];

/** A term label "3F" or "2D (v=3)" in LaTeX: ${}^{3}\mathrm{F}$. */
function latexLabel(label: string): string {
	const m = /^(\d+)([A-Z])(.*)$/.exec(label);
	return m ? `$^{${m[1]}}\\mathrm{${m[2]}}$${latexEscape(m[3])}` : latexEscape(label);
}

export const fitResidualColumns: Column<FitResidual>[] = [
	{ key: 'J', latex: '$J$', align: 'r', value: (r) => r.J, latexValue: (r) => `$${r.J}$` },
	{ key: 'rank_in_J', inLatex: false, value: (r) => r.rank },
	{ key: 'label', latex: 'Leading term', value: (r) => r.label, latexValue: (r) => latexLabel(r.label) },
	cmColumn('observed_cm-1', '$E_\\mathrm{obs}$', (r) => r.observed),
	cmColumn('calculated_cm-1', '$E_\\mathrm{calc}$', (r) => r.calculated),
	cmColumn('obs-calc_cm-1', '$E_\\mathrm{obs}-E_\\mathrm{calc}$', (r) => r.residual)
];
