/**
 * Level and line lists pasted as CSV text (papaparse, header row), checked row by row before anything is sent.
 * Each problem names the row (1 = the first data row), the column and what is allowed. Pure: used by the
 * Line matcher page and its tests.
 */
import Papa from 'papaparse';

/** Largest pasted list (characters), the same as the match route's body limit. */
export const MAX_LIST_CHARS = 400_000;
/** Problems reported at most (the rest are counted). */
export const MAX_PROBLEMS = 50;

export interface ListProblem {
	row: number;
	column: string;
	message: string;
}

export interface LevelInput {
	energy: number;
	J: string;
	parity: 'even' | 'odd';
	term?: string;
	label?: string;
	uncertainty?: number;
}

export interface LineInput {
	wavelength: number;
	unit: 'A' | 'nm' | 'um' | 'cm-1';
	medium: 'air' | 'vacuum';
	uncertainty?: number;
	intensity?: number;
}

export interface Parsed<T> {
	rows: T[];
	problems: ListProblem[];
	problemCount: number;
}

export const LEVEL_COLUMNS = ['energy', 'J', 'parity', 'term', 'label', 'uncertainty'] as const;
export const LINE_COLUMNS = ['wavelength', 'unit', 'medium', 'uncertainty', 'intensity'] as const;

/** Limits of one `table` call: pasted lists by characters; uploaded files by rows as well (their bytes are checked by the caller). */
export interface TableLimits {
	maxChars?: number;
	/** Data rows read at most; one more is read to tell that the file is longer. */
	maxRows?: number;
}

/** The rows of a CSV text with a header row, and the problems of its header and shape (row 0 = the header). */
export function table(
	text: string,
	required: readonly string[],
	known: readonly string[],
	limits: TableLimits = {}
): { data: Record<string, string>[]; problems: ListProblem[] } {
	const maxChars = limits.maxChars ?? MAX_LIST_CHARS;
	if (text.length > maxChars) return { data: [], problems: [{ row: 0, column: '', message: `the list is over ${maxChars} characters` }] };
	const parsed = Papa.parse<Record<string, string>>(text.trim(), {
		header: true,
		skipEmptyLines: 'greedy',
		transformHeader: (h) => h.trim(),
		...(limits.maxRows ? { preview: limits.maxRows + 1 } : {})
	});
	if (limits.maxRows && parsed.data.length > limits.maxRows)
		return {
			data: [],
			problems: [
				{
					row: limits.maxRows + 1,
					column: '',
					message: `the file has more than ${limits.maxRows} rows; split it into files of at most ${limits.maxRows} rows`
				}
			]
		};
	const fields = parsed.meta.fields ?? [];
	const problems: ListProblem[] = [];
	for (const r of required)
		if (!fields.includes(r))
			problems.push({ row: 0, column: r, message: `the header row needs a column "${r}" (columns: ${known.join(', ')})` });
	for (const f of fields)
		if (!known.includes(f)) problems.push({ row: 0, column: f, message: `unknown column "${f}"; allowed: ${known.join(', ')}` });
	// A one-column list has no delimiter to detect, and a row may leave out its empty trailing cells: neither is a problem.
	for (const e of parsed.errors.filter((x) => x.code !== 'UndetectableDelimiter' && x.code !== 'TooFewFields').slice(0, 5))
		problems.push({ row: (e.row ?? -1) + 1, column: '', message: e.message });
	return { data: parsed.data, problems };
}

function number(v: string | undefined): number | null {
	if (v === undefined || v.trim() === '') return null;
	const x = Number(v.trim());
	return Number.isFinite(x) ? x : Number.NaN;
}

/** Reads every row with `read`; problems name the row (1 = first data row); any problem empties `rows`. */
export function collect<T>(
	data: Record<string, string>[],
	head: ListProblem[],
	read: (r: Record<string, string>, bad: (column: string, message: string) => void) => T | null,
	maxProblems = MAX_PROBLEMS
): Parsed<T> {
	const rows: T[] = [];
	const problems = [...head];
	let problemCount = head.length;
	data.forEach((raw, i) => {
		let ok = true;
		const value = read(raw, (column, message) => {
			ok = false;
			problemCount++;
			if (problems.length < maxProblems) problems.push({ row: i + 1, column, message });
		});
		if (ok && value) rows.push(value);
	});
	return { rows: problemCount > 0 ? [] : rows, problems, problemCount };
}

