/**
 * Geometry of the Level diagram: a Grotrian-style chart with one column per L (S, P, D, …),
 * terms placed bottom-up in Hund's heuristic order with equal vertical steps, and each term's
 * J levels fanned out to its right. Only positions are worked out here; the order of terms
 * (hundRank) and of J inside a term (jOrder) come from the Term sheet as they are.
 */
import type { TermSheet, TermSheetTerm } from '$lib/physics/report';

/** At most this many terms are drawn; the rest are named in a note. */
export const MAX_DIAGRAM_TERMS = 100;

export const GEOMETRY = {
	/** Equal vertical step between consecutive terms (px), within these bounds. */
	stepMin: 28,
	stepMax: 44,
	/** Vertical gap between the J levels of one fan. */
	jGap: 13,
	/** Width of one lane inside an L column: label, term bar, fan, J bars, J labels. */
	lane: 156,
	/** Left gutter: rank ticks, axis, multiplicity brackets. */
	gutter: 118,
	top: 78,
	bottom: 44
};

export interface PlacedLevel {
	J: string;
	y: number;
	ground: boolean;
}

export interface PlacedTerm {
	term: TermSheetTerm;
	/** 1 = lowest in the drawn order. */
	order: number;
	/** Left edge of the lane. */
	x: number;
	y: number;
	levels: PlacedLevel[];
	ground: boolean;
}

export interface MultiplicityBlock {
	multiplicity: number;
	top: number;
	bottom: number;
}

export interface LevelLayout {
	width: number;
	height: number;
	step: number;
	terms: PlacedTerm[];
	columns: { letter: string; L: number; x: number; width: number }[];
	blocks: MultiplicityBlock[];
	/** Terms of the sheet not drawn (beyond MAX_DIAGRAM_TERMS). */
	hidden: number;
}

const half = (t: TermSheetTerm) => Math.max(((t.jOrder.length - 1) / 2) * GEOMETRY.jGap, 8) + 5;

export function levelLayout(sheet: TermSheet, maxTerms = MAX_DIAGRAM_TERMS): LevelLayout {
	const sorted = [...sheet.terms].sort((a, b) => a.hundRank - b.hundRank || b.multiplicity - a.multiplicity || b.L - a.L);
	const shown = sorted.slice(0, maxTerms);
	const n = shown.length;
	const Ls = [...new Set(shown.map((t) => t.L))].sort((a, b) => a - b);

	// The smallest equal step that keeps neighbours in one column apart (within bounds).
	// Few terms get room to breathe; many terms stay compact.
	let step = n <= 8 ? 44 : n <= 24 ? 36 : GEOMETRY.stepMin;
	for (const L of Ls) {
		const idx = shown.map((t, i) => (t.L === L ? i : -1)).filter((i) => i >= 0);
		for (let k = 1; k < idx.length; k++) {
			const need = (half(shown[idx[k - 1]]) + half(shown[idx[k]]) + 4) / (idx[k] - idx[k - 1]);
			step = Math.max(step, need);
		}
	}
	step = Math.min(Math.ceil(step), Math.max(GEOMETRY.stepMax, n <= 8 ? 60 : 0));

	const rawY = (i: number) => (n - 1 - i) * step;
	const minTop = Math.min(...shown.map((t, i) => rawY(i) - half(t)), 0);
	const yOf = (i: number) => rawY(i) - minTop + GEOMETRY.top;

	// Lanes: a term that would touch the one below it in its column moves to the next lane.
	const lanesOf = new Map<number, number[]>(); // L → bottom-most top edge per lane
	const laneOfTerm: number[] = [];
	shown.forEach((t, i) => {
		const lanes = lanesOf.get(t.L) ?? [];
		const bottomEdge = yOf(i) + half(t);
		let lane = lanes.findIndex((topEdge) => bottomEdge + 4 <= topEdge);
		if (lane < 0) lane = lanes.length;
		lanes[lane] = yOf(i) - half(t);
		lanesOf.set(t.L, lanes);
		laneOfTerm[i] = lane;
	});

	const columns: LevelLayout['columns'] = [];
	let x = GEOMETRY.gutter;
	for (const L of Ls) {
		const width = (lanesOf.get(L)?.length ?? 1) * GEOMETRY.lane;
		columns.push({ L, letter: shown.find((t) => t.L === L)!.letter, x, width });
		x += width;
	}
	const columnX = new Map(columns.map((c) => [c.L, c.x]));

	const groundTerm = sheet.hund.term;
	const terms: PlacedTerm[] = shown.map((t, i) => {
		const y = yOf(i);
		const isGround = i === 0 && t.label === groundTerm;
		const m = t.jOrder.length;
		return {
			term: t,
			order: i + 1,
			x: columnX.get(t.L)! + laneOfTerm[i] * GEOMETRY.lane,
			y,
			ground: isGround,
			levels: t.jOrder.map((J, k) => ({ J, y: y + ((m - 1) / 2 - k) * GEOMETRY.jGap, ground: isGround && J === sheet.hund.J }))
		};
	});

	const blocks: MultiplicityBlock[] = [];
	terms.forEach((p) => {
		const last = blocks[blocks.length - 1];
		if (last && last.multiplicity === p.term.multiplicity) last.top = p.y;
		else blocks.push({ multiplicity: p.term.multiplicity, top: p.y, bottom: p.y });
	});

	const maxBottom = Math.max(...terms.map((p) => p.y + half(p.term)), GEOMETRY.top);
	return { width: Math.max(x + 12, 420), height: maxBottom + GEOMETRY.bottom, step, terms, columns, blocks, hidden: sorted.length - n };
}

const MULTIPLET_NAMES = ['', 'singlets', 'doublets', 'triplets', 'quartets', 'quintets', 'sextets', 'septets', 'octets', 'nonets'];

/** "quartets" for 4, "11-plets" beyond nonets. */
export function multipletName(multiplicity: number): string {
	return MULTIPLET_NAMES[multiplicity] ?? `${multiplicity}-plets`;
}
