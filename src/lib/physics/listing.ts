/**
 * Explicit microstates, only on request and one page at a time.
 *
 * A microstate (Slater determinant) picks, in each subshell l^N, N of its 2(2l+1) spin-orbitals
 * (Condon & Shortley 1935, ch. 6–7). Spin-orbitals of a subshell are numbered
 * 0, 1, 2, … = (m_l = l, ↑), (l, ↓), (l−1, ↑), (l−1, ↓), …, (−l, ↓); a subshell's determinants are
 * its N-subsets in lexicographic order (the order of `combinations` from combinatorial-generators),
 * and the microstates of a configuration are numbered in mixed radix over the open subshells,
 * the last subshell varying fastest. A page starting at any offset is reached directly: each
 * subshell's digit is turned into its determinant by a cached list (small subshells, built with
 * `combinations`) or by unranking in the combinatorial number system (large ones), so earlier
 * microstates are never generated.
 */
import { combinations } from 'combinatorial-generators';
import type { Configuration, Subshell } from './types';
import { binomial } from './microstates';
import { asSubshells, openSubshells, subshellCapacity } from './parse';

/** Largest page size accepted by `listMicrostates`. */
export const MAX_MICROSTATE_PAGE = 500;
/** Subshells with at most this many determinants are listed once with `combinations` and cached. */
export const DETERMINANT_LIST_LIMIT = 20000;

/** One occupied spin-orbital: n, l, m_l and 2m_s (±1). */
export interface SpinOrbital {
	n: number;
	l: number;
	ml: number;
	twoMs: number;
}

/** One microstate: its index in the listing, its spin-orbitals per listed subshell, M_L and 2M_S. */
export interface MicrostateItem {
	index: bigint;
	spinOrbitals: SpinOrbital[][];
	ML: number;
	twoMS: number;
}

/** A page of microstates with the total count of the configuration. */
export interface MicrostatePage {
	total: bigint;
	offset: bigint;
	/** The subshells listed, in order (open subshells, or all with `includeClosed`). */
	subshells: Subshell[];
	items: MicrostateItem[];
}

/** Options of `listMicrostates`. */
export interface ListOptions {
	/** Index of the first microstate (0-based). Default 0. */
	offset?: number | bigint;
	/** Page size, 0 … MAX_MICROSTATE_PAGE. Default 50. */
	limit?: number;
	/** Also list the spin-orbitals of closed subshells. Default false. */
	includeClosed?: boolean;
}

/**
 * The spin-orbital with index i in a subshell of orbital momentum l: m_l = l − ⌊i/2⌋, 2m_s = +1
 * for even i, −1 for odd i.
 * @example spinOrbitalAt(1, 3) // { ml: 0, twoMs: -1 }
 */
export function spinOrbitalAt(l: number, i: number): { ml: number; twoMs: number } {
	if (!Number.isInteger(i) || i < 0 || i >= subshellCapacity(l)) {
		throw new RangeError(`spin-orbital index ${i} is out of range for l = ${l}: it must be from 0 to ${subshellCapacity(l) - 1}`);
	}
	return { ml: l - Math.floor(i / 2), twoMs: i % 2 === 0 ? 1 : -1 };
}

/**
 * The k-th N-subset of {0 … M−1} in lexicographic order (combinatorial number system; Knuth,
 * TAOCP vol. 4A, §7.2.1.3). Throws RangeError when k is outside 0 … C(M, N) − 1.
 * @example unrankCombination(4, 2, 3n) // [1, 2]
 */
export function unrankCombination(M: number, N: number, k: bigint): number[] {
	const total = binomial(M, N);
	if (k < 0n || k >= total) throw new RangeError(`combination rank ${k} is out of range: it must be from 0 to ${total - 1n}`);
	const out: number[] = [];
	let c = 0;
	let rest = k;
	for (let pos = 0; pos < N; pos++) {
		for (;;) {
			const block = binomial(M - c - 1, N - pos - 1);
			if (rest < block) break;
			rest -= block;
			c++;
		}
		out.push(c);
		c++;
	}
	return out;
}

const listCache = new Map<string, number[][]>();

