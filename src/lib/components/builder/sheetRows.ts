/**
 * Display rows of the Term sheet: one per J level, with its term. Sorting and filtering only
 * rearrange what the engine returned; nothing is computed here beyond reading "3/2" as 1.5.
 */
import type { TermSheet, TermSheetLevel, TermSheetTerm } from '$lib/physics/report';

export interface LevelRow {
	id: string;
	/** The term's key, "4F": unique within one sheet (repeats are in `term.count`). */
	key: string;
	term: TermSheetTerm;
	level: TermSheetLevel;
	odd: boolean;
	ground: boolean;
}

export const termKey = (t: Pick<TermSheetTerm, 'multiplicity' | 'letter'>) => `${t.multiplicity}${t.letter}`;

/** "3/2" → 1.5, "2" → 2. */
export const halfValue = (text: string) => {
	const [a, b] = text.split('/');
	return b ? Number(a) / Number(b) : Number(a);
};

export function levelRowsOf(sheet: TermSheet): LevelRow[] {
	const odd = sheet.configuration.parity === 'odd';
	return sheet.terms.flatMap((term) =>
		term.levels.map((level) => ({
			id: `${termKey(term)}|${level.J}`,
			key: termKey(term),
			term,
			level,
			odd,
			ground: term.label === sheet.hund.term && level.J === sheet.hund.J
		}))
	);
}

export interface SheetColumn {
	id: string;
	label: string;
	title: string;
	numeric: boolean;
	/** Whether the column belongs to the term (blank on the following rows of the same term). */
	termColumn: boolean;
	sortValue: (r: LevelRow) => number[];
}

export const SHEET_COLUMNS: SheetColumn[] = [
	{
		id: 'level',
		label: 'Level',
		title: 'Level symbol ²ˢ⁺¹L_J (° marks odd parity)',
		numeric: false,
		termColumn: false,
		sortValue: (r) => [r.term.multiplicity, r.term.L, halfValue(r.level.J)]
	},
	{
		id: 'count',
		label: 'Count',
		title: 'How often the term occurs',
		numeric: true,
		termColumn: true,
		sortValue: (r) => [Number(r.term.count)]
	},
	{
		id: 'v',
		label: 'v',
		title: 'Seniority (Racah) of the occurrences, with a count where several share one; single open subshell only',
		numeric: true,
		termColumn: true,
		sortValue: (r) => [r.term.seniorities?.[0]?.seniority ?? -1]
	},
	{ id: 'S', label: 'S', title: 'Total spin', numeric: true, termColumn: true, sortValue: (r) => [halfValue(r.term.S)] },
	{ id: 'L', label: 'L', title: 'Total orbital angular momentum', numeric: true, termColumn: true, sortValue: (r) => [r.term.L] },
	{ id: 'parity', label: 'Parity', title: 'Parity (−1)^Σl', numeric: false, termColumn: true, sortValue: (r) => [r.odd ? 1 : 0] },
	{
		id: 'weight',
		label: '(2S+1)(2L+1)',
		title: 'Statistical weight of one occurrence of the term',
		numeric: true,
		termColumn: true,
		sortValue: (r) => [r.term.weight]
	},
	{ id: 'J', label: 'J', title: 'Total angular momentum', numeric: true, termColumn: false, sortValue: (r) => [halfValue(r.level.J)] },
	{
		id: 'g',
		label: 'g_J exact',
		title: 'Landé g-factor as a fraction, with g_s = 2',
		numeric: true,
		termColumn: false,
		sortValue: (r) => [r.level.gDecimal ?? -Infinity]
	},
	{
		id: 'gDecimal',
		label: 'g_J decimal',
		title: 'Landé g-factor as a decimal, with the chosen g_s',
		numeric: true,
		termColumn: false,
		sortValue: (r) => [r.level.gDecimal ?? -Infinity]
	},
	{
		id: 'weightJ',
		label: '2J+1',
		title: 'Statistical weight of the level',
		numeric: true,
		termColumn: false,
		sortValue: (r) => [r.level.weight]
	}
];

export type SortDir = 'ascending' | 'descending';
export interface SortState {
	column: string | null;
	dir: SortDir;
}

export function sortRows(rows: LevelRow[], sort: SortState): LevelRow[] {
	const col = SHEET_COLUMNS.find((c) => c.id === sort.column);
	if (!col) return rows;
	const sign = sort.dir === 'ascending' ? 1 : -1;
	return rows
		.map((r, i) => ({ r, i, v: col.sortValue(r) }))
		.sort((a, b) => {
			for (let k = 0; k < a.v.length; k++) if (a.v[k] !== b.v[k]) return sign * (a.v[k] < b.v[k] ? -1 : 1);
			return a.i - b.i;
		})
		.map((x) => x.r);
}

export interface SheetFilter {
	S: string;
	L: string;
	J: string;
	parity: string;
}

export const NO_FILTER: SheetFilter = { S: '', L: '', J: '', parity: '' };

export function filterRows(rows: LevelRow[], f: SheetFilter): LevelRow[] {
	return rows.filter(
		(r) =>
			(f.S === '' || r.term.S === f.S) &&
			(f.L === '' || String(r.term.L) === f.L) &&
			(f.J === '' || r.level.J === f.J) &&
			(f.parity === '' || (r.odd ? 'odd' : 'even') === f.parity)
	);
}
