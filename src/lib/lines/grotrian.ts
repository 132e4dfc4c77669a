/**
 * Layout of a Grotrian diagram: one column per LS term (and parity), each level a short bar at its
 * energy, and each identified line a segment from its lower to its upper level. Columns follow the
 * usual arrangement of such diagrams — spin systems side by side (singlets, then triplets, …), and
 * within a system S, P, D, … from left to right, even before odd for the same L. Levels without a
 * term stand in a last column of their own parity. Pure data in, pure data out: the picture
 * component only draws what this returns.
 */
import { parseHalf } from '../physics/half';
import { parseTermSymbol, type Parity } from '../physics/transitions';

export interface GrotrianLevel {
	energy: number;
	twoJ: number;
	parity: Parity;
	term?: { twoS: number; L: number } | null;
	label?: string | null;
}

/** A line between two levels (indices into the level list); `weight` from 0 to 1 sets its width. */
export interface GrotrianLine {
	lower: number;
	upper: number;
	weight?: number;
	title?: string;
}

export interface GrotrianColumn {
	key: string;
	x: number;
	multiplicity: number | null;
	letter: string | null;
	odd: boolean;
}

export interface GrotrianBar {
	level: number;
	x1: number;
	x2: number;
	y: number;
	J: string;
	/** How far right of the bar its J label stands: levels closer than a label's height step aside. */
	labelDx: number;
	title: string;
}

export interface GrotrianLink {
	line: number;
	x1: number;
	y1: number;
	x2: number;
	y2: number;
	width: number;
	title: string;
}

export interface GrotrianLayout {
	width: number;
	height: number;
	columns: GrotrianColumn[];
	bars: GrotrianBar[];
	links: GrotrianLink[];
	ticks: { y: number; energy: number }[];
	/** Lines left out because an index points at no level. */
	skipped: number;
}

const LETTERS = 'SPDFGHIKLMNOQRTUV';
const G = { left: 70, top: 40, bottom: 40, column: 104, bar: 52, height: 480, right: 20, labelGap: 10, labelStep: 16 };

const jText = (twoJ: number) => (twoJ % 2 === 0 ? String(twoJ / 2) : `${twoJ}/2`);

function columnKey(l: GrotrianLevel): { key: string; order: number[]; multiplicity: number | null; letter: string | null } {
	const odd = l.parity === 'odd' ? 1 : 0;
	if (!l.term) return { key: `none|${l.parity}`, order: [1e6, odd, 0], multiplicity: null, letter: null };
	const multiplicity = l.term.twoS + 1;
	return {
		key: `${multiplicity}|${l.term.L}|${l.parity}`,
		order: [multiplicity, l.term.L, odd],
		multiplicity,
		letter: LETTERS[l.term.L] ?? `L=${l.term.L}`
	};
}

/** Lexicographic order of two keys of equal length. */
function byOrder(a: number[], b: number[]): number {
	const i = a.findIndex((v, k) => v !== b[k]);
	return i < 0 ? 0 : a[i] - b[i];
}

/** A tick step of 1, 2 or 5 × 10ⁿ cm⁻¹ giving at most eight ticks over the span. */
function tickStep(span: number): number {
	const base = 10 ** Math.floor(Math.log10(Math.max(span, 1) / 5));
	return [1, 2, 5, 10].map((m) => m * base).find((s) => span / s <= 8) ?? base * 10;
}

export function grotrianLayout(levels: readonly GrotrianLevel[], lines: readonly GrotrianLine[]): GrotrianLayout {
	const keys = levels.map(columnKey);
	const unique = new Map<string, (typeof keys)[number] & { odd: boolean }>();
	keys.forEach((k, i) => unique.set(k.key, { ...k, odd: levels[i].parity === 'odd' }));
	const ordered = [...unique.values()].sort((a, b) => byOrder(a.order, b.order));
	const columns: GrotrianColumn[] = ordered.map((c, i) => ({
		key: c.key,
		x: G.left + i * G.column + G.column / 2,
		multiplicity: c.multiplicity,
		letter: c.letter,
		odd: c.odd
	}));
	const xOf = new Map(columns.map((c) => [c.key, c.x]));

	const energies = levels.map((l) => l.energy);
	const lo = energies.length ? Math.min(...energies) : 0;
	const hi = energies.length ? Math.max(...energies) : 1;
	const span = hi - lo || 1;
	const bottom = G.top + G.height;
	const y = (e: number) => bottom - ((e - lo) / span) * G.height;

	const bars: GrotrianBar[] = levels.map((l, i) => {
		const x = xOf.get(keys[i].key)!;
		const name = l.label ?? (keys[i].letter ? `${keys[i].multiplicity}${keys[i].letter}${l.parity === 'odd' ? '°' : ''}` : 'level');
		return {
			level: i,
			x1: x - G.bar / 2,
			x2: x + G.bar / 2,
			y: y(l.energy),
			J: jText(l.twoJ),
			labelDx: 2,
			title: `${name} J = ${jText(l.twoJ)} at ${l.energy} cm⁻¹`
		};
	});

	// Fine-structure levels sit a few px apart: stagger their J labels so none is drawn over another.
	const byColumn = new Map<number, GrotrianBar[]>();
	for (const b of bars) byColumn.set(b.x1, [...(byColumn.get(b.x1) ?? []), b]);
	for (const column of byColumn.values()) {
		column.sort((a, b) => b.y - a.y);
		column.forEach((b, i) => {
			const below = column[i - 1];
			if (below && below.y - b.y < G.labelGap) b.labelDx = below.labelDx + G.labelStep;
		});
	}

	let skipped = 0;
	const links: GrotrianLink[] = [];
	lines.forEach((line, i) => {
		const a = bars[line.lower];
		const b = bars[line.upper];
		if (!a || !b) {
			skipped++;
			return;
		}
		const weight = Math.min(1, Math.max(0, line.weight ?? 0.5));
		links.push({
			line: i,
			x1: (a.x1 + a.x2) / 2,
			y1: a.y,
			x2: (b.x1 + b.x2) / 2,
			y2: b.y,
			width: 0.75 + 2.25 * weight,
			title: line.title ?? `${a.title} – ${b.title}`
		});
	});

	const step = tickStep(span);
	const ticks: { y: number; energy: number }[] = [];
	for (let t = Math.ceil(lo / step) * step; t <= hi + 1e-9; t += step) ticks.push({ y: y(t), energy: t });

	return {
		width: G.left + columns.length * G.column + G.right,
		height: bottom + G.bottom,
		columns,
		bars,
		links,
		ticks,
		skipped
	};
}

/**
 * Levels as a level list gives them (J as text, the term as written, e.g. "3P" or "²D°") for the
 * layout. A term that does not read as an LS term leaves the level in the "other" column.
 */
export function grotrianLevels(
	rows: readonly { energy: number; J: string; parity: Parity; term?: string; label?: string }[]
): GrotrianLevel[] {
	return rows.map((r) => {
		let term: GrotrianLevel['term'] = null;
		try {
			if (r.term) term = parseTermSymbol(r.term);
		} catch {
			term = null;
		}
		return {
			energy: r.energy,
			twoJ: parseHalf(r.J),
			parity: r.parity,
			term: term && { twoS: term.twoS, L: term.L },
			label: r.label ?? null
		};
	});
}
