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

/** A bridge with more levels than this per side offers a filter by J and starts on one J. */
export const BRIDGE_FILTER_FROM = 24;

/**
 * The bridge restricted to the levels of one J (links renumbered to the kept levels), so a bridge
 * of dozens of levels can be read one J at a time. `J = null` returns the data unchanged.
 */
export function bridgeForJ(data: BridgeResponse, J: string | null): BridgeResponse {
	if (J === null) return data;
	const keep = (list: { J: string }[]) => {
		const map = new Map<number, number>();
		list.forEach((x, i) => {
			if (x.J === J) map.set(i, map.size);
		});
		return map;
	};
	const ls = keep(data.ls);
	const jj = keep(data.jj);
	return {
		...data,
		ls: data.ls.filter((x) => x.J === J),
		jj: data.jj.filter((x) => x.J === J),
		links: data.links.filter((l) => l.J === J).map((l) => ({ ...l, ls: ls.get(l.ls)!, jj: jj.get(l.jj)! }))
	};
}
