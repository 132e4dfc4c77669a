/**
 * Limiters kept in memory, for one server process (a restart forgets them): a fixed-window
 * counter (`createLimiter`, e.g. "at most 3 reset mails per hour to one address") and an
 * exponential backoff per key (`createBackoffLimiter`, e.g. failed sign-ins of one
 * (account, address) pair).
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

export interface BackoffOptions {
	/** Failures allowed before the first wait. */
	freeFailures: number;
	/** The first wait; each further failure doubles it. */
	baseMs: number;
	/** The longest wait. */
	maxMs: number;
	/** A key with no failure for this long starts again from zero. */
	forgetMs: number;
}

export interface BackoffLimiter {
	/** Milliseconds until the key may try again (0: it may try now). */
	waitMs(key: string): number;
	/** Records a failure; returns the wait it causes (0 while failures are still free). */
	fail(key: string): number;
	/** Forgets the key (after a success). */
	succeed(key: string): void;
}

/**
 * Exponential backoff per key, kept in memory (one server process): after `freeFailures`
 * failures, each further failure makes the key wait `baseMs · 2^(n − freeFailures − 1)`, at most
 * `maxMs`. Example with {freeFailures: 4, baseMs: 30 s, maxMs: 15 min}: failures 1–4 are free,
 * the 5th waits 30 s, the 6th 1 min, the 7th 2 min, … the 10th and later 15 min.
 */
export function createBackoffLimiter(options: BackoffOptions, clock: () => number = Date.now): BackoffLimiter {
	const state = new Map<string, { failures: number; last: number; until: number }>();
	const live = (key: string) => {
		const s = state.get(key);
		if (s && clock() - s.last >= options.forgetMs) {
			state.delete(key);
			return undefined;
		}
		return s;
	};
	const prune = () => {
		if (state.size <= 10000) return;
		for (const [k, s] of state) if (clock() - s.last >= options.forgetMs || s.until <= clock()) state.delete(k);
	};
	return {
		waitMs(key) {
			const s = live(key);
			return s ? Math.max(0, s.until - clock()) : 0;
		},
		fail(key) {
			const s = live(key) ?? { failures: 0, last: 0, until: 0 };
			s.failures++;
			s.last = clock();
			const over = s.failures - options.freeFailures;
			const wait = over > 0 ? Math.min(options.maxMs, options.baseMs * 2 ** Math.min(over - 1, 30)) : 0;
			s.until = s.last + wait;
			state.set(key, s);
			prune();
			return wait;
		},
		succeed(key) {
			state.delete(key);
		}
	};
}

/** "3 minutes", "1 minute", "20 seconds": a wait in words for messages. */
export function waitInWords(ms: number): string {
	const seconds = Math.max(1, Math.ceil(ms / 1000));
	if (seconds < 60) return `${seconds} second${seconds === 1 ? '' : 's'}`;
	const minutes = Math.ceil(seconds / 60);
	return `${minutes} minute${minutes === 1 ? '' : 's'}`;
}
