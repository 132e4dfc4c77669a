/**
 * Parentage (coupling sequence) of every LS term occurrence of a configuration.
 *
 * Vector model of Condon & Shortley (1935, ch. VII and XII) and Cowan (1981, sec. 4.9–4.10):
 * the open subshells are coupled one after another in configuration order (n, then l). Each open
 * subshell l^N contributes one of its own terms (S_i, L_i), told apart by Racah's seniority v
 * (Racah 1943; ./seniority.ts) and, where (S, L, v) still repeats (f³ ²D twice with v = 3), by an
 * index. Spins and orbital momenta add separately:
 *   (S₁₂, L₁₂) with |S₁ − S₂| ≤ S₁₂ ≤ S₁ + S₂ and |L₁ − L₂| ≤ L₁₂ ≤ L₁ + L₂, then the next subshell.
 * Every such path ends in one LS term, and the number of paths that end in (S, L) is that term's
 * multiplicity in the configuration: the LS basis built this way spans the same states as the
 * determinants (Condon & Shortley 1935, ch. VII). `parentageOf` checks that equality against
 * the count grid (./terms.ts) and throws if it fails.
 *
 * Labels follow the usual notation of reference tables (e.g. Moore's tables; Martin, Zalubas &
 * Hagan 1978): 3d⁶(⁵D)4s ⁶D, 3d⁵(⁶S)4s(⁷S)4p ⁸P°, 4f²(³H)5d ⁴K, with ° on odd terms.
 */
import type { Configuration, ParentSpec, Subshell, TermSpec } from './types';
import { termDisplay } from './display';
import { asSubshells, ConfigurationError, openSubshells, subshellLabel } from './parse';
import { seniorityTable } from './seniority';
import { termsOf } from './terms';

/** Largest number of term occurrences for which `parentageOf` lists paths (Fe II 3d⁶4s has 24; 4f⁷5d6s² has 1 118). */
export const MAX_PARENTAGE_OCCURRENCES = 5000;

/** One term of one open subshell on a coupling path. */
export interface ParentTerm {
	subshell: Subshell;
	twoS: number;
	L: number;
	/** Racah seniority of this term of l^N. */
	seniority: number;
	/** 1, 2, … when (S, L, v) occurs more than once in l^N (f³ ²D with v = 3 twice); else null. */
	index: number | null;
	/** True when (S, L) occurs more than once in l^N, so the label needs v (and the index). */
	repeated: boolean;
	/** True when l^N has only this one term (s, p⁵, d⁹ …): labels leave it out. */
	only: boolean;
}

/** The (S, L) after coupling the first k open subshells. */
export interface Intermediate {
	twoS: number;
	L: number;
}

/** One term occurrence with its coupling path. */
export interface ParentagePath {
	twoS: number;
	L: number;
	/** The term of each open subshell, in configuration order. */
	parents: ParentTerm[];
	/** intermediates[k] is the (S, L) after coupling the first k + 1 open subshells; the last is the term. */
	intermediates: Intermediate[];
	/** The person-facing label, "3d⁶(⁵D)4s ⁶D". */
	label: string;
	/** The label before the final term, "3d⁶(⁵D)4s" (jK labels put the core level after it). */
	prefix: string;
	/** Which of repeated terms of a single open subshell, "v=2"; else ''. */
	tell: string;
}

/** The terms of l^N, one entry per occurrence, in Hund order (S, then L descending; v ascending). */
function subshellTerms(s: Subshell): ParentTerm[] {
	const out: ParentTerm[] = [];
	const table = seniorityTable(s.l, s.occupancy);
	const occurrences = (entry: (typeof table)[number]) => entry.seniorities.reduce((a, x) => a + x.count, 0);
	const only = table.length === 1 && occurrences(table[0]) === 1;
	for (const entry of table) {
		const repeated = occurrences(entry) > 1;
		// Seniorities come as counts; an index tells apart occurrences that share one seniority.
		for (const { seniority: v, count } of entry.seniorities) {
			for (let k = 1; k <= count; k++)
				out.push({ subshell: s, twoS: entry.twoS, L: entry.L, seniority: v, index: count > 1 ? k : null, repeated, only });
		}
	}
	return out.sort((a, b) => b.twoS - a.twoS || b.L - a.L || a.seniority - b.seniority || (a.index ?? 0) - (b.index ?? 0));
}

