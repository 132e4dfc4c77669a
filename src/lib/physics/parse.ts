/**
 * Electron-configuration notation: reading, checking and writing.
 *
 * A configuration lists subshells n l^N, the notation of Condon & Shortley (1935) and
 * Cowan (1981): `1s2 2s2 2p6`, `[Ar] 3d5 4s`, `4f7.5d.6s2`, `3d⁵4s¹`, `1s^2 2s^2`. An l
 * subshell holds at most 2(2l+1) electrons (Pauli principle). The parity is (−1)^Σ l over all
 * electrons (Condon & Shortley 1935, parity of a configuration; Cowan 1981, same), so only the
 * l·N of each subshell matters.
 */
import type { Configuration, ParentSpec, Subshell, TermSpec } from './types';
import { L_LETTERS, MAX_LETTER_L, letterToL, lLetter, termLetterToL } from './letters';
import { InputError } from './input-error';

/** "a" or "an" before a letter or number as it is read aloud: an s, an f, a p, an 8d, an 11s. */
function articleFor(word: string): 'a' | 'an' {
	return /^([sfhilmnor]|8|11|18)/.test(word) ? 'an' : 'a';
}

/** A configuration that cannot be read or does not exist; `token` is the offending piece of the input. */
export class ConfigurationError extends InputError {
	constructor(message: string, token: string) {
		super(message, token);
		this.name = 'ConfigurationError';
	}
}

/** Longest configuration text accepted, in characters. */
export const MAX_CONFIGURATION_LENGTH = 200;
/** Principal quantum numbers accepted: 1 … MAX_N. */
export const MAX_N = 20;

/** Standard noble-gas cores, each as its full list of closed subshells (the ground configurations of He … Rn in the NIST/CRC periodic table). */
export const NOBLE_GAS_CORES: Readonly<Record<string, readonly Subshell[]>> = buildCores();

/** The core names in increasing size. */
export const CORE_NAMES = ['He', 'Ne', 'Ar', 'Kr', 'Xe', 'Rn'] as const;

function buildCores(): Record<string, Subshell[]> {
	const add = (base: Subshell[], extra: [number, number][]): Subshell[] => [
		...base,
		...extra.map(([n, l]) => ({ n, l, occupancy: 4 * l + 2 }))
	];
	const He = add([], [[1, 0]]);
	const Ne = add(He, [
		[2, 0],
		[2, 1]
	]);
	const Ar = add(Ne, [
		[3, 0],
		[3, 1]
	]);
	const Kr = add(Ar, [
		[3, 2],
		[4, 0],
		[4, 1]
	]);
	const Xe = add(Kr, [
		[4, 2],
		[5, 0],
		[5, 1]
	]);
	const Rn = add(Xe, [
		[4, 3],
		[5, 2],
		[6, 0],
		[6, 1]
	]);
	const cores: Record<string, Subshell[]> = { He, Ne, Ar, Kr, Xe, Rn };
	for (const k of Object.keys(cores)) {
		cores[k] = cores[k].sort(bySubshellOrder);
		for (const s of cores[k]) Object.freeze(s);
		Object.freeze(cores[k]);
	}
	return cores;
}

/**
 * The number of electrons an l subshell holds, 2(2l+1) (Pauli principle).
 * @example subshellCapacity(1) // 6
 */
export function subshellCapacity(l: number): number {
	return 4 * l + 2;
}

/** Order subshells by n, then l. */
export function bySubshellOrder(a: { n: number; l: number }, b: { n: number; l: number }): number {
	return a.n - b.n || a.l - b.l;
}

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

function toSuperscript(k: number): string {
	return String(k)
		.split('')
		.map((d) => SUPERSCRIPT_DIGITS[Number(d)])
		.join('');
}

/**
 * The label of one subshell, e.g. "3d5", "4s" (occupancy 1 written without a number) or "3d⁵".
 * Throws RangeError when l has no letter.
 * @example subshellLabel({ n: 3, l: 2, occupancy: 5 }, true) // '3d⁵'
 */
