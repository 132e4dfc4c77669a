/**
 * Rows and columns of the Term sheet export: one row per J level, with the term it belongs to.
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
}

/**
 * Seniorities as people read them: "1, 3" for two occurrences with v = 1 and v = 3, and a count
 * where several occurrences share one v: "1, 3 (2×)".
 */
export function senioritySummary(list: readonly { seniority: number; count: string }[]): string {
	return list.map((s) => (s.count === '1' ? String(s.seniority) : `${s.seniority} (${s.count}×)`)).join(', ');
}

export function levelRows(sheet: TermSheet): LevelRow[] {
	return sheet.terms.flatMap((t) =>
		t.levels.map((lv) => ({
			term: t.label,
			multiplicity: t.multiplicity,
			letter: t.letter,
			S: t.S,
			L: t.L,
			count: t.count,
			seniority: t.seniorities ? senioritySummary(t.seniorities) : '',
			parity: sheet.configuration.parity,
			J: lv.J,
			g: lv.g,
			gDecimal: lv.gDecimal,
			weight: lv.weight,
			hundRank: t.hundRank
		}))
	);
}

const odd = (r: LevelRow) => r.parity === 'odd';

export const levelColumns: Column<LevelRow>[] = [
	{
		key: 'term',
		latex: 'Term',
		value: (r) => r.term + (odd(r) ? '°' : ''),
		latexValue: (r) => latexTerm(r.multiplicity, r.letter, null, odd(r))
	},
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
