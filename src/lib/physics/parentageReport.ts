/**
 * The parentage of a configuration as JSON-ready data for the Term sheet (`/api/v1/terms`):
 * one list of occurrences per term, with S as a fraction string. Only gathers ./parentage.ts.
 */
import type { Configuration } from './types';
import { halfString } from './half';
import { subshellLabel } from './parse';
import { MAX_PARENTAGE_OCCURRENCES, onTypedParents, parentageOf } from './parentage';

/** One occurrence of a term with its coupling path. */
export interface ParentageItem {
	/** The term of each open subshell in configuration order. */
	parents: { subshell: string; S: string; L: number; seniority: number; index?: number }[];
	/** intermediates[k]: (S, L) after coupling the first k + 1 open subshells; the last is the term. */
	intermediates: { S: string; L: number }[];
	/** "3d⁶(⁵D)4s ⁶D". */
	label: string;
	/** The label before the final term, "3d⁶(⁵D)4s"; one open subshell: the subshell and which repeat, "3d³ (v=1)". */
	parent: string;
	/** Present when parents were typed with the configuration: whether this occurrence is built on them. */
	onTypedParents?: boolean;
}

/** Whether the sheet lists parentage, and why not. */
export interface ParentageStatus {
	listed: boolean;
	/** Term occurrences of the configuration. */
	occurrences: number;
	limit: number;
	/** Why parentage is left out, when it is. */
	omitted?: string;
}

/**
 * Parentage items keyed by "twoS|L", in the engine's occurrence order (occurrence k of a term in the
 * Shelf's level keys is item k), and the status. Over the limit: no items and `omitted` says why.
 * Throws ConfigurationError from `onTypedParents` when typed parents do not exist.
 */
export function parentageItems(cfg: Configuration, occurrences: number): { byTerm: Map<string, ParentageItem[]>; status: ParentageStatus } {
	const byTerm = new Map<string, ParentageItem[]>();
	const limit = MAX_PARENTAGE_OCCURRENCES;
	if (occurrences > limit) {
		return {
			byTerm,
			status: {
				listed: false,
				occurrences,
				limit,
				omitted: `parentage is listed for at most ${limit} term occurrences; this configuration has ${occurrences}`
			}
		};
	}
	const paths = parentageOf(cfg, limit);
	const typed = cfg.parents && cfg.parents.length > 0 ? onTypedParents(cfg, paths) : null;
	paths.forEach((p, i) => {
		const key = `${p.twoS}|${p.L}`;
		const item: ParentageItem = {
			parents: p.parents.map((t) => ({
				subshell: subshellLabel(t.subshell),
				S: halfString(t.twoS),
				L: t.L,
				seniority: t.seniority,
				...(t.index !== null ? { index: t.index } : {})
			})),
			intermediates: p.intermediates.map((m) => ({ S: halfString(m.twoS), L: m.L })),
			label: p.label,
			parent: p.tell ? `${p.prefix} (${p.tell})` : p.prefix,
			...(typed ? { onTypedParents: typed[i] } : {})
		};
		byTerm.set(key, [...(byTerm.get(key) ?? []), item]);
	});
	return { byTerm, status: { listed: true, occurrences, limit } };
}