export function subshellLabel(s: Subshell, superscripts = false): string {
	const head = `${s.n}${lLetter(s.l)}`;
	if (s.occupancy === 1) return head;
	return head + (superscripts ? toSuperscript(s.occupancy) : String(s.occupancy));
}

/**
 * Parity of a list of subshells, (−1)^Σ l·N (Condon & Shortley 1935; Cowan 1981).
 * @example parityOf([{ n: 2, l: 1, occupancy: 3 }]) // 'odd'
 */
export function parityOf(subshells: readonly Subshell[]): 'even' | 'odd' {
	let sum = 0;
	for (const s of subshells) sum += s.l * s.occupancy;
	return sum % 2 === 0 ? 'even' : 'odd';
}

/**
 * Subshells that are neither empty nor full (0 < N < 2(2l+1)).
 * @example openSubshells(parseConfiguration('[Ar] 3d5 4s')).length // 2
 */
export function openSubshells(input: Configuration | readonly Subshell[]): Subshell[] {
	const list = 'subshells' in input ? input.subshells : input;
	return list.filter((s) => s.occupancy > 0 && s.occupancy < subshellCapacity(s.l));
}

function checkSubshell(s: Subshell, token: string): void {
	if (!Number.isInteger(s.n) || s.n < 1 || s.n > MAX_N) {
		throw new ConfigurationError(`n = ${s.n} in "${token}" is out of range: n must be an integer from 1 to ${MAX_N}`, token);
	}
	if (!Number.isInteger(s.l) || s.l < 0 || s.l > MAX_LETTER_L) {
		throw new ConfigurationError(`l = ${s.l} in "${token}" is out of range: l must be an integer from 0 to ${MAX_LETTER_L}`, token);
	}
	const letter = L_LETTERS[s.l];
	if (s.l >= s.n) {
		throw new ConfigurationError(
			`${articleFor(String(s.n))} ${s.n}${letter} subshell does not exist: l must be smaller than n (${letter} means l = ${s.l}, so n must be at least ${s.l + 1})`,
			token
		);
	}
	const cap = subshellCapacity(s.l);
	if (!Number.isInteger(s.occupancy) || s.occupancy < 1) {
		throw new ConfigurationError(
			`occupancy ${s.occupancy} in "${token}" is not allowed: ${articleFor(letter)} ${letter} subshell takes 1 to ${cap} electrons (leave out empty subshells)`,
			token
		);
	}
	if (s.occupancy > cap) {
		throw new ConfigurationError(
			`${articleFor(letter)} ${letter} subshell holds at most ${cap} electrons, "${token}" has ${s.occupancy}`,
			token
		);
	}
}

function coreOf(name: string, token: string): { name: string; subshells: readonly Subshell[] } {
	const key = name.charAt(0).toUpperCase() + name.slice(1).toLowerCase();
	const subshells = NOBLE_GAS_CORES[key];
	if (!subshells) {
		throw new ConfigurationError(`${token} is not a noble-gas core: use ${CORE_NAMES.map((c) => `[${c}]`).join(' ')}`, token);
	}
	return { name: key, subshells };
}

function assemble(entries: { s: Subshell; token: string; fromCore: string | null }[], core: string | null): Configuration {
	const seen = new Map<string, { token: string; fromCore: string | null }>();
	const subshells: Subshell[] = [];
	for (const { s, token, fromCore } of entries) {
		const key = `${s.n},${s.l}`;
		const before = seen.get(key);
		if (before) {
			const label = `${s.n}${L_LETTERS[s.l]}`;
			const coreName = before.fromCore ?? fromCore;
			const message = coreName
				? `${label} is given twice: the [${coreName}] core already contains ${label}${subshellCapacity(s.l)}; list it once`
				: `${label} is given twice ("${before.token}" and "${token}"); list each subshell once`;
			throw new ConfigurationError(message, token);
		}
		seen.set(key, { token, fromCore });
		subshells.push({ n: s.n, l: s.l, occupancy: s.occupancy });
	}
	subshells.sort(bySubshellOrder);
	let electrons = 0;
	for (const s of subshells) electrons += s.occupancy;
	checkedLists.add(subshells);
	return { subshells, electrons, parity: parityOf(subshells), core };
}

