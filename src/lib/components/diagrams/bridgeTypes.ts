import type { BridgeResponse } from '$lib/api/types';

/** The Coupling bridge draws at most this many levels per side; beyond it, a message and the table. */
export const MAX_BRIDGE_LEVELS = 200;

/** Number of levels of each J on one side, counted from the API's lists (no physics). */
export function countsByJ(list: { J: string }[]): Map<string, number> {
	const m = new Map<string, number>();
	for (const x of list) m.set(x.J, (m.get(x.J) ?? 0) + 1);
	return m;
}

/** True when both sides list the same number of levels for every J. */
export function countsAgree(data: BridgeResponse): boolean {
	const a = countsByJ(data.ls);
	const b = countsByJ(data.jj);
	if (data.ls.length !== data.jj.length || a.size !== b.size) return false;
	for (const [J, n] of a) if (b.get(J) !== n) return false;
	return true;
}
