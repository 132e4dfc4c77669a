/**
 * Geometry of the Coupling bridge picture, kept apart from the data and the drawing so that other
 * layers (computed sweep curves, for instance) can be placed on the same columns: two columns
 * (LS, jj) or three (LS, jK, jj), each level at a row of equal step, lowest at the bottom.
 * Only layout: every label and order comes from the API.
 */

export type BridgeColumnId = 'ls' | 'jk' | 'jj';

export interface BridgeColumn {
	id: BridgeColumnId;
	/** x of the level bar's two ends. */
	bar: readonly [number, number];
	title: string;
	subtitle: string;
}

export interface BridgeGeometry {
	columns: BridgeColumn[];
	width: number;
	height: number;
	/** Row step in px, and y of the top row. */
	step: number;
	top: number;
	/** y of the i-th level (0 = lowest) of a column. */
	yOf: (i: number) => number;
	/** x where a column's bar starts and ends. */
	column: (id: BridgeColumnId) => BridgeColumn | undefined;
	/** SVG path of a link from level i of column a to level j of the next column b. */
	curve: (a: BridgeColumnId, i: number, b: BridgeColumnId, j: number) => string;
}

const STEP = 40;
/** Compact rows for bridges of many levels: one label line per level. */
const COMPACT_STEP = 20;
const TOP = 104;

/**
 * The geometry for `rows` levels per column; `jjLabelChars` sizes the room for the jj labels.
 * With `withJk` the middle column holds the jK levels, their labels set above the bars; `compact`
 * halves the row step (the picture then draws one short label line per level).
 */
export function bridgeGeometry(rows: number, withJk: boolean, jjLabelChars: number, compact = false): BridgeGeometry {
	const step = compact ? COMPACT_STEP : STEP;
	const columns: BridgeColumn[] = withJk
		? [
				{ id: 'ls', bar: [128, 180], title: 'LS coupling', subtitle: "Hund's heuristic order" },
				{ id: 'jk', bar: [340, 560], title: 'jK coupling', subtitle: 'core level, then K' },
				{ id: 'jj', bar: [700, 752], title: 'jj coupling', subtitle: 'spin–orbit order, ζ per subshell' }
			]
		: [
				{ id: 'ls', bar: [128, 180], title: 'LS coupling', subtitle: "Hund's heuristic order" },
				{ id: 'jj', bar: [420, 472], title: 'jj coupling', subtitle: 'first-order spin–orbit order' }
			];
	const jjBar = columns[columns.length - 1].bar;
	const width = Math.max(jjBar[1] + 16 + Math.max(12, jjLabelChars) * 7.8, 640);
	const height = TOP + (Math.max(rows, 1) - 1) * step + 70;
	const yOf = (i: number) => TOP + (rows - 1 - i) * step;
	const column = (id: BridgeColumnId) => columns.find((c) => c.id === id);
	const curve = (a: BridgeColumnId, i: number, b: BridgeColumnId, j: number) => {
		const x0 = column(a)!.bar[1];
		const x1 = column(b)!.bar[0];
		const xm = (x0 + x1) / 2;
		return `M ${x0} ${yOf(i)} C ${xm} ${yOf(i)}, ${xm} ${yOf(j)}, ${x1} ${yOf(j)}`;
	};
	return { columns, width, height, step, top: TOP, yOf, column, curve };
}
