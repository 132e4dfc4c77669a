/**
 * Showing part of a Coupling bridge: only the levels of chosen J values. Links join levels of equal
 * J only (the non-crossing rule works J by J), so keeping whole J values keeps every link whole; the
 * order within each column is the API's schematic order, filtered. Only data, no physics.
 */
import type { BridgeResponse } from '$lib/api/types';
import { countByJ } from '$lib/components/jValues';

/** The J values of a bridge in increasing order, with how many levels each has (one side; both sides agree). */
export function bridgeJValues(data: Pick<BridgeResponse, 'ls'>): { J: string; count: number }[] {
	return countByJ(data.ls);
}

/** Keeps the items whose J is chosen; `index` maps an old position to the new one. */
function keep<T extends { J: string }>(list: readonly T[], chosen: ReadonlySet<string>) {
	const index = new Map<number, number>();
	const kept: T[] = [];
	list.forEach((x, i) => {
		if (!chosen.has(x.J)) return;
		index.set(i, kept.length);
		kept.push(x);
	});
	return { kept, index };
}

/**
 * The bridge with only the levels whose J is in `js`; null or an empty list keeps everything.
 * @example bridgeForJ(data, ['2']).ls.every((l) => l.J === '2') // true
 */
export function bridgeForJ(data: BridgeResponse, js: readonly string[] | null): BridgeResponse {
	if (!js || js.length === 0) return data;
	const chosen = new Set(js);
	const ls = keep(data.ls, chosen);
	const jj = keep(data.jj, chosen);
	const jk = data.jk ? keep(data.jk, chosen) : null;
	return {
		...data,
		ls: ls.kept,
		jj: jj.kept,
		jk: jk ? jk.kept : null,
		links: data.links.filter((l) => chosen.has(l.J)).map((l) => ({ ...l, ls: ls.index.get(l.ls)!, jj: jj.index.get(l.jj)! })),
		jkLinks: data.jkLinks
			.filter((l) => chosen.has(l.J))
			.map((l) => ({ ...l, ls: ls.index.get(l.ls)!, jk: jk!.index.get(l.jk)!, jj: jj.index.get(l.jj)! }))
	};
}
