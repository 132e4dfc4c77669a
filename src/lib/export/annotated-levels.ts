/**
 * Columns of the annotated-levels export of a Shelf entry (CSV, JSON, LaTeX).
 */
import { latexConfiguration, latexEscape, latexTerm, type Column } from './table';

/** A note as the exports need it: the value, the digits as typed, and who changed it when. */
export interface ExportedNote {
	observedEnergy: number | null;
	observedEnergyText: string | null;
	uncertainty: number | null;
	uncertaintyText: string | null;
	status: string;
	comment: string;
	updatedBy: string | null;
	updatedAt: Date | string;
}

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
	/** The entry's configuration as typed, core shorthand kept ("[Xe] 4f3"), as the JSON and LaTeX give it. */
	configuration: string;
	/** "3d⁶(⁵D)4s ⁶D"; null when the engine leaves parentage out. */
	parentage?: string | null;
	annotation: ExportedNote | null;
}

/** A note detached by a configuration change: its old level key and the configuration it was written for. */
export interface DetachedNoteRow extends ExportedNote {
	levelKey: string;
	levelText: string;
	detachedFrom: string | null;
}

const iso = (d: Date | string) => (typeof d === 'string' ? d : d.toISOString());

export const annotatedLevelColumns: Column<AnnotatedLevelRow>[] = [
	// CSV rows stand alone in a spreadsheet, so each carries its configuration; JSON has it once at
	// the top and LaTeX in the caption.
	{ key: 'configuration', only: ['csv'], value: (r) => r.configuration },
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
	...noteColumns<AnnotatedLevelRow>((r) => r.annotation),
	{ key: 'parentage', inLatex: false, value: (r) => r.parentage ?? null }
];

/** LaTeX math for an energy as typed, with a true minus: "-12400.5" → "$-12400.5$". */
const latexNumber = (text: string | null) => (text === null ? '' : `$${text}$`);

/**
 * The note columns shared by the level table and the detached notes: CSV and LaTeX carry the
 * digits as typed (1880 stays 1880, 19500.12345 unrounded); JSON carries the number and the text.
 */
function noteColumns<R>(note: (r: R) => ExportedNote | null): Column<R>[] {
	return [
		{
			key: 'observed_energy_cm-1',
			latex: '$E_\\mathrm{obs}$ (cm$^{-1}$)',
			align: 'r',
			value: (r) => note(r)?.observedEnergyText ?? null,
			jsonValue: (r) => note(r)?.observedEnergy ?? null,
			latexValue: (r) => latexNumber(note(r)?.observedEnergyText ?? null)
		},
		{ key: 'observed_energy_as_typed', only: ['json'], value: (r) => note(r)?.observedEnergyText ?? null },
		{
			key: 'uncertainty_cm-1',
			latex: '$\\sigma$ (cm$^{-1}$)',
			align: 'r',
			value: (r) => note(r)?.uncertaintyText ?? null,
			jsonValue: (r) => note(r)?.uncertainty ?? null,
			latexValue: (r) => latexNumber(note(r)?.uncertaintyText ?? null)
		},
		{ key: 'uncertainty_as_typed', only: ['json'], value: (r) => note(r)?.uncertaintyText ?? null },
		{ key: 'status', latex: 'Status', value: (r) => note(r)?.status ?? null },
		{ key: 'comment', latex: 'Comment', value: (r) => note(r)?.comment ?? null },
		{ key: 'updated_by', inLatex: false, value: (r) => note(r)?.updatedBy ?? null },
		{ key: 'updated_at', inLatex: false, value: (r) => (note(r) ? iso(note(r)!.updatedAt) : null) }
	];
}

/** Columns of the detached notes, listed after the levels in every export. */
export const detachedNoteColumns: Column<DetachedNoteRow>[] = [
	{ key: 'detached_level', latex: 'Level (earlier configuration)', value: (r) => r.levelText, latexValue: (r) => latexEscape(r.levelText) },
	{ key: 'detached_level_key', inLatex: false, value: (r) => r.levelKey },
	{
		key: 'detached_from',
		latex: 'Written for',
		value: (r) => r.detachedFrom,
		latexValue: (r) => (r.detachedFrom ? latexConfiguration(r.detachedFrom) : '')
	},
	...noteColumns<DetachedNoteRow>((r) => r)
];
