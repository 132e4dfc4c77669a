/** The JSON of `/api/v1/basis` as the Basis table page reads it. */
export interface ExactCoefficient {
	sign: -1 | 0 | 1;
	/** The square of the coefficient as a reduced fraction: "2/3", "1". */
	squared: string;
	value: number;
	/** Plain text: "-sqrt(1/3)", "1", "0". */
	text: string;
}

export interface BasisResponse {
	j1: string;
	j2: string;
	coupled: { J: string; M: string; components: { m1: string; m2: string; coefficient: ExactCoefficient }[] }[];
	uncoupled: { m1: string; m2: string; components: { J: string; M: string; coefficient: ExactCoefficient }[] }[];
}

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
