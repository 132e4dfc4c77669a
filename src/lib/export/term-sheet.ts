/**
 * Rows and columns of the Term sheet export: one row per J level of each term occurrence with its
 * parentage (one per J level of each term when the engine leaves parentage out). Odd terms carry °.
 */
import type { TermSheet } from '../physics/report';
import { latexTerm, type Column } from './table';

export interface LevelRow {
	term: string;
	multiplicity: number;
	letter: string;
	S: string;
	L: number;
	/** How often the term occurs, exact decimal digits. */
	count: string;
	seniority: string;
	parity: 'even' | 'odd';
	J: string;
	g: string | null;
	gDecimal: number | null;
	weight: number;
	hundRank: number;
	/** 1-based occurrence of the term (the Shelf's level keys count the same way); null when not listed. */
	occurrence: number | null;
	/** "3d⁶(⁵D)4s ⁶D"; '' when not listed. */
	parentage: string;
}

/**
 * Seniorities as people read them: "1, 3" for two occurrences with v = 1 and v = 3, and a count
 * where several occurrences share one v: "1, 3 (2×)".
 */
export function senioritySummary(list: readonly { seniority: number; count: string }[]): string {
	return list.map((s) => (s.count === '1' ? String(s.seniority) : `${s.seniority} (${s.count}×)`)).join(', ');
}

export function levelRows(sheet: TermSheet): LevelRow[] {
	return sheet.terms.flatMap((t) => {
		const items = t.parentage ?? null;
		const single = sheet.configuration.subshells.filter((s) => s.open).length === 1;
		const all = t.seniorities ? senioritySummary(t.seniorities) : '';
		const occurrences: Occurrence[] = items
			? items.map((p, k) => ({
					occurrence: k + 1,
					parentage: p.label,
					seniority: single ? String(p.parents[0]?.seniority ?? '') : all
				}))
			: [{ occurrence: null, parentage: '', seniority: all }];
		return occurrences.flatMap((o) => levelRowsOfTerm(sheet, t, o));
	});
}

type Occurrence = Pick<LevelRow, 'occurrence' | 'parentage' | 'seniority'>;

function levelRowsOfTerm(sheet: TermSheet, t: TermSheet['terms'][number], o: Occurrence): LevelRow[] {
	return t.levels.map((lv) => ({
		term: t.label,
		multiplicity: t.multiplicity,
		letter: t.letter,
		S: t.S,
		L: t.L,
		count: t.count,
		parity: sheet.configuration.parity,
		J: lv.J,
		g: lv.g,
		gDecimal: lv.gDecimal,
		weight: lv.weight,
		hundRank: t.hundRank,
		...o
	}));
}

/** Unicode superscripts, subscripts and ° of the engine's labels as LaTeX: "3d⁶(⁵D)4s ⁶D" → "3d$^{6}$($^{5}$D)4s $^{6}$D". */
export function latexLabel(text: string): string {
	const sup = '⁰¹²³⁴⁵⁶⁷⁸⁹';
	const sub = '₀₁₂₃₄₅₆₇₈₉';
	return text
		.replace(/[#%&_{}]/g, (c) => `\\${c}`)
		.replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹]+/g, (m) => `$^{${[...m].map((c) => sup.indexOf(c)).join('')}}$`)
		.replace(
			/[₀₁₂₃₄₅₆₇₈₉](?:[₀₁₂₃₄₅₆₇₈₉/]*[₀₁₂₃₄₅₆₇₈₉])?/g,
			(m) => `$_{${[...m].map((c) => (c === '/' ? '/' : sub.indexOf(c))).join('')}}$`
		)
		.replace(/°/g, '$^{\\circ}$');
}

const odd = (r: LevelRow) => r.parity === 'odd';

export const levelColumns: Column<LevelRow>[] = [
	{
		key: 'term',
		latex: 'Term',
		value: (r) => r.term + (odd(r) ? '°' : ''),
		latexValue: (r) => latexTerm(r.multiplicity, r.letter, null, odd(r))
	},
	{ key: 'occurrence', latex: '\\#', align: 'r', value: (r) => r.occurrence },
	{ key: 'parentage', latex: 'Parentage', value: (r) => r.parentage, latexValue: (r) => latexLabel(r.parentage) },
	{ key: 'count', latex: 'Count', align: 'r', value: (r) => r.count },
	{ key: 'seniority', latex: '$v$', align: 'r', value: (r) => r.seniority },
	{ key: 'S', latex: '$S$', align: 'r', value: (r) => r.S },
	{ key: 'L', latex: '$L$', align: 'r', value: (r) => r.L },
	{ key: 'parity', latex: 'Parity', value: (r) => r.parity },
	{ key: 'J', latex: '$J$', align: 'r', value: (r) => r.J, latexValue: (r) => `$${r.J}$` },
	{ key: 'g', latex: '$g_J$', align: 'r', value: (r) => r.g, latexValue: (r) => (r.g === null ? '--' : `$${r.g}$`) },
	{ key: 'g_decimal', latex: '$g_J$ (dec.)', align: 'r', value: (r) => (r.gDecimal === null ? null : Number(r.gDecimal.toFixed(6))) },
	{ key: 'weight', latex: '$2J+1$', align: 'r', value: (r) => r.weight }
];
