/**
 * Line matching: which allowed level pairs of a level list explain each observed line.
 *
 * Every pair of levels allowed by the rigorous rules of the chosen types (./transitions.ts) gives a
 * Ritz wavenumber σ = E_upper − E_lower (./ritz.ts). A line with vacuum wavenumber σ_obs is explained
 * by a pair when |σ_obs − σ_Ritz| ≤ tolerance, where the tolerance is either a value the user gives
 * (in cm⁻¹, or in mÅ converted at the line's wavelength) or the combined standard uncertainty of the
 * line and both levels, √(u_line² + u_lower² + u_upper²) (GUM, JCGM 100:2008 eq. 10), times a coverage
 * factor (default 2, the usual k for about 95 %; GUM §6.3).
 *
 * The allowed transitions are built once and sorted by σ; each line then needs one binary search
 * and a scan of its window, O(T log T + N log T + matches) instead of O(N·T) for a brute-force scan.
 * `matchLinesBruteForce` is the direct method, kept as the reference for tests and the benchmark.
 *
 * Predicted lines that no observed line explains are listed when they are strong inside their LS
 * multiplet (at least STRONG_LINE_RATIO of the multiplet's strongest line, ./transitions.ts strengths)
 * and fall inside the observed range; without LS terms a line's strength is unknown and it is not listed.
 * Identifications found this way are candidates for review, not assignments.
 */
import { toVacuumAngstrom, uncertaintyToWavenumber, ANGSTROM_PER_CM, type Medium, type SpectralUnit } from './airvac';
import {
	checkTransitionTypes,
	jParityAllows,
	lineStrengthOf,
	lsVerdict,
	TRANSITION_TYPES,
	type LineStrength,
	type LsVerdict,
	type SpectralLevel,
	type TransitionType
} from './transitions';

/** Largest level list the matcher accepts. */
export const MAX_MATCH_LEVELS = 3000;
/** Largest line list the matcher accepts. */
export const MAX_MATCH_LINES = 200_000;
/** Largest number of allowed transitions the matcher builds (counted from the levels' J and parity before building). */
export const MAX_MATCH_TRANSITIONS = 3_000_000;
/** Candidates kept per line by default (the count of all of them is reported too). */
export const DEFAULT_MAX_CANDIDATES = 20;
/** Upper bound for `maxCandidates`. */
export const MAX_CANDIDATES_LIMIT = 500;
/** Unobserved predictions reported at most (the full count is given). */
export const MAX_REPORTED_PREDICTIONS = 5000;
/** A predicted line is "strong" when its strength is at least this fraction of its multiplet's strongest line. */
export const STRONG_LINE_RATIO = 0.5;
/** Default coverage factor for the combined-uncertainty tolerance (GUM §6.3, k = 2). */
export const DEFAULT_COVERAGE_FACTOR = 2;

/** Shown with every match. */
export const MATCH_CAUTION =
	'Candidates are level pairs whose Ritz wavenumber lies within the tolerance, not identifications: blends, ' +
	"unknown levels and LS labels (approximations) all need the team's review before a line is assigned.";

/** A level of the list to match: like SpectralLevel, with a known energy (cm⁻¹). */
export interface MatchLevel extends SpectralLevel {
	energy: number;
}

/** An observed line. The uncertainty is in the line's unit (Å, nm, μm or cm⁻¹). */
export interface ObservedLine {
	wavelength: number;
	unit: SpectralUnit;
	medium: Medium;
	uncertainty?: number | null;
}

/** How close a Ritz wavenumber must be to an observed line. */
export type Tolerance = { kind: 'combined'; factor?: number } | { kind: 'cm-1'; value: number } | { kind: 'mA'; value: number };

export interface MatchOptions {
	types?: readonly TransitionType[];
	tolerance?: Tolerance;
	maxCandidates?: number;
}

