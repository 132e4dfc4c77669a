/**
 * Geometry of the LS → jj curves (the engine's sweep, POST /api/v1/energies/sweep): one polyline per
 * level from the LS end (left, t = 0, ζ → 0) to the jj end (right, t = 1, F^k, G^k → 0) on a linear
 * cm⁻¹ axis, LS labels at the left end, jj group labels once per distinct end energy at the right,
 * labels nudged apart so they never overlap. Shared by the Energy solver's picture and the Coupling
 * bridge. Only layout: every energy and label comes from the API; no Svelte.
 */
import { tickStep } from './observedLayout';

/** What the layout reads of a sweep answer (a SweepResult as the API returns it). */
export interface SweepInput {
	parity: 'even' | 'odd';
	t: readonly number[];
	curves: readonly { twoJ: number; J: string; rank: number; energies: readonly number[]; lsLabel: string; jjLabel: string }[];
}

export interface SweepBox {
	width: number;
	/** x of the LS end and of the jj end. */
	x0: number;
	x1: number;
	/** y of the highest and of the lowest energy. */
	top: number;
	bottom: number;
	/** Picture height (bottom plus room for the end titles and notes). */
	height: number;
	/** Least vertical distance between two labels. */
	labelGap: number;
}

export interface SweepCurveLayout {
	key: string;
	J: string;
	twoJ: number;
	rank: number;
	/** One point per t, left to right. */
	points: { x: number; y: number }[];
	/** SVG polyline `points` attribute. */
	polyline: string;
	lsText: string;
	jjText: string;
	/** cm⁻¹ at the LS end (t = 0) and at the jj end (t = 1). */
	lsEnergy: number;
	jjEnergy: number;
}

export interface SweepLabel {
	text: string;
	/** y of the curve end it names, and of the label (nudged). */
	y: number;
	labelY: number;
	energy: number;
	/** The J values of the curves it names (right labels may name several). */
	J: string[];
	/** How many curves end here. */
	count: number;
}

export interface SweepLayout extends SweepBox {
	curves: SweepCurveLayout[];
	left: SweepLabel[];
	right: SweepLabel[];
	/** Energy ticks of the common axis; none when stretched (each t has its own scale). */
	ticks: { value: number; y: number }[];
	/** The energy drawn at a height at the t of index `k` (the axis, inverted; without stretch the same for every k). */
	energyAt: (y: number, k?: number) => number;
	/** Whether each t was scaled to its own spread. */
	stretched: boolean;
	/** Lowest energy and spread (highest − lowest) of the drawn curves at the LS end and at the jj end, in cm⁻¹. */
	ends: { ls: { low: number; spread: number }; jj: { low: number; spread: number } };
}

const SUP = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SUB = '₀₁₂₃₄₅₆₇₈₉';
const sub = (t: string) => t.replace(/\d/g, (d) => SUB[Number(d)]);
const sup = (t: string) => t.replace(/\d/g, (d) => SUP[Number(d)]);

/** "3P" with J "2" → ³P₂ (° for odd parity). @example sweepLsText('3P', '2', false) // '³P₂' */
export function sweepLsText(label: string, J: string, odd: boolean): string {
	return `${sup(label.replace(/\D.*$/, ''))}${label.replace(/^\d+/, '').replace('°', '')}${odd ? '°' : ''}${sub(J)}`;
}

/** "2p_{1/2}^2 2p_{3/2}" → "2p₁/₂² 2p₃/₂". */
export function sweepJjText(label: string): string {
	return label.replace(/_\{([^}]*)\}/g, (_, j: string) => sub(j)).replace(/\^(\d+)/g, (_, k: string) => sup(k));
}

/** Labels pushed apart by at least `gap`, keeping their order (equal heights: the first lowest), not above `top`. */
export function spreadLabels(ys: readonly number[], gap: number, top: number): number[] {
	// Heights within 0.01 px count as equal (degenerate levels), and keep their input order from the bottom up.
	const near = (v: number) => Math.round(v * 100);
	const order = ys.map((_, i) => i).sort((a, b) => near(ys[b]) - near(ys[a]) || a - b);
	const placed = new Array<number>(ys.length);
	let last = Infinity;
	for (const i of order) {
		placed[i] = Math.min(ys[i], last - gap);
		last = placed[i];
	}
	let prev = -Infinity;
	for (const i of [...order].reverse()) {
		if (placed[i] < Math.max(top, prev + gap)) placed[i] = Math.max(top, prev + gap);
		prev = placed[i];
	}
	return placed;
}

/**
 * The box for `levels` curves: tall enough that every label has its `labelGap`, at least `minPlot` px of plot.
 * `compact` halves the label gap and the least plot height (the Coupling bridge's compact rows).
 */
export function sweepBox(levels: number, options: { width?: number; x0?: number; x1?: number; compact?: boolean } = {}): SweepBox {
	const labelGap = options.compact ? 11 : 14;
	const minPlot = options.compact ? 260 : 380;
	const top = 28;
	const plot = Math.max(minPlot, levels * labelGap);
	const bottom = top + plot;
	return {
		width: options.width ?? 620,
		x0: options.x0 ?? 120,
		x1: options.x1 ?? 470,
		top,
		bottom,
		height: bottom + 44,
		labelGap
	};
}

