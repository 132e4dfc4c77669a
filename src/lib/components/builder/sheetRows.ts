/**
 * Display rows of the Term sheet: one per J level of each term occurrence (when the engine lists
 * parentage and the rows stay few enough), else one per J level of each term. Sorting and filtering
 * only rearrange what the engine returned; nothing is computed here beyond reading "3/2" as 1.5.
 */
import type { TermSheet, TermSheetLevel, TermSheetTerm } from '$lib/physics/report';
import type { ParentageItem } from '$lib/physics/parentageReport';
import { levelKey } from '$lib/levels';

/** Above this many rows the sheet folds the occurrences of a term into one row group. */
export const MAX_OCCURRENCE_ROWS = 3000;

export interface LevelRow {
	/** The Shelf's level key, "6D#1|9/2" (occurrence k = the k-th parentage path); "6D|9/2" when folded. */
	id: string;
	/** The term's key, "4F": unique within one sheet (repeats are in `term.count`). */
	key: string;
	term: TermSheetTerm;
	level: TermSheetLevel;
	odd: boolean;
	ground: boolean;
	/** 1-based occurrence of the term; null when the occurrences are folded into one row group. */
	occurrence: number | null;
	/** The occurrence's parentage; null when folded or not listed. */
	parentage: ParentageItem | null;
	/** Place of the J level in the term's expected multiplet order (0 = lowest). */
	jRank: number;
}

/** The rows of one term occurrence (or of a folded term) continue each other. */
export const groupOf = (r: LevelRow) => `${r.key}#${r.occurrence ?? 0}`;

/** Whether the sheet shows one row group per occurrence. */
export function showsOccurrences(sheet: TermSheet): boolean {
	if (!sheet.parentageStatus?.listed) return false;
	return sheet.terms.reduce((n, t) => n + Number(t.count) * t.levels.length, 0) <= MAX_OCCURRENCE_ROWS;
}

/** True when the user typed parent terms: the engine then marks each occurrence built on them. */
export const hasTypedParents = (sheet: TermSheet) => sheet.terms.some((t) => t.parentage?.some((p) => p.onTypedParents !== undefined));

export const termKey = (t: Pick<TermSheetTerm, 'multiplicity' | 'letter'>) => `${t.multiplicity}${t.letter}`;

/** "3/2" → 1.5, "2" → 2. */
export const halfValue = (text: string) => {
	const [a, b] = text.split('/');
	return b ? Number(a) / Number(b) : Number(a);
};

export function levelRowsOf(sheet: TermSheet): LevelRow[] {
	const odd = sheet.configuration.parity === 'odd';
	const split = showsOccurrences(sheet);
	return sheet.terms.flatMap((term) => {
		const isGroundTerm = term.label === sheet.hund.term;
		const rowsOf = (occurrence: number | null, parentage: ParentageItem | null) =>
			term.levels.map((level) => ({
				id: occurrence === null ? `${termKey(term)}|${level.J}` : levelKey({ term: term.label, occurrence, J: level.J }),
				key: termKey(term),
				term,
				level,
				odd,
				// The Hund level is the first occurrence of the Hund term (its parentage is in Hund order too).
				ground: isGroundTerm && level.J === sheet.hund.J && (occurrence === null || occurrence === 1),
				occurrence,
				parentage,
				jRank: Math.max(0, term.jOrder.indexOf(level.J))
			}));
		if (!split) return rowsOf(null, null);
		const items = term.parentage ?? [];
		return Array.from({ length: Number(term.count) }, (_, k) => rowsOf(k + 1, items[k] ?? null)).flat();
	});
}

/** Hund order: the engine's term rank, then occurrence, then J in the expected multiplet order. */
export function hundSorted(rows: LevelRow[]): LevelRow[] {
	return rows
		.map((r, i) => ({ r, i }))
		.sort(
			(a, b) => a.r.term.hundRank - b.r.term.hundRank || (a.r.occurrence ?? 0) - (b.r.occurrence ?? 0) || a.r.jRank - b.r.jRank || a.i - b.i
		)
		.map((x) => x.r);
}

export interface SheetColumn {
	id: string;
	label: string;
	title: string;
	numeric: boolean;
	/** Whether the column belongs to the term (blank on the following rows of the same term). */
	termColumn: boolean;
	sortValue: (r: LevelRow) => (number | string)[];
	/** Shown only for configurations with more than one open subshell whose occurrences are listed. */
	parentOnly?: boolean;
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
		id: 'parent',
		label: 'Parent',
		title: 'Parent terms: the term of each open subshell and the intermediate terms, in coupling order (v = seniority)',
		numeric: false,
		termColumn: true,
		parentOnly: true,
		sortValue: (r) => [r.parentage?.parent ?? '']
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

/** No column chosen: Hund order (the lowest level first). */
export function sortRows(rows: LevelRow[], sort: SortState): LevelRow[] {
	const col = SHEET_COLUMNS.find((c) => c.id === sort.column);
	if (!col) return hundSorted(rows);
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
	/** `parentKey` of the first open subshell's term, '' for all. */
	parent: string;
}

export const NO_FILTER: SheetFilter = { S: '', L: '', J: '', parity: '', parent: '' };

/** Key of the first open subshell's term on a path: "2|2|4|" for ³D… (S, L, seniority, index). */
export const parentKey = (p: ParentageItem) => {
	const first = p.parents[0];
	return first ? `${first.S}|${first.L}|${first.seniority}|${first.index ?? ''}` : '';
};

/** A row passes the parent filter when its occurrence (or, folded, any occurrence of its term) has that parent. */
function onParent(r: LevelRow, key: string): boolean {
	if (key === '') return true;
	if (r.parentage) return parentKey(r.parentage) === key;
	return (r.term.parentage ?? []).some((p) => parentKey(p) === key);
}

/** With typed parents, only the occurrences built on them (or, folded, terms with one). */
export function onTyped(r: LevelRow): boolean {
	if (r.parentage) return r.parentage.onTypedParents !== false;
	return (r.term.parentage ?? []).length === 0 || (r.term.parentage ?? []).some((p) => p.onTypedParents !== false);
}

export function filterRows(rows: LevelRow[], f: SheetFilter): LevelRow[] {
	return rows.filter(
		(r) =>
			(f.S === '' || r.term.S === f.S) &&
			(f.L === '' || String(r.term.L) === f.L) &&
			(f.J === '' || r.level.J === f.J) &&
			(f.parity === '' || (r.odd ? 'odd' : 'even') === f.parity) &&
			onParent(r, f.parent) &&
			onTyped(r)
	);
}
