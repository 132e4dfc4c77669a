/**
 * A small fixed-window limiter kept in memory: enough to slow down password guessing
 * on one server process. Keys are e.g. "signin:<email>" and "signin-ip:<address>".
 */
export interface Limiter {
	/** Returns the seconds to wait when the key is over its limit, else 0. */
	check(key: string): number;
	hit(key: string): void;
	reset(key: string): void;
}

export function createLimiter(maxHits: number, windowMs: number, clock: () => number = Date.now): Limiter {
	const windows = new Map<string, { start: number; hits: number }>();
	const current = (key: string) => {
		const w = windows.get(key);
		if (!w || clock() - w.start >= windowMs) return null;
		return w;
	};
	return {
		check(key) {
			const w = current(key);
			if (!w || w.hits < maxHits) return 0;
			return Math.ceil((w.start + windowMs - clock()) / 1000);
		},
		hit(key) {
			const w = current(key);
			if (w) w.hits++;
			else windows.set(key, { start: clock(), hits: 1 });
			if (windows.size > 10000) {
				for (const [k, v] of windows) if (clock() - v.start >= windowMs) windows.delete(k);
			}
		},
		reset(key) {
			windows.delete(key);
		}
	};
}