/** Subshell lists that the parser or `configurationOf` built and checked: the engine trusts them without checking again. */
const checkedLists = new WeakSet<readonly Subshell[]>();

/**
 * A checked Configuration from a list of subshells (any order; sorted by n then l) and an
 * optional noble-gas core name whose subshells are added. Throws ConfigurationError (with the
 * subshell label as `token`) for n outside 1…20, l ≥ n, an occupancy outside 1…2(2l+1), or a
 * subshell given twice (also when the core already holds it).
 * @example configurationOf([{ n: 4, l: 0, occupancy: 1 }, { n: 3, l: 2, occupancy: 5 }], 'Ar').electrons // 24
 */
export function configurationOf(subshells: readonly Subshell[], core: string | null = null): Configuration {
	const entries: { s: Subshell; token: string; fromCore: string | null }[] = [];
	let coreName: string | null = null;
	if (core !== null) {
		const c = coreOf(core, `[${core}]`);
		coreName = c.name;
		for (const s of c.subshells) entries.push({ s, token: `[${c.name}]`, fromCore: c.name });
	}
	for (const s of subshells) {
		const token = Number.isInteger(s.l) && s.l >= 0 && s.l <= MAX_LETTER_L ? `${s.n}${L_LETTERS[s.l]}${s.occupancy}` : `${s.n},l=${s.l}`;
		checkSubshell(s, token);
		entries.push({ s, token, fromCore: null });
	}
	return assemble(entries, coreName);
}

/**
 * The subshells of a configuration or of a plain list, checked as in `configurationOf`.
 * Throws ConfigurationError like `configurationOf`.
 * @example asSubshells([{ n: 2, l: 1, occupancy: 2 }]) // [{ n: 2, l: 1, occupancy: 2 }]
 */
export function asSubshells(input: Configuration | readonly Subshell[]): Subshell[] {
	// A configuration from the parser was checked once at the edge; it is not checked (or parsed) again.
	if ('subshells' in input && checkedLists.has(input.subshells)) return input.subshells.slice();
	if ('subshells' in input) return configurationOf(input.subshells).subshells;
	return configurationOf(input).subshells;
}