/** One level pair explaining a line. `residual` = σ_obs − σ_Ritz (cm⁻¹). */
export interface Candidate {
	lower: number;
	upper: number;
	type: TransitionType;
	residual: number;
	/** The tolerance this pair was held to, cm⁻¹. */
	tolerance: number;
	ls: LsVerdict | null;
	strength: LineStrength | null;
}

export interface LineMatch {
	line: number;
	/** Observed vacuum wavenumber, cm⁻¹. */
	wavenumber: number;
	candidates: Candidate[];
	/** All candidates within tolerance (may exceed `candidates.length`). */
	candidateCount: number;
}

export interface PredictedLine {
	lower: number;
	upper: number;
	type: TransitionType;
	wavenumber: number;
	vacuumA: number;
	strength: LineStrength;
}

export interface MatchResult {
	matches: LineMatch[];
	/** Indices of lines with no candidate. */
	unexplained: number[];
	/** Strong predicted lines inside the observed range that no line explains (at most MAX_REPORTED_PREDICTIONS). */
	unobserved: PredictedLine[];
	unobservedCount: number;
	/** Number of allowed transitions examined. */
	transitionCount: number;
}

const TYPE_CODE: Record<TransitionType, number> = { E1: 0, M1: 1, E2: 2 };

/** The allowed transitions of a level list sorted by Ritz wavenumber, in flat typed arrays. */
export interface TransitionTable {
	sigma: Float64Array;
	/** u(σ) of the Ritz difference, 0 when unknown. */
	uncertainty: Float64Array;
	lower: Int32Array;
	upper: Int32Array;
	type: Uint8Array;
	/** Largest u(σ) in the table. */
	maxUncertainty: number;
	length: number;
}

function checkLevels(levels: readonly MatchLevel[]): void {
	if (!Array.isArray(levels)) throw new RangeError('levels must be a list');
	if (levels.length > MAX_MATCH_LEVELS)
		throw new RangeError(`${levels.length} levels given; the matcher accepts at most ${MAX_MATCH_LEVELS}`);
	levels.forEach((l, i) => {
		if (!Number.isFinite(l.energy)) throw new RangeError(`level ${i}: the energy must be a finite number of cm⁻¹, got ${l.energy}`);
		if (!Number.isInteger(l.twoJ) || l.twoJ < 0) throw new RangeError(`level ${i}: 2J must be a non-negative integer, got ${l.twoJ}`);
		if (l.parity !== 'even' && l.parity !== 'odd')
			throw new RangeError(`level ${i}: parity must be "even" or "odd", got "${String(l.parity)}"`);
		if (l.uncertainty != null && (!Number.isFinite(l.uncertainty) || l.uncertainty < 0)) {
			throw new RangeError(`level ${i}: the uncertainty must be a number ≥ 0 (cm⁻¹), got ${l.uncertainty}`);
		}
	});
}

/**
 * An upper bound of the transitions `transitionTable` would build, from the counts of levels per
 * (2J, parity) alone (exact except for pairs of equal energy, which give no line). Cheap: O(levels + buckets²).
 */
export function countAllowedTransitions(levels: readonly MatchLevel[], types: readonly TransitionType[]): number {
	const buckets = new Map<string, { twoJ: number; parity: 'even' | 'odd'; n: number }>();
	for (const l of levels) {
		const k = `${l.twoJ}|${l.parity}`;
		const b = buckets.get(k);
		if (b) b.n++;
		else buckets.set(k, { twoJ: l.twoJ, parity: l.parity, n: 1 });
	}
	const list = [...buckets.values()];
	let total = 0;
	for (let a = 0; a < list.length; a++) {
		for (let b = a; b < list.length; b++) {
			const pairs = a === b ? (list[a].n * (list[a].n - 1)) / 2 : list[a].n * list[b].n;
			for (const t of types) if (jParityAllows(t, list[a].twoJ, list[a].parity, list[b].twoJ, list[b].parity)) total += pairs;
		}
	}
	return total;
}

