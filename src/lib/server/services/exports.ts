/**
 * Exports of a Shelf entry's annotated levels as CSV, JSON or a LaTeX table. Every format writes the
 * configuration as typed (with its core), the odd-parity mark °, the energies as typed, and lists
 * the notes detached by a configuration change after the levels. Saved fit reports export the same way.
 */
import { utcMinuteLabelled } from '../../when';
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
import { fitParameterColumns, fitResidualColumns } from '../../export/fit-report';
import { getFitReport } from './fit-reports';

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

const FIT_CAUTION =
	'Model energies of one configuration without configuration interaction; σ are standard uncertainties from the covariance scaled by the fit’s standard deviation.';

/** A saved fit report as CSV (two tables: parameters, then residuals), JSON or LaTeX (two longtables). */
export function exportFitReport(actor: Actor, projectId: string, entryId: string, fitId: string, format: ExportFormat) {
	const { entry, report } = getFitReport(actor, projectId, entryId, fitId);
	const r = report.result;
	const when = utcMinuteLabelled(report.createdAt);
	const stats = `rms ${r.rms.toFixed(2)} cm⁻¹, ${r.degreesOfFreedom} degrees of freedom, ${r.residuals.length} levels`;
	const who = `fitted by ${report.createdBy ?? 'a former member'} on ${when}`;
	const species = entry.species ? entry.species + ' ' : '';
	let body: string;
	if (format === 'json') {
		body = JSON.stringify(
			{
				title: entry.title,
				species: entry.species,
				configuration: report.notation,
				fitted_by: report.createdBy,
				fitted_at: report.createdAt.toISOString(),
				observed_from: report.request.observedFrom,
				rms_cm_1: r.rms,
				standard_deviation_cm_1: r.standardDeviation,
				degrees_of_freedom: r.degreesOfFreedom,
				chi_square: r.chiSquare,
				iterations: r.iterations,
				converged: r.converged,
				method: r.method,
				note: `${FIT_CAUTION} ${r.caution}`,
				parameters: jsonRows(r.parameters, fitParameterColumns),
				residuals: jsonRows(r.residuals, fitResidualColumns)
			},
			null,
			2
		);
	} else if (format === 'csv') {
		body = `${toCsv(r.parameters, fitParameterColumns)}\r\n\r\n${toCsv(r.residuals, fitResidualColumns)}`;
	} else {
		const head = `${latexEscape(species)}${latexConfiguration(report.notation)} (${latexEscape(entry.title)})`;
		const plain = (t: string) => latexEscape(t).replaceAll('cm⁻¹', 'cm$^{-1}$').replaceAll('σ', '$\\sigma$');
		body =
			toLatex(r.parameters, fitParameterColumns, {
				text: '',
				latex: `Fitted parameters of ${head}, ${plain(who)}; ${plain(stats)}. ${plain(FIT_CAUTION)}`
			}) +
			'\n' +
			toLatex(r.residuals, fitResidualColumns, { text: '', latex: `Residuals of the fit of ${head}, in cm$^{-1}$; ${plain(stats)}.` });
	}
	const slug = `fit-${entry.species || 'levels'}-${report.notation}-${report.createdAt.toISOString().slice(0, 10)}`
		.replace(/[^A-Za-z0-9]+/g, '_')
		.replace(/^_|_$/g, '');
	return { body, type: MIME[format], filename: `${slug}.${format}` };
}