// A parent or intermediate term in parentheses: multiplicity (plain or superscript digits), the L
// letter, an optional odd mark (° or o), then optionally ", v=4" (seniority) and ", #2" (index).
const TERM_GROUP_RE = /\(([^()]*)\)/y;
const TERM_SPEC_RE = /^(\d+|[⁰¹²³⁴⁵⁶⁷⁸⁹]+)([A-Z])(?:°|o)?(?:,?v=?(\d+))?(?:,?#(\d+))?$/u;

/** Reads "5D", "⁵D", "2P°", "3F,v=2", "2D,v=3,#2" (spaces already removed) into a TermSpec. */
function readTermSpec(inner: string, token: string): TermSpec {
	const m = TERM_SPEC_RE.exec(inner);
	const allowed = 'write the term as multiplicity and letter, e.g. (5D), (²P°), (3F, v=2) or (2D, v=3, #2)';
	if (!m) throw new ConfigurationError(`cannot read the term "(${inner})" in "${token}": ${allowed}`, token);
	const multiplicity = Number(
		m[1]
			.split('')
			.map((ch) => (SUPERSCRIPT_DIGITS.includes(ch) ? SUPERSCRIPT_DIGITS.indexOf(ch) : ch))
			.join('')
	);
	const L = termLetterToL(m[2]);
	if (L === null) throw new ConfigurationError(`"${m[2]}" in "${token}" is not a term letter: use S P D F G H I K L M N …`, token);
	if (multiplicity < 1) throw new ConfigurationError(`the multiplicity in "${token}" must be at least 1 (2S+1)`, token);
	return {
		twoS: multiplicity - 1,
		L,
		seniority: m[3] === undefined ? null : Number(m[3]),
		index: m[4] === undefined ? null : Number(m[4])
	};
}

/** True when l^N has a single term (one electron, one hole, or full): its term need not be typed. */
function hasOneTerm(s: Subshell): boolean {
	return s.occupancy === 1 || s.occupancy >= subshellCapacity(s.l) - 1;
}

/** Spaces inside parentheses belong to the term ("(3F, v=2)"), not between subshells. */
function joinParentheses(text: string): string {
	return text.replace(/\([^()]*\)/g, (m) => m.replace(/\s+/g, ''));
}

const SEPARATORS = /[\s.·⋅]+/u;
const CORE_RE = /\[([^\]\s]*)\]/y;
// n, letter, then an optional occupancy: ^{N}, ^N, N (plain digits, maybe negative) or superscript digits.
const SUBSHELL_RE = /(\d+)(\p{L})(?:\^\{(-?\d+)\}|\^(-?\d+)|(-?\d+)|([⁰¹²³⁴⁵⁶⁷⁸⁹]+))?/uy;
// In a piece written with superscripts, plain digits after a letter start the next subshell (4f⁷5d6s²).
const SUBSHELL_SUPER_RE = /(\d+)(\p{L})(?:\^\{(-?\d+)\}|\^(-?\d+)|()([⁰¹²³⁴⁵⁶⁷⁸⁹]+))?/uy;
const HAS_SUPERSCRIPT = /[⁰¹²³⁴⁵⁶⁷⁸⁹]/u;

/**
 * Reads a configuration. Subshells are written n, letter, occupancy (`3d5`, `3d^5`, `3d^{5}`,
 * `3d⁵`; occupancy 1 may be left out), separated by spaces or dots; in a piece that uses
 * superscript occupancies, subshells may follow each other without separator (`3d⁵4s¹`,
 * `4f⁷5d6s²`), and a plain digit after a letter then starts the next subshell. One noble-gas core `[He]`,
 * `[Ne]`, `[Ar]`, `[Kr]`, `[Xe]` or `[Rn]` may be given; it is expanded into its subshells.
 * Letters: s p d f g h i k l m n o q r t u v (j is skipped). The result is sorted by n then l.
 *
 * Throws ConfigurationError, with `token` set to the offending piece, for: empty text; text
 * over MAX_CONFIGURATION_LENGTH characters (token: its first 20 characters and '…'); a piece
 * that is not a subshell or core; an unknown letter; n outside 1…20; l ≥ n; occupancy below 1
 * or above 2(2l+1); a subshell given twice or already in the core; two cores; an unknown core;
 * plain-digit subshells written without separator.
 * @example parseConfiguration('[Ar] 3d5 4s').electrons // 24
 */