/**
 * Builds the allowed transitions of `levels` for `types`, sorted by Ritz wavenumber (rules of ./transitions.ts).
 * Throws RangeError when the levels are over MAX_MATCH_LEVELS, a level is malformed, or the count of
 * allowed transitions is over MAX_MATCH_TRANSITIONS (checked before building).
 * @example transitionTable([{ twoJ: 0, parity: 'even', energy: 0 }, { twoJ: 2, parity: 'odd', energy: 100 }], ['E1']).sigma // [100]
 */
export function transitionTable(levels: readonly MatchLevel[], types: readonly TransitionType[]): TransitionTable {
	checkLevels(levels);
	const chosen = checkTransitionTypes(types);
	const expected = countAllowedTransitions(levels, chosen);
	if (expected > MAX_MATCH_TRANSITIONS) {
		throw new RangeError(
			`these levels allow ${expected} transitions of the chosen types; the matcher handles at most ${MAX_MATCH_TRANSITIONS} — use fewer levels or types`
		);
	}
	const n = levels.length;
	const energy = Float64Array.from(levels, (l) => l.energy);
	const u = Float64Array.from(levels, (l) => l.uncertainty ?? 0);
	const twoJ = Int32Array.from(levels, (l) => l.twoJ);
	const odd = Uint8Array.from(levels, (l) => (l.parity === 'odd' ? 1 : 0));
	const wantE1 = chosen.includes('E1');
	const wantM1 = chosen.includes('M1');
	const wantE2 = chosen.includes('E2');
	// Bucket (distribution) sort by σ done while listing the pairs (Knuth, TAOCP vol. 3, §5.2.5): σ lies in
	// [0, E_max − E_min], so a first pass counts the pairs per equal-width bucket, a second pass writes each
	// pair straight into its bucket's slot, and an insertion sort finishes each (small) bucket. O(T) for
	// spread-out wavenumbers, no comparator calls and no index permutation to gather.
	let minE = Infinity;
	let maxE = -Infinity;
	for (let i = 0; i < n; i++) {
		if (energy[i] < minE) minE = energy[i];
		if (energy[i] > maxE) maxE = energy[i];
	}
	const buckets = Math.max(1, expected);
	const scale = maxE > minE ? (buckets - 1) / (maxE - minE) : 0;
	const start = new Int32Array(buckets + 1);
	const sigma = new Float64Array(expected);
	const lower = new Int32Array(expected);
	const upper = new Int32Array(expected);
	const type = new Uint8Array(expected);
	let fill = start;
	for (let pass = 0; pass < 2; pass++) {
		if (pass === 1) {
			for (let k = 0; k < buckets; k++) start[k + 1] += start[k];
			fill = start.slice(0, buckets);
		}
		for (let i = 0; i < n; i++) {
			const ja = twoJ[i];
			const pa = odd[i];
			const ea = energy[i];
			for (let j = i + 1; j < n; j++) {
				const gap = energy[j] - ea;
				if (gap === 0) continue;
				const jb = twoJ[j];
				const sum = ja + jb;
				if ((sum & 1) !== 0) continue; // J and J′ must both be integral or both half-integral
				const diff = ja > jb ? ja - jb : jb - ja;
				// The triangle rule |J − J′| ≤ k ≤ J + J′ with k = 1 (E1, M1) or 2 (E2), in doubled units, and the
				// parity rule: the same test as jParityAllows, unrolled for speed.
				let codes = 0; // bit 0: E1, bit 1: M1, bit 2: E2
				if (pa !== odd[j]) {
					if (wantE1 && diff <= 2 && sum >= 2) codes = 1;
				} else {
					if (wantM1 && diff <= 2 && sum >= 2) codes |= 2;
					if (wantE2 && diff <= 4 && sum >= 4) codes |= 4;
				}
				if (codes === 0) continue;
				const abs = gap > 0 ? gap : -gap;
				const bucket = Math.floor(abs * scale);
				for (let code = 0; code < 3; code++) {
					if ((codes & (1 << code)) === 0) continue;
					if (pass === 0) start[bucket + 1]++;
					else {
						const pos = fill[bucket]++;
						sigma[pos] = abs;
						lower[pos] = gap > 0 ? i : j;
						upper[pos] = gap > 0 ? j : i;
						type[pos] = code;
					}
				}
			}
		}
	}
	const count = start[buckets]; // pairs of equal energy (no line) are in `expected` but were skipped here
	for (let bk = 0; bk < buckets; bk++) {
		const first = start[bk];
		for (let x = first + 1; x < start[bk + 1]; x++) {
			const v = sigma[x];
			const lo = lower[x];
			const up = upper[x];
			const ty = type[x];
			let y = x - 1;
			while (y >= first && sigma[y] > v) {
				sigma[y + 1] = sigma[y];
				lower[y + 1] = lower[y];
				upper[y + 1] = upper[y];
				type[y + 1] = type[y];
				y--;
			}
			sigma[y + 1] = v;
			lower[y + 1] = lo;
			upper[y + 1] = up;
			type[y + 1] = ty;
		}
	}
	const uncertainty = new Float64Array(count);
	let maxUncertainty = 0;
	for (let k = 0; k < count; k++) {
		const ul = u[lower[k]];
		const uu = u[upper[k]];
		const c = Math.sqrt(ul * ul + uu * uu);
		uncertainty[k] = c;
		if (c > maxUncertainty) maxUncertainty = c;
	}
	return {
		sigma: sigma.subarray(0, count),
		uncertainty,
		lower: lower.subarray(0, count),
		upper: upper.subarray(0, count),
		type: type.subarray(0, count),
		maxUncertainty,
		length: count
	};
}