function determinantAt(l: number, N: number, k: bigint): number[] {
	const M = subshellCapacity(l);
	const count = binomial(M, N);
	if (count <= BigInt(DETERMINANT_LIST_LIMIT)) {
		const key = `${l},${N}`;
		let list = listCache.get(key);
		if (!list) {
			list = [
				...combinations(
					Array.from({ length: M }, (_, i) => i),
					N
				)
			];
			listCache.set(key, list);
		}
		return list[Number(k)];
	}
	return unrankCombination(M, N, k);
}

function toIndex(offset: number | bigint): bigint {
	if (typeof offset === 'bigint') {
		if (offset < 0n) throw new RangeError(`offset ${offset} is not allowed: it must be a non-negative integer`);
		return offset;
	}
	if (!Number.isSafeInteger(offset) || offset < 0)
		throw new RangeError(`offset ${offset} is not allowed: it must be a non-negative integer`);
	return BigInt(offset);
}

/**
 * Microstates of a configuration one by one, from index `start` (default 0), lazily.
 * Throws ConfigurationError for an invalid subshell, RangeError for a negative start.
 * @example iterateMicrostates(parseConfiguration('2p2')).next().value?.ML // 1 (m_l = 1↑, 1↓)
 */
export function* iterateMicrostates(
	input: Configuration | readonly Subshell[],
	start: number | bigint = 0,
	includeClosed = false
): Generator<MicrostateItem> {
	const all = asSubshells(input);
	const listed = includeClosed ? all : openSubshells(all);
	const radices = listed.map((s) => binomial(subshellCapacity(s.l), s.occupancy));
	const total = radices.reduce((a, b) => a * b, 1n);
	let index = toIndex(start);
	if (index >= total) return;
	// Mixed-radix digits of the start index, last subshell fastest.
	const digits = new Array<bigint>(listed.length).fill(0n);
	let rest = index;
	for (let i = listed.length - 1; i >= 0; i--) {
		digits[i] = rest % radices[i];
		rest /= radices[i];
	}
	while (index < total) {
		let ML = 0;
		let twoMS = 0;
		const spinOrbitals = listed.map((s, i) =>
			determinantAt(s.l, s.occupancy, digits[i]).map((k) => {
				const o = spinOrbitalAt(s.l, k);
				ML += o.ml;
				twoMS += o.twoMs;
				return { n: s.n, l: s.l, ml: o.ml, twoMs: o.twoMs };
			})
		);
		yield { index, spinOrbitals, ML, twoMS };
		index++;
		for (let i = listed.length - 1; i >= 0; i--) {
			digits[i]++;
			if (digits[i] < radices[i]) break;
			digits[i] = 0n;
		}
	}
}

/**
 * One page of the explicit microstates of a configuration, in the order described at the top of
 * this file, with the total count Π C(2(2l+1), N). Closed subshells are left out of each item
 * unless `includeClosed`. Throws RangeError when `limit` is not an integer from 0 to
 * MAX_MICROSTATE_PAGE (500) or `offset` is negative; ConfigurationError for an invalid subshell.
 * An offset at or past the total gives an empty page.
 * @example listMicrostates(parseConfiguration('2p2'), { offset: 0, limit: 3 }).total // 15n
 */
export function listMicrostates(input: Configuration | readonly Subshell[], options: ListOptions = {}): MicrostatePage {
	const limit = options.limit ?? 50;
	if (!Number.isInteger(limit) || limit < 0 || limit > MAX_MICROSTATE_PAGE) {
		throw new RangeError(`limit ${limit} is not allowed: it must be an integer from 0 to ${MAX_MICROSTATE_PAGE}`);
	}
	const offset = toIndex(options.offset ?? 0);
	const all = asSubshells(input);
	const listed = options.includeClosed ? all : openSubshells(all);
	let total = 1n;
	for (const s of all) total *= binomial(subshellCapacity(s.l), s.occupancy);
	const items: MicrostateItem[] = [];
	if (limit > 0) {
		for (const item of iterateMicrostates(all, offset, options.includeClosed ?? false)) {
			items.push(item);
			if (items.length >= limit) break;
		}
	}
	return { total, offset, subshells: listed.map((s) => ({ ...s })), items };
}