export function parseConfiguration(text: string): Configuration {
	if (typeof text !== 'string') throw new ConfigurationError('the configuration must be given as text, e.g. "1s2 2s2 2p3"', String(text));
	if (text.length > MAX_CONFIGURATION_LENGTH) {
		throw new ConfigurationError(
			`the configuration is ${text.length} characters long; at most ${MAX_CONFIGURATION_LENGTH} are accepted`,
			`${text.slice(0, 20)}…`
		);
	}
	const chunks = joinParentheses(text)
		.split(SEPARATORS)
		.filter((c) => c.length > 0);
	if (chunks.length === 0) {
		throw new ConfigurationError('the configuration is empty: write subshells such as "1s2 2s2 2p3" or "[Ne] 3s"', '');
	}
	const entries: { s: Subshell; token: string; fromCore: string | null }[] = [];
	const parents: ParentSpec[] = [];
	let core: { name: string; token: string } | null = null;
	for (const chunk of chunks) {
		let pos = 0;
		const re = HAS_SUPERSCRIPT.test(chunk) ? SUBSHELL_SUPER_RE : SUBSHELL_RE;
		while (pos < chunk.length) {
			CORE_RE.lastIndex = pos;
			const c = CORE_RE.exec(chunk);
			if (c) {
				const token = c[0];
				const found = coreOf(c[1], token);
				if (core) {
					throw new ConfigurationError(`only one noble-gas core may be given: ${core.token} and ${token}`, token);
				}
				core = { name: found.name, token };
				for (const s of found.subshells) entries.push({ s, token, fromCore: found.name });
				pos = CORE_RE.lastIndex;
				continue;
			}
			re.lastIndex = pos;
			const m = re.exec(chunk);
			if (!m) {
				const rest = chunk.slice(pos);
				throw new ConfigurationError(
					`cannot read "${rest}": write subshells as n, letter, occupancy (e.g. 3d5, 4s, 2p^6) or a core such as [Ar]`,
					rest
				);
			}
			const token = m[0];
			const end = re.lastIndex;
			const plainOccupancy = m[6] === undefined;
			if (re === SUBSHELL_RE && plainOccupancy && end < chunk.length && chunk[end] !== '[' && chunk[end] !== '(') {
				throw new ConfigurationError(
					`"${chunk}" cannot be split into subshells: put a space or a dot between subshells written with plain digits (e.g. 3d5 4s or 3d5.4s)`,
					chunk
				);
			}
			const letter = m[2];
			const l = letterToL(letter);
			if (l === null) {
				const hint =
					letterToL(letter.toLowerCase()) !== null
						? ' (subshell letters are lowercase)'
						: letter.toLowerCase() === 'j'
							? ' (j is skipped)'
							: '';
				throw new ConfigurationError(
					`"${letter}" in "${token}" is not a subshell letter${hint}: use ${L_LETTERS.split('').join(' ')}`,
					token
				);
			}
			const raw = m[3] ?? m[4] ?? (m[5] === '' ? undefined : m[5]);
			const occupancy =
				m[6] !== undefined
					? Number(
							m[6]
								.split('')
								.map((ch) => SUPERSCRIPT_DIGITS.indexOf(ch))
								.join('')
						)
					: raw === undefined
						? 1
						: Number(raw);
			const s: Subshell = { n: Number(m[1]), l, occupancy };
			checkSubshell(s, token);
			entries.push({ s, token, fromCore: null });
			pos = end;
			const groups: string[] = [];
			for (;;) {
				TERM_GROUP_RE.lastIndex = pos;
				const g = TERM_GROUP_RE.exec(chunk);
				if (!g) break;
				groups.push(g[1]);
				pos = TERM_GROUP_RE.lastIndex;
			}
			if (groups.length > 0) parents.push(parentSpecOf(s, groups, `${token}${groups.map((g) => `(${g})`).join('')}`));
		}
	}
	const cfg = assemble(entries, core ? core.name : null);
	return parents.length > 0 ? { ...cfg, parents: checkParents(cfg, parents) } : cfg;
}

/**
 * One or two terms typed after a subshell. With one term: the subshell's own term, unless the
 * subshell has only one term (4s, 2p5), then the intermediate after it. With two: own, then intermediate.
 */
function parentSpecOf(s: Subshell, groups: string[], token: string): ParentSpec {
	if (s.occupancy === subshellCapacity(s.l)) {
		throw new ConfigurationError(`"${token}": ${subshellLabel(s)} is full, so it has no parent term to choose (only ¹S)`, token);
	}
	if (groups.length > 2) {
		throw new ConfigurationError(
			`"${token}" has ${groups.length} terms in parentheses: give at most two, the subshell's own term and then the intermediate term`,
			token
		);
	}
	const specs = groups.map((g) => readTermSpec(g, token));
	if (specs.length === 2) return { n: s.n, l: s.l, own: specs[0], intermediate: specs[1] };
	return hasOneTerm(s) ? { n: s.n, l: s.l, own: null, intermediate: specs[0] } : { n: s.n, l: s.l, own: specs[0], intermediate: null };
}