/**
 * A level list: columns energy (cm⁻¹), J (0, 1/2, 3/2 …), parity (even/odd or e/o), and optional term ("3P"),
 * label and uncertainty (cm⁻¹). Any problem empties `rows` (nothing half-read is used).
 * @example parseLevelList('energy,J,parity\n0,0,even').rows // [{ energy: 0, J: '0', parity: 'even' }]
 */
export function parseLevelList(text: string): Parsed<LevelInput> {
	const { data, problems } = table(text, ['energy', 'J', 'parity'], LEVEL_COLUMNS);
	return collect(data, problems, (r, bad) => {
		const energy = number(r.energy);
		if (energy === null || Number.isNaN(energy)) bad('energy', `energy "${r.energy ?? ''}" must be a number of cm⁻¹`);
		const J = (r.J ?? '').trim();
		if (!/^\d+(\/2)?$|^\d+\.5$/.test(J)) bad('J', `J "${J}" must be 0, 1, 2, … or a half-integer such as 3/2`);
		const p = (r.parity ?? '').trim().toLowerCase();
		const parity = p === 'e' || p === 'even' ? 'even' : p === 'o' || p === 'odd' ? 'odd' : null;
		if (!parity) bad('parity', `parity "${r.parity ?? ''}" must be even or odd (e or o)`);
		const u = number(r.uncertainty);
		if (u !== null && (Number.isNaN(u) || u < 0)) bad('uncertainty', `uncertainty "${r.uncertainty}" must be a number ≥ 0 (cm⁻¹)`);
		const out: LevelInput = { energy: energy as number, J, parity: parity ?? 'even' };
		if (r.term?.trim()) out.term = r.term.trim();
		if (r.label?.trim()) out.label = r.label.trim();
		if (u !== null) out.uncertainty = u;
		return out;
	});
}

/**
 * A line list: columns wavelength, and optional unit (A, nm, um, cm-1; default `defaults.unit`), medium (air or
 * vacuum; default `defaults.medium`), uncertainty (in the line's unit) and intensity. Any problem empties `rows`.
 */
export function parseLineList(text: string, defaults: { unit: LineInput['unit']; medium: LineInput['medium'] }): Parsed<LineInput> {
	const { data, problems } = table(text, ['wavelength'], LINE_COLUMNS);
	return collect(data, problems, (r, bad) => {
		const w = number(r.wavelength);
		if (w === null || Number.isNaN(w) || w <= 0) bad('wavelength', `wavelength "${r.wavelength ?? ''}" must be a positive number`);
		const unitText = (r.unit ?? '').trim() || defaults.unit;
		const unit = unitText === 'Å' ? 'A' : unitText;
		if (!['A', 'nm', 'um', 'cm-1'].includes(unit)) bad('unit', `unit "${unitText}" must be A, nm, um or cm-1`);
		const medium = ((r.medium ?? '').trim() || defaults.medium).toLowerCase();
		if (medium !== 'air' && medium !== 'vacuum') bad('medium', `medium "${r.medium}" must be air or vacuum`);
		const u = number(r.uncertainty);
		if (u !== null && (Number.isNaN(u) || u < 0)) bad('uncertainty', `uncertainty "${r.uncertainty}" must be a number ≥ 0`);
		const intensity = number(r.intensity);
		if (intensity !== null && (Number.isNaN(intensity) || intensity < 0))
			bad('intensity', `intensity "${r.intensity}" must be a number ≥ 0`);
		const out: LineInput = { wavelength: w as number, unit: unit as LineInput['unit'], medium: medium as LineInput['medium'] };
		if (u !== null) out.uncertainty = u;
		if (intensity !== null) out.intensity = intensity;
		return out;
	});
}
