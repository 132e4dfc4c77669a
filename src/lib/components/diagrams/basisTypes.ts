import type { ExactCoefficient } from '$lib/api/types';

/** "−3/2" with a real minus sign, for display. */
export const signed = (half: string) => half.replace('-', '−');

/** A ket as text: "|3/2, −1/2⟩". */
export const ket = (a: string, b: string) => `|${signed(a)}, ${signed(b)}⟩`;

/** One row of an expansion table: a state and its components in the other basis. */
export interface ExpansionRow {
	key: string;
	cells: [string, string];
	/** The row's ket, for the "=" column. */
	ket: string;
	/** A group boundary (e.g. a new J) draws a stronger rule above the row. */
	groupStart: boolean;
	terms: { key: string; ket: string; coefficient: ExactCoefficient }[];
}