/** Typed parents must follow open subshells; an intermediate after the last open subshell is the term itself and is refused. */
function checkParents(cfg: Configuration, parents: ParentSpec[]): ParentSpec[] {
	const open = openSubshells(cfg);
	const last = open[open.length - 1];
	for (const p of parents) {
		const label = `${p.n}${lLetter(p.l)}`;
		if (p.intermediate && last && p.n === last.n && p.l === last.l) {
			throw new ConfigurationError(
				`${label} is the last open subshell, so a term after it would be the final term: pick the final term in the Term sheet instead`,
				label
			);
		}
		if (p.intermediate && open.length > 0 && p.n === open[0].n && p.l === open[0].l && p.own) {
			throw new ConfigurationError(`${label} is the first open subshell: its intermediate term is its own term, give one term only`, label);
		}
	}
	return parents.sort(bySubshellOrder);
}

/** Options of `formatConfiguration`. */
export interface FormatOptions {
	/** Write occupancies as unicode superscripts (3d⁵). Default false. */
	superscripts?: boolean;
	/** Write the largest noble-gas core that the subshells contain fully as [Ar] etc. Default false. */
	compactCore?: boolean;
}

/**
 * The largest noble-gas core whose subshells all appear closed in the list, or null.
 * @example largestCore(parseConfiguration('1s2 2s2 2p6 3s')) // 'Ne'
 */
export function largestCore(subshells: readonly Subshell[]): string | null {
	let best: string | null = null;
	for (const name of CORE_NAMES) {
		const ok = NOBLE_GAS_CORES[name].every((c) => subshells.some((s) => s.n === c.n && s.l === c.l && s.occupancy === c.occupancy));
		if (ok) best = name;
		else break;
	}
	return best;
}

/**
 * Normalized text of a configuration: subshells by n then l, separated by spaces, occupancy 1
 * written without number ("1s2 2s2 2p6 3s"). With `superscripts` the occupancies are unicode
 * superscripts ("3d⁵ 4s"); with `compactCore` the largest noble-gas core contained fully is
 * written as "[Ar]". Throws RangeError only when a subshell's l has no letter.
 * @example formatConfiguration(parseConfiguration('1s2 2s2 2p6 3s2 3p6 3d5 4s1'), { compactCore: true }) // '[Ar] 3d5 4s'
 */
export function formatConfiguration(cfg: Configuration | readonly Subshell[], options: FormatOptions = {}): string {
	const subshells = ('subshells' in cfg ? cfg.subshells : cfg).slice().sort(bySubshellOrder);
	const parts: string[] = [];
	let rest = subshells;
	if (options.compactCore) {
		const core = largestCore(subshells);
		if (core) {
			const inCore = NOBLE_GAS_CORES[core];
			rest = subshells.filter((s) => !inCore.some((c) => c.n === s.n && c.l === s.l));
			parts.push(`[${core}]`);
		}
	}
	for (const s of rest) parts.push(subshellLabel(s, options.superscripts ?? false));
	return parts.join(' ');
}

/**
 * The configuration as shown to people: superscript occupancies, and a noble-gas core written as
 * [Xe] when the user typed one (else every subshell spelled out, as typed).
 * @example displayConfiguration(parseConfiguration('[Xe] 4f2 5d')) // '[Xe] 4f² 5d'
 */
export function displayConfiguration(cfg: Pick<Configuration, 'subshells' | 'core'>): string {
	return formatConfiguration(cfg.subshells, { superscripts: true, compactCore: cfg.core !== null });
}
