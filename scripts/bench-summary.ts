/**
 * The one summary table of `npm run bench`. Each benchmark module may export
 * `run(): Promise<SummaryRow[]>` (it prints its own detail and returns its headline figures);
 * scripts/bench.ts collects the rows of every module and prints them here, with the ratio of
 * the naive method's median to ours where a naive method exists. Not a test: figures depend on
 * the machine and on what else runs on it.
 */

/** One headline figure of a benchmark. */
export interface SummaryRow {
	/** The benchmark, e.g. "term counting". */
	bench: string;
	/** What was timed, e.g. a configuration. */
	case: string;
	/** Median time of our method, in ms. */
	medianMs: number;
	/** The naive method it is compared with, and its median in ms (null when it was not run). */
	naive?: { method: string; medianMs: number | null };
	/** The target, in words ("< 20 ms"), and whether it was met. */
	target?: { text: string; met: boolean };
}

/** Median of a list of numbers. */
export function median(values: readonly number[]): number {
	const s = values.slice().sort((a, b) => a - b);
	const m = s.length >> 1;
	return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Median time in ms of `run` over `runs` runs after one warm-up run. */
export function medianMs(run: () => unknown, runs = 5): number {
	run();
	const times: number[] = [];
	for (let i = 0; i < runs; i++) {
		const t0 = performance.now();
		run();
		times.push(performance.now() - t0);
	}
	return median(times);
}

const ms = (v: number) => (v < 1 ? v.toFixed(3) : v < 100 ? v.toFixed(2) : v.toFixed(0));

/** Prints the rows as one aligned table. */
export function printSummary(rows: readonly SummaryRow[]): void {
	const table = [
		['benchmark', 'case', 'median ms', 'naive method', 'naive ms', 'ratio', 'target'],
		...rows.map((r) => [
			r.bench,
			r.case,
			ms(r.medianMs),
			r.naive?.method ?? '—',
			r.naive ? (r.naive.medianMs === null ? 'not run' : ms(r.naive.medianMs)) : '—',
			r.naive?.medianMs ? `${Math.round(r.naive.medianMs / r.medianMs).toLocaleString('en-US')}×` : '—',
			r.target ? `${r.target.text} ${r.target.met ? 'met' : 'NOT met'}` : ''
		])
	];
	const widths = table[0].map((_, c) => Math.max(...table.map((row) => row[c].length)));
	for (const [i, row] of table.entries()) {
		console.log(row.map((cell, c) => (c >= 2 && c !== 3 && c !== 6 ? cell.padStart(widths[c]) : cell.padEnd(widths[c]))).join('  '));
		if (i === 0) console.log(widths.map((w) => '-'.repeat(w)).join('  '));
	}
}