/** First index k with sigma[k] ≥ x (binary search). */
function lowerBound(sigma: Float64Array, x: number): number {
	let lo = 0;
	let hi = sigma.length;
	while (lo < hi) {
		const mid = (lo + hi) >>> 1;
		if (sigma[mid] < x) lo = mid + 1;
		else hi = mid;
	}
	return lo;
}

interface PreparedLine {
	sigma: number;
	/** u(σ_obs), cm⁻¹. */
	u: number;
	/** A fixed tolerance in cm⁻¹, or null for the combined one. */
	fixed: number | null;
}

function prepareLines(lines: readonly ObservedLine[], tolerance: Tolerance): PreparedLine[] {
	if (!Array.isArray(lines)) throw new RangeError('lines must be a list');
	if (lines.length > MAX_MATCH_LINES) throw new RangeError(`${lines.length} lines given; the matcher accepts at most ${MAX_MATCH_LINES}`);
	return lines.map((line, i) => {
		let vacuumA: number;
		try {
			vacuumA = toVacuumAngstrom(line.wavelength, line.unit, line.medium);
		} catch (e) {
			throw new RangeError(`line ${i}: ${(e as Error).message}`, { cause: e });
		}
		const sigma = ANGSTROM_PER_CM / vacuumA;
		let u = 0;
		if (line.uncertainty != null) {
			try {
				u = uncertaintyToWavenumber(line.uncertainty, line.unit, vacuumA);
			} catch (e) {
				throw new RangeError(`line ${i}: ${(e as Error).message}`, { cause: e });
			}
		}
		let fixed: number | null = null;
		if (tolerance.kind === 'cm-1') fixed = tolerance.value;
		else if (tolerance.kind === 'mA') fixed = (ANGSTROM_PER_CM * (tolerance.value / 1000)) / (vacuumA * vacuumA);
		return { sigma, u, fixed };
	});
}

function checkTolerance(tolerance: Tolerance): number {
	if (tolerance.kind === 'combined') {
		const f = tolerance.factor ?? DEFAULT_COVERAGE_FACTOR;
		if (!Number.isFinite(f) || f <= 0 || f > 10)
			throw new RangeError(`the coverage factor must be a number above 0 and at most 10, got ${f}`);
		return f;
	}
	if (tolerance.kind === 'cm-1' || tolerance.kind === 'mA') {
		if (!Number.isFinite(tolerance.value) || tolerance.value < 0) {
			throw new RangeError(`the tolerance must be a number ≥ 0 (${tolerance.kind === 'mA' ? 'mÅ' : 'cm⁻¹'}), got ${tolerance.value}`);
		}
		return 1;
	}
	throw new RangeError('the tolerance kind must be "combined", "cm-1" or "mA"');
}

