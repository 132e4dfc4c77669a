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
	/** The formats that carry this column (default: all, subject to `inLatex`). */
	only?: readonly ExportFormat[];
	/** JSON value when it differs from `value` (e.g. a number where CSV keeps the digits as typed). */
	jsonValue?: (row: R) => unknown;
}

/** A caption as plain text (CSV/JSON readers) and as typeset LaTeX. */
export interface Caption {
	text: string;
	latex: string;
}

const inFormat =
	(format: ExportFormat) =>
	<R>(c: Column<R>) =>
		(c.only ? c.only.includes(format) : true) && (format !== 'tex' || c.inLatex !== false);

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
export function toCsv<R>(rows: readonly R[], allColumns: readonly Column<R>[]): string {
	const columns = allColumns.filter(inFormat('csv'));
	return Papa.unparse({
		fields: columns.map((c) => String(csvSafeCell(c.key))),
		data: rows.map((r) => columns.map((c) => csvSafeCell(c.value(r))))
	});
}

/** The rows as JSON objects keyed by column. */
export function jsonRows<R>(rows: readonly R[], allColumns: readonly Column<R>[]): Record<string, unknown>[] {
	const columns = allColumns.filter(inFormat('json'));
	return rows.map((r) => Object.fromEntries(columns.map((c) => [c.key, c.jsonValue ? c.jsonValue(r) : c.value(r)])));
}

export function toJson<R>(rows: readonly R[], columns: readonly Column<R>[], meta: Record<string, unknown> = {}): string {
	return JSON.stringify({ ...meta, rows: jsonRows(rows, columns) }, null, 2);
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

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/**
 * A configuration in LaTeX text mode with its core as typed and superscript occupancies:
 * "[Ar] 3d6 4s" → "[Ar]~3d$^{6}$~4s", "3d⁵" → "3d$^{5}$" (spectroscopic notation, e.g. Cowan 1981 §1-5).
 * @example latexConfiguration('[Ne] 3s2 3p') // '[Ne]~3s$^{2}$~3p'
 */
export function latexConfiguration(notation: string): string {
	return (
		notation
			.trim()
			.split(/[\s.·⋅]+/u)
			// Pieces written with superscripts may run together (4f⁷5d6s²): one subshell each.
			.flatMap((piece) => (/^(?:\d+\p{Ll}[⁰¹²³⁴⁵⁶⁷⁸⁹]*)+$/u.test(piece) ? piece.match(/\d+\p{Ll}[⁰¹²³⁴⁵⁶⁷⁸⁹]*/gu)! : [piece]))
			.map((piece) => {
				const m = /^(\d+\p{Ll})(?:\^?\{?(\d+)\}?|([⁰¹²³⁴⁵⁶⁷⁸⁹]+))?$/u.exec(piece);
				if (!m) return latexEscape(piece);
				const occ = m[2] ?? (m[3] ? [...m[3]].map((c) => SUPERSCRIPT_DIGITS.indexOf(c)).join('') : '');
				return occ ? `${m[1]}$^{${occ}}$` : m[1];
			})
			.join('~')
	);
}

/**
 * A long table that breaks across pages (packages booktabs and longtable), with the header
 * repeated on each page and the caption typeset. Columns with `inLatex: false` are left out.
 */
export function toLatex<R>(rows: readonly R[], allColumns: readonly Column<R>[], caption: Caption | string): string {
	const columns = allColumns.filter(inFormat('tex'));
	const spec = columns.map((c) => c.align ?? 'l').join('');
	const head = columns.map((c) => c.latex ?? latexEscape(c.key)).join(' & ');
	const captionTex = typeof caption === 'string' ? latexEscape(caption) : caption.latex;
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
		'% Requires \\usepackage{booktabs} and \\usepackage{longtable}',
		`\\begin{longtable}{${spec}}`,
		`  \\caption{${captionTex}} \\\\`,
		'  \\toprule',
		`  ${head} \\\\`,
		'  \\midrule',
		'  \\endfirsthead',
		`  \\multicolumn{${columns.length}}{l}{\\emph{(continued)}} \\\\`,
		'  \\toprule',
		`  ${head} \\\\`,
		'  \\midrule',
		'  \\endhead',
		`  \\midrule \\multicolumn{${columns.length}}{r}{\\emph{(continued on the next page)}} \\\\`,
		'  \\endfoot',
		'  \\bottomrule',
		'  \\endlastfoot',
		...body.map((b) => `  ${b}`),
		'\\end{longtable}',
		''
	].join('\n');
}

export function render<R>(
	format: ExportFormat,
	rows: readonly R[],
	columns: readonly Column<R>[],
	caption: Caption | string,
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
