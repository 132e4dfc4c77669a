/**
 * Which computed levels the level table shows: a J filter, an energy ceiling above the lowest
 * level, and a page of at most `limit` rows (4f⁷ 5d has 3 106 levels; a page keeps the table light).
 * Plain data in and out, so it is tested without a browser.
 */

export interface WindowLevel {
	J: string;
	relative: number;
}

export interface LevelWindowOptions {
	/** J values to keep, as written in the answer ("5/2"); empty keeps every J. */
	J: readonly string[];
	/** Keep levels at most this many cm⁻¹ above the lowest; null keeps all. */
	maxRelative: number | null;
	/** At most this many rows. */
	limit: number;
}

export interface LevelWindow<L> {
	/** The rows to draw, each with its rank in the whole answer (1 = lowest level). */
	rows: { level: L; rank: number }[];
	/** How many levels pass the filters (before the page limit). */
	matching: number;
	total: number;
}

/** The first table page: 200 rows (product rule, no source). */
export const LEVEL_PAGE = 200;

/** The levels that pass the filters, in the answer's order (by energy), cut to the page. */
export function levelWindow<L extends WindowLevel>(levels: readonly L[], options: LevelWindowOptions): LevelWindow<L> {
	const keepJ = new Set(options.J);
	const rows: { level: L; rank: number }[] = [];
	let matching = 0;
	levels.forEach((level, i) => {
		if (keepJ.size > 0 && !keepJ.has(level.J)) return;
		if (options.maxRelative !== null && level.relative > options.maxRelative) return;
		matching++;
		if (rows.length < options.limit) rows.push({ level, rank: i + 1 });
	});
	return { rows, matching, total: levels.length };
}

/**
 * Label positions (y, px, growing downward) for levels drawn at `ys` (lowest level first, so ys
 * decreasing). Each label sits at its level or is pushed up to keep `gap` from the one below;
 * a label pushed more than `maxShift` from its level, or above `top`, is left out (null), so a
 * dense picture labels the levels that have room instead of drifting every label off its line.
 */
export function placeLabels(ys: readonly number[], gap: number, top: number, maxShift = Infinity): (number | null)[] {
	const out: (number | null)[] = [];
	let last = Infinity;
	for (const y of ys) {
		const at = Math.min(y, last - gap);
		if (at < top || y - at > maxShift) {
			out.push(null);
			continue;
		}
		out.push(at);
		last = at;
	}
	return out;
}
