/**
 * Tables for export: one column list, three formats (CSV through papaparse, JSON, LaTeX with
 * booktabs rules). Plain data in, text out; used by the pages (downloads) and the API.
 */
import Papa from 'papaparse';

export interface Column<R> {
	/** Header text for CSV and JSON keys. */
	key: string;
	/** Header for LaTeX (may hold math, e.g. '$g_J$'). Defaults to the escaped key. */
	latex?: string;
	/** LaTeX column alignment: l, r, c. */
	align?: 'l' | 'r' | 'c';
	value: (row: R) => string | number | null;
	/** LaTeX cell (already escaped/math); defaults to the escaped value. */
	latexValue?: (row: R) => string;
	/** False to leave the column out of the LaTeX table (e.g. audit columns). */
	inLatex?: boolean;
}

export type ExportFormat = 'csv' | 'json' | 'tex';
export const EXPORT_FORMATS: readonly ExportFormat[] = ['csv', 'json', 'tex'];

export const MIME: Record<ExportFormat, string> = {
	csv: 'text/csv; charset=utf-8',
	json: 'application/json; charset=utf-8',
	tex: 'application/x-tex; charset=utf-8'
};

/** Cells a spreadsheet would run as a formula (OWASP "CSV Injection": = + - @ tab CR). */
const FORMULA_START = /^[=+\-@\t\r]/;
/** A plain decimal number (-5, +1.5, -12400, 2.5e-3) or an exact fraction (-4/7): data, not formulas. */
const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$|^-?\d+\/\d+$/;

/**
 * Neutralises one CSV cell against formula injection by OWASP's rule: text that starts with
 * `=`, `+`, `-`, `@`, tab or carriage return gets a leading apostrophe, so spreadsheets show it
 * as text. Numbers, and text that is a plain number or an exact fraction (`-5`, `-12400`,
 * `-4/7`), stay as they are: they cannot call functions or reach other cells.
 * Example: `csvSafeCell('=HYPERLINK("x")')` → `"'=HYPERLINK(\"x\")"`; `csvSafeCell('-5')` → `'-5'`.
 */
export function csvSafeCell(value: string | number | null): string | number {
	if (value === null) return '';
	if (typeof value === 'number') return value;
	return FORMULA_START.test(value) && !PLAIN_NUMBER.test(value) ? `'${value}` : value;
}

/** CSV (RFC 4180 through papaparse) with every text cell neutralised by `csvSafeCell`. */
export function toCsv<R>(rows: readonly R[], columns: readonly Column<R>[]): string {
	return Papa.unparse({
		fields: columns.map((c) => String(csvSafeCell(c.key))),
		data: rows.map((r) => columns.map((c) => csvSafeCell(c.value(r))))
	});
}

export function toJson<R>(rows: readonly R[], columns: readonly Column<R>[], meta: Record<string, unknown> = {}): string {
	const data = rows.map((r) => Object.fromEntries(columns.map((c) => [c.key, c.value(r)])));
	return JSON.stringify({ ...meta, rows: data }, null, 2);
}

const LATEX_SPECIALS: Record<string, string> = {
	'\\': '\\textbackslash{}',
	'&': '\\&',
	'%': '\\%',
	$: '\\$',
	'#': '\\#',
	_: '\\_',
	'{': '\\{',
	'}': '\\}',
	'~': '\\textasciitilde{}',
	'^': '\\textasciicircum{}'
};

/** Escapes text for LaTeX. */
export function latexEscape(text: string): string {
	return text.replace(/[\\&%$#_{}~^]/g, (ch) => LATEX_SPECIALS[ch]);
}

/**
 * A booktabs table (needs \usepackage{booktabs}) in a table environment with a caption.
 */
export function toLatex<R>(rows: readonly R[], allColumns: readonly Column<R>[], caption: string): string {
	const columns = allColumns.filter((c) => c.inLatex !== false);
	const spec = columns.map((c) => c.align ?? 'l').join('');
	const head = columns.map((c) => c.latex ?? latexEscape(c.key)).join(' & ');
	const body = rows.map(
		(r) =>
			columns
				.map((c) => {
					if (c.latexValue) return c.latexValue(r);
					const v = c.value(r);
					return v === null ? '' : latexEscape(String(v));
				})
				.join(' & ') + ' \\\\'
	);
	return [
		'% Requires \\usepackage{booktabs}',
		'\\begin{table}',
		'  \\centering',
		`  \\caption{${latexEscape(caption)}}`,
		`  \\begin{tabular}{${spec}}`,
		'    \\toprule',
		`    ${head} \\\\`,
		'    \\midrule',
		...body.map((b) => `    ${b}`),
		'    \\bottomrule',
		'  \\end{tabular}',
		'\\end{table}',
		''
	].join('\n');
}

export function render<R>(
	format: ExportFormat,
	rows: readonly R[],
	columns: readonly Column<R>[],
	caption: string,
	meta: Record<string, unknown> = {}
): string {
	if (format === 'csv') return toCsv(rows, columns);
	if (format === 'json') return toJson(rows, columns, meta);
	return toLatex(rows, columns, caption);
}

/** LaTeX for a term symbol ^{2S+1}L_J with an optional odd-parity mark: ${}^{4}\mathrm{F}^{o}_{3/2}$. */
export function latexTerm(multiplicity: number, letter: string, J: string | null, odd: boolean): string {
	return `$^{${multiplicity}}\\mathrm{${letter}}${odd ? '^{\\circ}' : ''}${J === null ? '' : `_{${J}}`}$`;
}
