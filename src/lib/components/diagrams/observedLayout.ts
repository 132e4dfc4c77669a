/**
 * Geometry of the observed-level diagram: levels with an annotated energy drawn at their energy
 * (linear cm⁻¹ axis), one column per term occurrence, columns ordered by their lowest level.
 * Bars sit at their true heights; only the J labels are nudged apart when levels crowd.
 * Pure layout, no Svelte.
 */

export interface ObservedLevelInput {
	key: string;
	term: string;
	multiplicity: number;
	letter: string;
	occurrence: number;
	count: number;
	J: string;
	energy: number;
	uncertainty: number | null;
	status: 'proposed' | 'confirmed' | 'disputed';
}

export interface PlacedLevel extends ObservedLevelInput {
	y: number;
	labelY: number;
}

export interface ObservedColumn {
	id: string;
	x: number;
	multiplicity: number;
	letter: string;
	index: number | null;
	levels: PlacedLevel[];
}

export const OBSERVED_GEOMETRY = {
	top: 64,
	bottom: 36,
	plotHeight: 420,
	axisX: 78,
	columnWidth: 92,
	barWidth: 44,
	minLabelGap: 12,
	minWidth: 520
};

/** Round tick steps 1, 2, 5 × 10^k giving about `target` ticks over `span`. */
export function tickStep(span: number, target = 6): number {
	if (!(span > 0)) return 1;
	const raw = span / target;
	const power = 10 ** Math.floor(Math.log10(raw));
	const m = raw / power;
	return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * power;
}

export function observedLayout(levels: readonly ObservedLevelInput[]) {
	const G = OBSERVED_GEOMETRY;
	const energies = levels.map((l) => l.energy);
	const lo = Math.min(0, ...energies);
	const hiRaw = Math.max(...energies, lo + 1);
	const step = tickStep(hiRaw - lo);
	const hi = Math.ceil(hiRaw / step) * step;
	const y = (e: number) => G.top + G.plotHeight * (1 - (e - lo) / (hi - lo));
	const ticks: { value: number; y: number }[] = [];
	for (let v = Math.ceil(lo / step) * step; v <= hi + step / 1e6; v += step) ticks.push({ value: Number(v.toPrecision(12)), y: y(v) });

	const groups = new Map<string, ObservedLevelInput[]>();
	for (const l of levels) {
		const id = `${l.term}#${l.occurrence}`;
		groups.set(id, [...(groups.get(id) ?? []), l]);
	}
	const columns: ObservedColumn[] = [...groups.entries()]
		.map(([id, ls]) => ({ id, ls: [...ls].sort((a, b) => a.energy - b.energy) }))
		.sort((a, b) => a.ls[0].energy - b.ls[0].energy)
		.map(({ id, ls }, i) => {
			const placed: PlacedLevel[] = ls.map((l) => ({ ...l, y: y(l.energy), labelY: y(l.energy) }));
			// Push labels upward (lower y) so none is closer than minLabelGap to the one below it.
			for (let k = 1; k < placed.length; k++) placed[k].labelY = Math.min(placed[k].labelY, placed[k - 1].labelY - G.minLabelGap);
			return {
				id,
				x: G.axisX + 24 + i * G.columnWidth,
				multiplicity: ls[0].multiplicity,
				letter: ls[0].letter,
				index: ls[0].count > 1 ? ls[0].occurrence : null,
				levels: placed
			};
		});
	const lowestLabel = Math.min(G.top, ...columns.flatMap((c) => c.levels.map((l) => l.labelY)));
	const shift = lowestLabel < G.top ? G.top - lowestLabel : 0;
	return {
		columns,
		ticks,
		shift,
		// Wide enough for the title even with a single column.
		width: Math.max(G.minWidth, G.axisX + 24 + columns.length * G.columnWidth + 16),
		height: G.top + G.plotHeight + G.bottom + shift
	};
}