function checkMaxCandidates(m: number | undefined): number {
	const v = m ?? DEFAULT_MAX_CANDIDATES;
	if (!Number.isInteger(v) || v < 1 || v > MAX_CANDIDATES_LIMIT)
		throw new RangeError(`maxCandidates must be an integer from 1 to ${MAX_CANDIDATES_LIMIT}, got ${m}`);
	return v;
}

/** Strengths by a numeric key of (type, 2S, L, 2J) of both levels; built on first use, per call of matchLines. */
type StrengthCache = Map<number, { ls: LsVerdict; strength: LineStrength | null }>;

function describePair(
	levels: readonly MatchLevel[],
	lower: number,
	upper: number,
	type: TransitionType,
	cache: StrengthCache
): { ls: LsVerdict | null; strength: LineStrength | null } {
	const a = levels[lower];
	const b = levels[upper];
	if (!a.term || !b.term) return { ls: null, strength: null };
	const same = a.term.twoS === b.term.twoS && a.term.L === b.term.L && a.parity === b.parity && (a.group ?? '') === (b.group ?? '');
	const small = a.term.twoS < 32 && b.term.twoS < 32 && a.term.L < 64 && b.term.L < 64 && a.twoJ < 128 && b.twoJ < 128;
	const key = small
		? ((((((TYPE_CODE[type] * 2 + (same ? 1 : 0)) * 32 + a.term.twoS) * 64 + a.term.L) * 128 + a.twoJ) * 32 + b.term.twoS) * 64 +
				b.term.L) *
				128 +
			b.twoJ
		: -1;
	const hit = key >= 0 ? cache.get(key) : undefined;
	if (hit) return hit;
	const ls = lsVerdict(type, a.term, b.term, same);
	const value = { ls, strength: ls.allowed ? lineStrengthOf(type, a.term, a.twoJ, b.term, b.twoJ) : null };
	if (key >= 0) cache.set(key, value);
	return value;
}

function rank(candidates: Candidate[], max: number): Candidate[] {
	candidates.sort(
		(p, q) => Math.abs(p.residual) - Math.abs(q.residual) || p.lower - q.lower || p.upper - q.upper || TYPE_CODE[p.type] - TYPE_CODE[q.type]
	);
	return candidates.length > max ? candidates.slice(0, max) : candidates;
}

/**
 * Matches observed lines against a level list (module comment): for each line, every allowed pair within
 * the tolerance, ranked by |residual|; the lines nothing explains; the strong predicted lines no line explains.
 * Throws RangeError on the budgets (MAX_MATCH_LEVELS, MAX_MATCH_LINES, MAX_MATCH_TRANSITIONS, checked before
 * the work), on a malformed level or line (naming its index), a bad tolerance or maxCandidates, an unknown type.
 * @example matchLines([{ twoJ: 0, parity: 'even', energy: 0 }, { twoJ: 2, parity: 'odd', energy: 20000 }],
 *   [{ wavelength: 5000, unit: 'A', medium: 'vacuum' }], { tolerance: { kind: 'cm-1', value: 0.1 } }).matches[0].candidates[0].residual // 0
 */