const oddOf = (subshells: readonly Subshell[]) => subshells.reduce((a, s) => a + s.l * s.occupancy, 0) % 2 === 1;

/** "⁵D", "³F, v=2", "²D, v=3, #2": a parent term with what tells it apart in its subshell. */
export function parentTermText(p: ParentTerm): string {
	const odd = (p.subshell.l * p.subshell.occupancy) % 2 === 1;
	let text = termDisplay(p.twoS, p.L, odd);
	if (p.repeated) text += `, v=${p.seniority}`;
	if (p.index !== null) text += `, #${p.index}`;
	return text;
}

/**
 * The parts of a path's label before the final term: the first open subshell with its term in
 * parentheses, each further subshell with its own term when it has more than one, the intermediate
 * term after every subshell but the last ("3d⁵(⁶S)4s(⁷S)4p"). With one open subshell the prefix is the
 * subshell alone and `tell` says which of repeated terms it is ("v=2").
 */
function pathParts(
	open: readonly Subshell[],
	parents: readonly ParentTerm[],
	intermediates: readonly Intermediate[]
): { prefix: string; tell: string } {
	if (open.length === 1) {
		const p = parents[0];
		return { prefix: subshellLabel(open[0], true), tell: p.repeated ? `v=${p.seniority}${p.index !== null ? `, #${p.index}` : ''}` : '' };
	}
	let text = '';
	open.forEach((s, k) => {
		text += subshellLabel(s, true);
		const p = parents[k];
		if (!p.only) text += `(${parentTermText(p)})`;
		if (k > 0 && k < open.length - 1) {
			const im = intermediates[k];
			text += `(${termDisplay(im.twoS, im.L, oddOf(open.slice(0, k + 1)))})`;
		}
	});
	return { prefix: text, tell: '' };
}

/** "3d⁵(⁶S)4s(⁷S)4p ⁸P°"; one open subshell: "3d⁴ ³F (v=2)". */
function pathLabel(prefix: string, tell: string, final: string): string {
	return `${prefix} ${final}${tell ? ` (${tell})` : ''}`;
}

/** Paths coupled so far: parents and intermediates of the first k subshells. */
interface Partial {
	parents: ParentTerm[];
	intermediates: Intermediate[];
}

/**
 * Every LS term occurrence of a configuration with its coupling path, grouped by term in the order of
 * `termsOf` (2S+1, then L ascending), the occurrences of one term in Hund order of their parents.
 * Closed subshells only: one path with no parents, the ¹S term.
 * Source: vector model, sequential coupling (Condon & Shortley 1935, ch. VII; Cowan 1981, sec. 4.9).
 * Throws RangeError when the configuration has more than `limit` (default MAX_PARENTAGE_OCCURRENCES)
 * term occurrences, what termsOf throws, and Error when the path counts disagree with the grid (a bug).
 * @example parentageOf(parseConfiguration('3d6 4s')).filter((p) => p.label.startsWith('3d⁶(⁵D)')).map((p) => p.label) // ['3d⁶(⁵D)4s ⁴D', '3d⁶(⁵D)4s ⁶D']
 */
export function parentageOf(input: Configuration | readonly Subshell[], limit = MAX_PARENTAGE_OCCURRENCES): ParentagePath[] {
	const subshells = asSubshells(input);
	const terms = termsOf(subshells);
	const occurrences = terms.reduce((a, t) => a + t.count, 0);
	if (occurrences > limit) {
		throw new RangeError(`this configuration has ${occurrences} term occurrences; parentage is listed for at most ${limit}`);
	}
	const open = openSubshells(subshells);
	if (open.length === 0) return [{ twoS: 0, L: 0, parents: [], intermediates: [], label: termDisplay(0, 0, false), prefix: '', tell: '' }];

	let paths: Partial[] = subshellTerms(open[0]).map((p) => ({ parents: [p], intermediates: [{ twoS: p.twoS, L: p.L }] }));
	for (let k = 1; k < open.length; k++) {
		const own = subshellTerms(open[k]);
		const next: Partial[] = [];
		for (const path of paths) {
			const prev = path.intermediates[k - 1];
			for (const p of own) {
				for (let twoS = Math.abs(prev.twoS - p.twoS); twoS <= prev.twoS + p.twoS; twoS += 2) {
					for (let L = Math.abs(prev.L - p.L); L <= prev.L + p.L; L++) {
						next.push({ parents: [...path.parents, p], intermediates: [...path.intermediates, { twoS, L }] });
					}
				}
			}
		}
		paths = next;
	}

	const byTerm = new Map<string, ParentagePath[]>();
	for (const path of paths) {
		const last = path.intermediates[path.intermediates.length - 1];
		const key = `${last.twoS}|${last.L}`;
		const list = byTerm.get(key) ?? [];
		const { prefix, tell } = pathParts(open, path.parents, path.intermediates);
		const label = pathLabel(prefix, tell, termDisplay(last.twoS, last.L, oddOf(open)));
		list.push({ twoS: last.twoS, L: last.L, ...path, label, prefix, tell });
		byTerm.set(key, list);
	}
	const out: ParentagePath[] = [];
	for (const t of terms) {
		const list = byTerm.get(`${t.twoS}|${t.L}`) ?? [];
		if (list.length !== t.count) {
			throw new Error(
				`internal error: ${list.length} coupling paths end in 2S=${t.twoS} L=${t.L}, but the count grid gives ${t.count} terms`
			);
		}
		out.push(...list);
		byTerm.delete(`${t.twoS}|${t.L}`);
	}
	if (byTerm.size > 0)
		throw new Error(`internal error: coupling paths end in terms the count grid does not have (${[...byTerm.keys()].join(', ')})`);
	return out;
}

function specMatches(spec: TermSpec, t: { twoS: number; L: number; seniority?: number; index?: number | null }): boolean {
	if (spec.twoS !== t.twoS || spec.L !== t.L) return false;
	if (spec.seniority !== null && spec.seniority !== t.seniority) return false;
	if (spec.index !== null && spec.index !== (t.index ?? 1)) return false;
	return true;
}

const specText = (spec: TermSpec, odd: boolean) =>
	`${termDisplay(spec.twoS, spec.L, odd)}${spec.seniority !== null ? `, v=${spec.seniority}` : ''}${spec.index !== null ? `, #${spec.index}` : ''}`;

/**
 * Which paths are built on the parents typed with the configuration (`3d6(5D) 4s`, see parse.ts):
 * one boolean per path of `paths`. No typed parents: all true.
 * Throws ConfigurationError, naming the typed term, when a subshell has no such term (listing the
 * terms it has), when a seniority or index is given for an intermediate, or when no path fits all
 * typed terms together.
 * @example onTypedParents(cfg, parentageOf(cfg)) // for '3d6(5D) 4s': true only for ⁶D and ⁴D on ⁵D
 */
export function onTypedParents(cfg: Configuration, paths: readonly ParentagePath[]): boolean[] {
	const parents: ParentSpec[] = cfg.parents ?? [];
	if (parents.length === 0) return paths.map(() => true);
	const open = openSubshells(cfg);
	const checks = parents.map((p) => {
		const k = open.findIndex((s) => s.n === p.n && s.l === p.l);
		const s = open[k];
		const label = subshellLabel(s, true);
		if (p.own) {
			const own = subshellTerms(s);
			if (!own.some((t) => specMatches(p.own!, t))) {
				const odd = (s.l * s.occupancy) % 2 === 1;
				const list = [...new Set(own.map((t) => parentTermText(t)))].join('; ');
				throw new ConfigurationError(`${label} has no term ${specText(p.own, odd)}: its terms are ${list}`, `(${specText(p.own, odd)})`);
			}
		}
		if (p.intermediate && (p.intermediate.seniority !== null || p.intermediate.index !== null)) {
			throw new ConfigurationError(
				`a seniority or index belongs to a subshell's own term, not to the intermediate term after ${label}`,
				`(${specText(p.intermediate, false)})`
			);
		}
		return { k, p };
	});
	const out = paths.map((path) =>
		checks.every(
			({ k, p }) =>
				(!p.own || specMatches(p.own, path.parents[k])) && (!p.intermediate || specMatches(p.intermediate, path.intermediates[k]))
		)
	);
	if (!out.some(Boolean)) {
		throw new ConfigurationError(
			'no term of this configuration is built on the parent terms as typed: check the intermediate terms (S and L add as vectors)',
			''
		);
	}
	return out;
}