/**
 * Lays out the curves of `sweep` whose J is in `js` (null or empty: all) in `box`. The axis spans the
 * drawn curves only, so a chosen J fills the picture.
 * @example sweepLayout(answer, null, sweepBox(answer.curves.length)).curves.length // one per level
 */
export function sweepLayout(
	sweep: SweepInput,
	js: readonly string[] | null,
	box: SweepBox,
	options: { stretch?: boolean } = {}
): SweepLayout {
	const chosen = js && js.length > 0 ? new Set(js) : null;
	const shown = sweep.curves.filter((c) => !chosen || chosen.has(c.J));
	const n = sweep.t.length;
	const rangeOf = (values: number[]) => {
		if (values.length === 0) return { low: 0, spread: 0 };
		const low = Math.min(...values);
		return { low, spread: Math.max(...values) - low };
	};
	const atT = (k: number) => rangeOf(shown.map((c) => c.energies[k]));
	const last = n - 1;
	const whole = rangeOf(shown.flatMap((c) => c.energies));
	// Stretched, every t gets its own scale (its lowest level at the bottom, its highest at the top), so the
	// jj end, squeezed to a few ζ beside Slater integrals of 10⁴ cm⁻¹, opens up as wide as the LS end.
	const stretched = options.stretch === true;
	const scales = Array.from({ length: n }, (_, k) => (stretched ? atT(k) : whole));
	const ends = stretched ? { ls: scales[0], jj: scales[last] } : { ls: atT(0), jj: atT(last) };
	const spanOf = (k: number) => Math.max(1e-9, scales[k].spread);
	const y = (e: number, k = 0) => box.bottom - ((box.bottom - box.top) * (e - scales[k].low)) / spanOf(k);
	const energyAt = (yy: number, k = 0) => scales[k].low + ((box.bottom - yy) * spanOf(k)) / (box.bottom - box.top);
	const x = (t: number) => box.x0 + (box.x1 - box.x0) * t;
	const odd = sweep.parity === 'odd';

	const curves: SweepCurveLayout[] = shown.map((c) => {
		const points = c.energies.map((e, k) => ({ x: x(sweep.t[k] ?? k / Math.max(1, n - 1)), y: y(e, k) }));
		return {
			key: `${c.twoJ}:${c.rank}`,
			J: c.J,
			twoJ: c.twoJ,
			rank: c.rank,
			points,
			polyline: points.map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' '),
			lsText: c.lsLabel ? sweepLsText(c.lsLabel, c.J, odd) : `J = ${c.J}`,
			jjText: sweepJjText(c.jjLabel),
			lsEnergy: c.energies[0],
			jjEnergy: c.energies[c.energies.length - 1]
		};
	});

	const leftY = spreadLabels(
		curves.map((c) => c.points[0].y),
		box.labelGap,
		box.top - box.labelGap
	);
	const left: SweepLabel[] = curves.map((c, i) => ({
		text: c.lsText,
		y: c.points[0].y,
		labelY: leftY[i],
		energy: shown[i].energies[0],
		J: [c.J],
		count: 1
	}));

	// jj labels once per group and end energy (a jj group's levels are degenerate at F, G = 0).
	const groups = new Map<string, { text: string; energy: number; J: string[]; count: number }>();
	shown.forEach((c, i) => {
		const e = c.energies[c.energies.length - 1];
		const key = `${c.jjLabel}|${Math.round(e * 1e3)}`;
		const g = groups.get(key);
		if (g) {
			g.count++;
			if (!g.J.includes(c.J)) g.J.push(c.J);
		} else groups.set(key, { text: curves[i].jjText, energy: e, J: [c.J], count: 1 });
	});
	const list = [...groups.values()].filter((g) => g.text !== '');
	const rightY = spreadLabels(
		list.map((g) => y(g.energy, last)),
		box.labelGap,
		box.top - box.labelGap
	);
	const right: SweepLabel[] = list.map((g, i) => ({ ...g, y: y(g.energy, last), labelY: rightY[i] }));

	const ticks: { value: number; y: number }[] = [];
	if (!stretched) {
		const span = spanOf(0);
		const step = tickStep(span, 5);
		for (let v = Math.ceil(whole.low / step) * step; v <= whole.low + span + step / 1e6; v += step)
			ticks.push({ value: Number(v.toPrecision(12)), y: y(v) });
	}
	return { ...box, curves, left, right, ticks, energyAt, stretched, ends };
}

/** Colour and dash of the curves of the i-th J value (in increasing J), the same in the picture and in the J filter's swatches. */
export function jStroke(i: number): { color: string; dash: string } {
	const colors = ['var(--tc-accent)', 'var(--tc-caution)', 'var(--tc-danger)', 'var(--tc-ink)'];
	const dashes = ['', '6 3', '1.5 3'];
	return { color: colors[i % colors.length], dash: dashes[Math.floor(i / colors.length) % dashes.length] };
}