export function matchLines(levels: readonly MatchLevel[], lines: readonly ObservedLine[], options: MatchOptions = {}): MatchResult {
	const types = checkTransitionTypes(options.types ?? TRANSITION_TYPES);
	const tolerance = options.tolerance ?? { kind: 'combined' };
	const factor = checkTolerance(tolerance);
	const maxCandidates = checkMaxCandidates(options.maxCandidates);
	checkLevels(levels);
	const prepared = prepareLines(lines, tolerance);
	const table = transitionTable(levels, types);
	const explained = new Uint8Array(table.length);
	const cache: StrengthCache = new Map();

	const matches: LineMatch[] = [];
	const unexplained: number[] = [];
	let minSigma = Infinity;
	let maxSigma = -Infinity;
	prepared.forEach((p, index) => {
		const window = p.fixed ?? factor * Math.hypot(p.u, table.maxUncertainty);
		minSigma = Math.min(minSigma, p.sigma - window);
		maxSigma = Math.max(maxSigma, p.sigma + window);
		const found: Candidate[] = [];
		for (let k = lowerBound(table.sigma, p.sigma - window); k < table.length && table.sigma[k] <= p.sigma + window; k++) {
			const residual = p.sigma - table.sigma[k];
			const tol = p.fixed ?? factor * Math.hypot(p.u, table.uncertainty[k]);
			if (Math.abs(residual) > tol) continue;
			explained[k] = 1;
			const type = TRANSITION_TYPES[table.type[k]];
			found.push({ lower: table.lower[k], upper: table.upper[k], type, residual, tolerance: tol, ls: null, strength: null });
		}
		if (found.length === 0) unexplained.push(index);
		const kept = rank(found, maxCandidates);
		for (const c of kept) Object.assign(c, describePair(levels, c.lower, c.upper, c.type, cache));
		matches.push({ line: index, wavenumber: p.sigma, candidates: kept, candidateCount: found.length });
	});

	const unobserved: PredictedLine[] = [];
	let unobservedCount = 0;
	if (prepared.length > 0) {
		for (let k = lowerBound(table.sigma, minSigma); k < table.length && table.sigma[k] <= maxSigma; k++) {
			if (explained[k]) continue;
			const type = TRANSITION_TYPES[table.type[k]];
			const { strength } = describePair(levels, table.lower[k], table.upper[k], type, cache);
			if (!strength || strength.ofStrongest < STRONG_LINE_RATIO) continue;
			unobservedCount++;
			if (unobserved.length < MAX_REPORTED_PREDICTIONS) {
				unobserved.push({
					lower: table.lower[k],
					upper: table.upper[k],
					type,
					wavenumber: table.sigma[k],
					vacuumA: ANGSTROM_PER_CM / table.sigma[k],
					strength
				});
			}
		}
	}
	return { matches, unexplained, unobserved, unobservedCount, transitionCount: table.length };
}

/**
 * The direct method, for tests and the benchmark: for each line, every pair of levels is checked against
 * the rules and the tolerance. Same candidates (all of them, unranked beyond |residual|) as `matchLines`;
 * O(lines × levels²). Throws like `matchLines`.
 */
export function matchLinesBruteForce(
	levels: readonly MatchLevel[],
	lines: readonly ObservedLine[],
	options: MatchOptions = {}
): Candidate[][] {
	const types = checkTransitionTypes(options.types ?? TRANSITION_TYPES);
	const tolerance = options.tolerance ?? { kind: 'combined' };
	const factor = checkTolerance(tolerance);
	checkLevels(levels);
	const prepared = prepareLines(lines, tolerance);
	return prepared.map((p) => {
		const found: Candidate[] = [];
		for (let i = 0; i < levels.length; i++) {
			for (let j = i + 1; j < levels.length; j++) {
				const gap = levels[j].energy - levels[i].energy;
				if (gap === 0) continue;
				const [lo, up] = gap > 0 ? [i, j] : [j, i];
				const residual = p.sigma - Math.abs(gap);
				const tol = p.fixed ?? factor * Math.hypot(p.u, Math.sqrt((levels[i].uncertainty ?? 0) ** 2 + (levels[j].uncertainty ?? 0) ** 2));
				if (Math.abs(residual) > tol) continue;
				for (const t of types) {
					if (jParityAllows(t, levels[i].twoJ, levels[i].parity, levels[j].twoJ, levels[j].parity)) {
						found.push({ lower: lo, upper: up, type: t, residual, tolerance: tol, ls: null, strength: null });
					}
				}
			}
		}
		return rank(found, Number.MAX_SAFE_INTEGER);
	});
}
