/**
 * The term-by-term decomposition shown on the State grid. The terms come from the engine
 * (`sheet.terms`); here they are only put in the classic reading order (largest S, then largest L
 * first: the block whose corner is the largest M_S, then the largest M_L, of what is left) and
 * their blocks of ones are subtracted from the counts for display.
 */
import type { TermSheet } from '$lib/physics/report';
import { halfValue, termKey } from './sheetRows';

export interface PeelTerm {
	/** "4F" */
	key: string;
	multiplicity: number;
	letter: string;
	twoS: number;
	L: number;
	/** 1 … count for a repeated term. */
	occurrence: number;
	count: number;
}

/** Most term occurrences the State grid takes out one by one (more would only freeze the page). */
export const MAX_PEEL_TERMS = 2000;

/** Each occurrence of each term, largest S first, then largest L; [] when there are more than MAX_PEEL_TERMS. */
export function peelOrder(sheet: TermSheet): PeelTerm[] {
	if (BigInt(sheet.termCount) > BigInt(MAX_PEEL_TERMS)) return [];
	const list: PeelTerm[] = [];
	for (const t of sheet.terms) {
		const count = Number(t.count);
		for (let k = 1; k <= count; k++) {
			list.push({
				key: termKey(t),
				multiplicity: t.multiplicity,
				letter: t.letter,
				twoS: t.multiplicity - 1,
				L: t.L,
				occurrence: k,
				count
			});
		}
	}
	return list.sort((a, b) => b.twoS - a.twoS || b.L - a.L || a.occurrence - b.occurrence);
}

/** Twice each M_S column value ("-3/2" → -3). */
export const twoMSOf = (sheet: TermSheet) => sheet.grid.MS.map((m) => Math.round(2 * halfValue(m)));

/** The counts left after taking out `removed` (each a block of ones: |M_L| ≤ L, |M_S| ≤ S). */
export function remainingCounts(sheet: TermSheet, removed: readonly PeelTerm[]): bigint[][] {
	const twoMS = twoMSOf(sheet);
	const counts = sheet.grid.counts.map((row) => row.map((c) => BigInt(c)));
	for (const t of removed) {
		sheet.grid.ML.forEach((ml, i) => {
			if (Math.abs(ml) > t.L) return;
			twoMS.forEach((tm, j) => {
				if (Math.abs(tm) <= t.twoS) counts[i][j] -= 1n;
			});
		});
	}
	return counts;
}

/** Grid rows and columns (0-based) that the block of a term (2S, L) covers. */
export function blockOf(sheet: TermSheet, twoS: number, L: number): { row: number; rows: number; col: number; cols: number } | null {
	const row = sheet.grid.ML.indexOf(L);
	const col = twoMSOf(sheet).indexOf(-twoS);
	if (row < 0 || col < 0) return null;
	return { row, rows: 2 * L + 1, col, cols: twoS + 1 };
}
