/**
 * Level and line lists uploaded as CSV files (a header row; papaparse), checked row by row before anything is
 * saved. Every problem names the row (1 = the first row under the header), the column and what is allowed; a
 * file with any problem gives no rows. Numbers keep the digits as typed, so a saved list shows what was sent.
 * Pure: used by the upload service, its tests and the demo seed.
 */
import { collect, table, type ListProblem, type Parsed } from './lists';
import { parseTermSymbol } from '../physics/transitions';
import { toVacuumAngstrom } from '../physics/airvac';

/** Largest file accepted, in bytes (5 MB). */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
/** Most data rows in one file. */
export const MAX_UPLOAD_ROWS = 200_000;
/** Problems listed at most in one answer (all are counted). */
export const MAX_UPLOAD_PROBLEMS = 1000;
/** Longest text cell (configuration, term, comment). */
export const MAX_CELL_CHARS = 200;

export const UPLOAD_LIMITS_TEXT = `at most ${MAX_UPLOAD_BYTES / 1024 / 1024} MB and ${MAX_UPLOAD_ROWS.toLocaleString('en-US')} rows`;

export const LEVEL_UPLOAD_COLUMNS = ['energy', 'uncertainty', 'J', 'parity', 'configuration', 'term', 'g'] as const;
export const LINE_UPLOAD_COLUMNS = ['wavelength', 'unit', 'medium', 'uncertainty', 'intensity', 'comment'] as const;

/** A level as read from a file: energy in cm⁻¹ and its digits as typed, J as text ("3/2"). Also its API JSON. */
export interface UploadedLevel {
	energy: number;
	/** The energy's digits as typed. */
	energyText: string;
	uncertainty: number | null;
	J: string;
	parity: 'even' | 'odd';
	configuration: string;
	term: string;
	g: number | null;
}

/** A line as read from a file (wavelength with its digits as typed); the uncertainty is in the line's unit. Also its API JSON. */
export interface UploadedLine {
	wavelength: number;
	wavelengthText: string;
	unit: 'A' | 'nm' | 'cm-1';
	medium: 'air' | 'vacuum';
	uncertainty: number | null;
	intensity: number | null;
	comment: string;
}

export type { ListProblem, Parsed };

/** A plain decimal ("1234.5", "-0.25", "1.2e4"); not hex, not "Infinity", not "1,5". */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The number in a cell: null when empty, NaN when it is not a plain decimal. */
function decimal(cell: string | undefined): number | null {
	const t = (cell ?? '').trim();
	if (t === '') return null;
	if (!DECIMAL.test(t)) return Number.NaN;
	const x = Number(t);
	return Number.isFinite(x) ? x : Number.NaN;
}

function textCell(cell: string | undefined, column: string, bad: (column: string, message: string) => void): string {
	const t = (cell ?? '').trim();
	if (t.length > MAX_CELL_CHARS) bad(column, `${column} is ${t.length} characters long; at most ${MAX_CELL_CHARS} are allowed`);
	return t;
}

/** A CSV upload within the upload limits, each data row read by `readRow` (which reports its problems to `bad`). */
function readUpload<T>(
	text: string,
	required: readonly string[],
	known: readonly string[],
	readRow: (r: Record<string, string>, bad: (column: string, message: string) => void) => T
): Parsed<T> {
	const { data, problems } = table(text, required, known, { maxChars: MAX_UPLOAD_BYTES, maxRows: MAX_UPLOAD_ROWS });
	return collect(data, problems, readRow, MAX_UPLOAD_PROBLEMS);
}

const J_TEXT = /^(\d{1,3})(\/2)?$|^\d{1,3}\.5$/;

/** "1.5" → "3/2"; "3/2", "2" as they are. */
const jText = (t: string) => (t.endsWith('.5') ? `${Number(t) * 2}/2` : t);

/**
 * A level file: columns energy (cm⁻¹), J (0, 1, 3/2 or 1.5 …) and parity (even/odd, e/o) are required;
 * uncertainty (cm⁻¹, ≥ 0), configuration, term (e.g. 3P, ²D°; its ° must agree with the parity) and g are optional.
 * @example parseLevelUpload('energy,J,parity\n0,0,even').rows[0].energyText // '0'
 */
