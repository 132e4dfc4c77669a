/**
 * Names for single levels of a configuration that do not depend on table order:
 * "<term>#<occurrence>|<J>", e.g. "2D#2|5/2" for the second ²D term's J = 5/2 level.
 * Shared by the server (annotations) and the pages.
 */
import { BudgetError, MAX_ENTRY_LEVELS } from './physics/budget';

export interface LevelRef {
	term: string;
	occurrence: number;
	J: string;
}

export function levelKey(ref: LevelRef): string {
	return `${ref.term}#${ref.occurrence}|${ref.J}`;
}

export function parseLevelKey(key: string): LevelRef | null {
	const m = /^(\d+[A-Z](?:\[L=\d+\])?)#(\d+)\|(\d+(?:\/2)?)$/.exec(key);
	return m ? { term: m[1], occurrence: Number(m[2]), J: m[3] } : null;
}

/**
 * Every level of a Term sheet, one per occurrence of a repeated term, in sheet order. Counts are
 * the sheet's exact decimal strings. Throws BudgetError (a RangeError) before listing anything
 * when there are more than `limit` levels (default MAX_ENTRY_LEVELS).
 */
export function levelRefs(
	terms: readonly { label: string; count: string; levels: readonly { J: string }[] }[],
	limit = MAX_ENTRY_LEVELS
): LevelRef[] {
	const total = terms.reduce((a, t) => a + BigInt(t.count) * BigInt(t.levels.length), 0n);
	if (total > BigInt(limit)) {
		throw new BudgetError(
			`this configuration has ${total} single levels, over the limit of ${limit} that can be listed one by one for notes; use a smaller configuration`,
			Number(total),
			limit
		);
	}
	return terms.flatMap((t) =>
		Array.from({ length: Number(t.count) }, (_, k) => t.levels.map((lv) => ({ term: t.label, occurrence: k + 1, J: lv.J }))).flat()
	);
}

/** A level key as people read it: "6D J=9/2", "2D (2) J=5/2" for the second ²D. */
export function levelText(key: string): string {
	const ref = parseLevelKey(key);
	if (!ref) return key;
	return `${ref.term}${ref.occurrence > 1 ? ` (${ref.occurrence})` : ''} J=${ref.J}`;
}
