/**
 * Exports of a Shelf entry's annotated levels as CSV, JSON or a LaTeX table.
 */
import type { Actor } from '../access';
import { badRequest } from '../errors';
import { annotatedLevels } from './annotations';
import { annotatedLevelColumns, type AnnotatedLevelRow } from '../../export/annotated-levels';
import { EXPORT_FORMATS, MIME, render, type ExportFormat } from '../../export/table';

export function parseFormat(text: string | null): ExportFormat {
	const format = (text ?? 'json') as ExportFormat;
	if (!EXPORT_FORMATS.includes(format)) throw badRequest(`format must be one of ${EXPORT_FORMATS.join(', ')}`, { field: 'format' });
	return format;
}

export function exportAnnotatedLevels(actor: Actor, projectId: string, entryId: string, format: ExportFormat) {
	const { entry, sheet, levels } = annotatedLevels(actor, projectId, entryId);
	const odd = sheet.configuration.parity === 'odd';
	const rows: AnnotatedLevelRow[] = levels.map((l) => ({ ...l, odd }));
	const what = `${entry.species ? entry.species + ' ' : ''}${sheet.configuration.notation}`;
	const caption = `Levels of ${what} (${entry.title}). LS labels and g-factors are computed in pure LS coupling; observed energies as annotated by the project.`;
	const body = render(format, rows, annotatedLevelColumns, caption, {
		title: entry.title,
		species: entry.species,
		configuration: sheet.configuration.notation,
		parity: sheet.configuration.parity,
		note: 'LS labels and Landé g are computed for pure LS coupling; real levels may be mixed. Observed energies are the project’s annotations.'
	});
	// Named after the notation as typed, so a core shorthand keeps the name short: Fe_II_Ar_3d6_4s.csv
	const slug = `${entry.species || 'levels'}-${entry.notation}`.replace(/[^A-Za-z0-9]+/g, '_').replace(/^_|_$/g, '');
	return { body, type: MIME[format], filename: `${slug}.${format}` };
}
