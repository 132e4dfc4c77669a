/**
 * The J values of a list of levels with how many levels each has, smallest J first ("1/2" before
 * "3/2" before "11/2"). Shared by the Coupling bridge's and the Energy solver's J filters.
 */
import { parseHalf } from '$lib/physics/half';

export function countByJ(levels: readonly { J: string }[]): { J: string; count: number }[] {
	const counts = new Map<string, number>();
	for (const l of levels) counts.set(l.J, (counts.get(l.J) ?? 0) + 1);
	return [...counts].map(([J, count]) => ({ J, count })).sort((a, b) => parseHalf(a.J) - parseHalf(b.J));
}