export function parseLevelUpload(text: string): Parsed<UploadedLevel> {
	return readUpload(text, ['energy', 'J', 'parity'], LEVEL_UPLOAD_COLUMNS, (r, bad) => {
		const energyText = (r.energy ?? '').trim();
		const energy = decimal(r.energy);
		if (energy === null || Number.isNaN(energy)) bad('energy', `energy "${energyText}" must be a number of cm⁻¹ such as 15840.6`);
		const u = decimal(r.uncertainty);
		if (u !== null && (Number.isNaN(u) || u < 0)) bad('uncertainty', `uncertainty "${r.uncertainty}" must be a number ≥ 0 (cm⁻¹)`);
		const J = (r.J ?? '').trim();
		if (!J_TEXT.test(J)) bad('J', `J "${J}" must be 0, 1, 2, … or a half-integer such as 3/2 (or 1.5)`);
		const p = (r.parity ?? '').trim().toLowerCase();
		const parity = p === 'e' || p === 'even' ? 'even' : p === 'o' || p === 'odd' ? 'odd' : null;
		if (!parity) bad('parity', `parity "${r.parity ?? ''}" must be even or odd (e or o)`);
		const configuration = textCell(r.configuration, 'configuration', bad);
		const term = textCell(r.term, 'term', bad);
		if (term) {
			try {
				const t = parseTermSymbol(term);
				if (t.parity === 'odd' && parity === 'even') bad('term', `the term "${term}" is marked odd (°) but the parity is even`);
			} catch (e) {
				bad('term', (e as Error).message);
			}
		}
		const g = decimal(r.g);
		if (g !== null && Number.isNaN(g)) bad('g', `g "${r.g}" must be a number such as 1.5`);
		return {
			energy: energy as number,
			energyText,
			uncertainty: u,
			J: jText(J),
			parity: parity ?? 'even',
			configuration,
			term,
			g
		};
	});
}

const UNITS: Record<string, UploadedLine['unit']> = { a: 'A', å: 'A', nm: 'nm', 'cm-1': 'cm-1', 'cm⁻¹': 'cm-1' };

/**
 * A line file: wavelength, unit (A or Å, nm, cm-1) and medium (air or vacuum) are required; uncertainty (in the
 * line's unit, ≥ 0), intensity (≥ 0, any scale) and comment are optional. A wavenumber (cm-1) is read as given.
 * @example parseLineUpload('wavelength,unit,medium\n5000.1,A,air').rows[0].unit // 'A'
 */
export function parseLineUpload(text: string): Parsed<UploadedLine> {
	return readUpload(text, ['wavelength', 'unit', 'medium'], LINE_UPLOAD_COLUMNS, (r, bad) => {
		const wavelengthText = (r.wavelength ?? '').trim();
		const w = decimal(r.wavelength);
		if (w === null || Number.isNaN(w) || w <= 0) bad('wavelength', `wavelength "${wavelengthText}" must be a positive number`);
		const unitText = (r.unit ?? '').trim();
		const unit = UNITS[unitText.toLowerCase()];
		if (!unit) bad('unit', `unit "${unitText}" must be A (or Å), nm or cm-1`);
		const medium = (r.medium ?? '').trim().toLowerCase();
		if (medium !== 'air' && medium !== 'vacuum') bad('medium', `medium "${r.medium ?? ''}" must be air or vacuum`);
		const u = decimal(r.uncertainty);
		if (u !== null && (Number.isNaN(u) || u < 0))
			bad('uncertainty', `uncertainty "${r.uncertainty}" must be a number ≥ 0 (in the line's unit)`);
		const intensity = decimal(r.intensity);
		if (intensity !== null && (Number.isNaN(intensity) || intensity < 0))
			bad('intensity', `intensity "${r.intensity}" must be a number ≥ 0`);
		if (w !== null && w > 0 && unit && unit !== 'cm-1' && medium === 'air') {
			try {
				toVacuumAngstrom(w, unit, 'air');
			} catch (e) {
				bad('medium', (e as Error).message);
			}
		}
		const comment = textCell(r.comment, 'comment', bad);
		return {
			wavelength: w as number,
			wavelengthText,
			unit: unit ?? 'A',
			medium: medium === 'air' ? 'air' : 'vacuum',
			uncertainty: u,
			intensity,
			comment
		};
	});
}
