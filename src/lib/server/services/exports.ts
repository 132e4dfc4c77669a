/**
 * Exports of a Shelf entry's annotated levels as CSV, JSON or a LaTeX table. Every format writes the
 * configuration as typed (with its core), the odd-parity mark °, the energies as typed, and lists
 * the notes detached by a configuration change after the levels.
 */
import type { Actor } from '../access';
import { badRequest } from '../errors';
import { annotatedLevels } from './annotations';
import { annotatedLevelColumns, detachedNoteColumns, type AnnotatedLevelRow, type DetachedNoteRow } from '../../export/annotated-levels';
import {
	EXPORT_FORMATS,
	MIME,
	jsonRows,
	latexConfiguration,
	latexEscape,
	render,
	toCsv,
	toLatex,
	type ExportFormat
} from '../../export/table';
import { levelText } from '../../levels';

export function parseFormat(text: string | null): ExportFormat {
	const format = (text ?? 'json') as ExportFormat;
	if (!EXPORT_FORMATS.includes(format)) throw badRequest(`format must be one of ${EXPORT_FORMATS.join(', ')}`, { field: 'format' });
	return format;
}

const CAUTION = 'LS labels and g-factors are computed in pure LS coupling; observed energies as annotated by the project.';

export function exportAnnotatedLevels(actor: Actor, projectId: string, entryId: string, format: ExportFormat) {
	const { entry, sheet, levels, detached } = annotatedLevels(actor, projectId, entryId);
	const odd = sheet.configuration.parity === 'odd';
	const rows: AnnotatedLevelRow[] = levels.map((l) => ({ ...l, odd, configuration: entry.notation }));
	const notes: DetachedNoteRow[] = detached.map((n) => ({ ...n, levelText: levelText(n.levelKey) }));
	const caption = {
		text: `Levels of ${entry.species ? entry.species + ' ' : ''}${entry.notation} (${entry.title}). ${CAUTION}`,
		latex: `Levels of ${entry.species ? latexEscape(entry.species) + ' ' : ''}${latexConfiguration(entry.notation)} (${latexEscape(entry.title)}). ${CAUTION}`
	};
	let body: string;
	if (format === 'json') {
		body = JSON.stringify(
			{
				title: entry.title,
				species: entry.species,
				configuration: entry.notation,
				parity: sheet.configuration.parity,
				note: 'LS labels and Landé g are computed for pure LS coupling; real levels may be mixed. Observed energies are the project’s annotations.',
				rows: jsonRows(rows, annotatedLevelColumns),
				detached_notes: jsonRows(notes, detachedNoteColumns)
			},
			null,
			2
		);
	} else {
		body = render(format, rows, annotatedLevelColumns, caption);
		if (notes.length > 0) {
			const what = `Notes detached from an earlier configuration of this entry (kept until reattached to a level of ${entry.notation} or deleted)`;
			body +=
				format === 'csv'
					? `\r\n\r\n${toCsv(notes, detachedNoteColumns)}`
					: `\n${toLatex(notes, detachedNoteColumns, { text: what, latex: `${latexEscape(what.replace(entry.notation, '\u0000'))}`.replace('\u0000', latexConfiguration(entry.notation)) })}`;
		}
	}
	// Named after the notation as typed, so a core shorthand keeps the name short: Fe_II_Ar_3d6_4s.csv
	const slug = `${entry.species || 'levels'}-${entry.notation}`.replace(/[^A-Za-z0-9]+/g, '_').replace(/^_|_$/g, '');
	return { body, type: MIME[format], filename: `${slug}.${format}` };
}
