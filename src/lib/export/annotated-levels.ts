/**
 * Columns of the annotated-levels export of a Shelf entry (CSV, JSON, LaTeX).
 */
import { latexTerm, type Column } from './table';

export interface AnnotatedLevelRow {
	key: string;
	term: string;
	occurrence: number;
	count: number;
	multiplicity: number;
	letter: string;
	J: string;
	g: string | null;
	odd: boolean;
	/** "3d⁶(⁵D)4s ⁶D"; null when the engine leaves parentage out. */
	parentage?: string | null;
	annotation: {
		observedEnergy: number | null;
		uncertainty: number | null;
		status: string;
		comment: string;
		updatedBy: string | null;
		updatedAt: Date | string;
	} | null;
}

const iso = (d: Date | string) => (typeof d === 'string' ? d : d.toISOString());

export const annotatedLevelColumns: Column<AnnotatedLevelRow>[] = [
	{
		key: 'level',
		latex: 'Level',
		value: (r) => `${r.term}${r.odd ? '°' : ''}${r.count > 1 ? `(${r.occurrence})` : ''} J=${r.J}`,
		latexValue: (r) => latexTerm(r.multiplicity, r.letter, r.J, r.odd) + (r.count > 1 ? ` (${r.occurrence})` : '')
	},
	{ key: 'term', inLatex: false, value: (r) => r.term + (r.odd ? '°' : '') },
	{ key: 'occurrence', inLatex: false, value: (r) => r.occurrence },
	{ key: 'J', inLatex: false, value: (r) => r.J },
	{ key: 'g', latex: '$g_J$ (LS)', align: 'r', value: (r) => r.g, latexValue: (r) => (r.g === null ? '--' : `$${r.g}$`) },
	{ key: 'observed_energy_cm-1', latex: '$E_\\mathrm{obs}$ (cm$^{-1}$)', align: 'r', value: (r) => r.annotation?.observedEnergy ?? null },
	{ key: 'uncertainty_cm-1', latex: '$\\sigma$ (cm$^{-1}$)', align: 'r', value: (r) => r.annotation?.uncertainty ?? null },
	{ key: 'status', latex: 'Status', value: (r) => r.annotation?.status ?? null },
	{ key: 'comment', latex: 'Comment', value: (r) => r.annotation?.comment ?? null },
	{ key: 'updated_by', inLatex: false, value: (r) => r.annotation?.updatedBy ?? null },
	{ key: 'updated_at', inLatex: false, value: (r) => (r.annotation ? iso(r.annotation.updatedAt) : null) },
	{ key: 'parentage', inLatex: false, value: (r) => r.parentage ?? null }
];
