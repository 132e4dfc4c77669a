/**
 * Benchmark of LS-term counting (generating functions, `termsOf`) against the classic
 * enumerate-and-peel method (`termsByEnumeration`), from 10¹ to 10¹⁸ microstates.
 * Run with `npx tsx scripts/bench-terms.ts`; `main()` can also be called from a combined script.
 * Not a test: the numbers depend on the machine. Timings are medians after warm-up runs.
 *
 * Targets: every configuration with at most 6 open subshells and l ≤ 6 counts in under
 * TARGET_COUNT_MS (cold per-subshell cache); at about 10⁶ microstates counting is at least
 * TARGET_SPEEDUP times faster than enumeration.
 */
import { pathToFileURL } from 'node:url';
import { termsOf } from '../src/lib/physics/terms';
import { ENUMERATION_LIMIT, termsByEnumeration } from '../src/lib/physics/enumerate';
import { clearMicrostateCache, microstateTotal } from '../src/lib/physics/microstates';
import { openSubshells, parseConfiguration } from '../src/lib/physics/parse';
import type { Configuration } from '../src/lib/physics/types';
import type { SummaryRow } from './bench-summary';

/** Counting must take less than this (ms, median, cold cache) for ≤ 6 open subshells with l ≤ 6. */
export const TARGET_COUNT_MS = 20;
/** Counting must be at least this many times faster than enumeration near 10⁶ microstates. */
export const TARGET_SPEEDUP = 1000;
/** Configurations between these microstate counts are "about 10⁶" for the speed-up target. */
const SPEEDUP_BAND: [bigint, bigint] = [500_000n, 2_000_000n];

const CONFIGURATIONS = [
	'2p3',
	'3d5',
	'3d5 4s',
	'4f7',
	'4f7 5d 6s 6p',
	'4f7 5d2 6p',
	'4f7 5d3 6p3',
	'4f7 5d3 6p3 5g2',
	'4f3 5g2 6h 7i 6d2 7p',
	'4f7 5g5 6h5',
	'4f7 5g4 6h3 7i2 6d3 7p',
	// Above 2^53 microstates: the exact BigInt path.
	'4f7 5g5 6h5 7i3 6d3 7p'
];

function median(values: number[]): number {
	const s = values.slice().sort((a, b) => a - b);
	const m = s.length >> 1;
	return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Median time in ms of `run` over `runs` runs after `warmup` runs; `before` runs untimed before each. */
function timeMedian(run: () => unknown, runs: number, warmup: number, before: () => void = () => {}): number {
	for (let i = 0; i < warmup; i++) {
		before();
		run();
	}
	const times: number[] = [];
	for (let i = 0; i < runs; i++) {
		before();
		const t0 = performance.now();
		run();
		times.push(performance.now() - t0);
	}
	return median(times);
}

export interface BenchRow {
	configuration: string;
	microstates: bigint;
	openSubshells: number;
	maxL: number;
	countColdMs: number;
	countWarmMs: number;
	enumerationMs: number | null;
	terms: number;
}

function benchOne(text: string): BenchRow {
	const cfg: Configuration = parseConfiguration(text);
	const open = openSubshells(cfg);
	const total = microstateTotal(cfg);
	let terms = 0;
	const countColdMs = timeMedian(() => (terms = termsOf(cfg).length), 15, 3, clearMicrostateCache);
	const countWarmMs = timeMedian(() => termsOf(cfg), 31, 5);
	let enumerationMs: number | null = null;
	if (total <= BigInt(ENUMERATION_LIMIT)) {
		const runs = total > 100_000n ? 3 : 9;
		enumerationMs = timeMedian(() => termsByEnumeration(cfg), runs, 1);
	}
	return {
		configuration: text,
		microstates: total,
		openSubshells: open.length,
		maxL: Math.max(0, ...open.map((s) => s.l)),
		countColdMs,
		countWarmMs,
		enumerationMs,
		terms
	};
}

function fmt(ms: number): string {
	return ms < 1 ? ms.toFixed(3) : ms < 100 ? ms.toFixed(2) : ms.toFixed(0);
}

/** Runs the benchmark, prints the table and the target verdicts; returns the rows. */
export function main(): BenchRow[] {
	const rows: BenchRow[] = [];
	console.log('LS terms: generating-function counting (termsOf) vs enumeration and peeling (termsByEnumeration)');
	console.log(`Node ${process.version}; medians after warm-up; "cold" clears the per-subshell cache before each run.\n`);
	const header = [
		'configuration',
		'microstates',
		'open',
		'distinct terms',
		'count cold ms',
		'count warm ms',
		'enumerate ms',
		'ratio',
		'heap MB'
	];
	console.log(header.join(' | '));
	for (const text of CONFIGURATIONS) {
		const row = benchOne(text);
		rows.push(row);
		const ratio = row.enumerationMs === null ? '—' : `${Math.round(row.enumerationMs / row.countColdMs)}×`;
		const heap = (process.memoryUsage().heapUsed / 2 ** 20).toFixed(1);
		console.log(
			[
				row.configuration,
				row.microstates.toLocaleString('en-US'),
				String(row.openSubshells),
				String(row.terms),
				fmt(row.countColdMs),
				fmt(row.countWarmMs),
				row.enumerationMs === null ? '— (over limit)' : fmt(row.enumerationMs),
				ratio,
				heap
			].join(' | ')
		);
	}
	console.log('');
	const inScope = rows.filter((r) => r.openSubshells <= 6 && r.maxL <= 6);
	const slow = inScope.filter((r) => r.countColdMs >= TARGET_COUNT_MS);
	console.log(
		`Target 1, counting under ${TARGET_COUNT_MS} ms (cold) for ≤ 6 open subshells with l ≤ 6: ${slow.length === 0 ? 'MET' : 'NOT MET'} ` +
			`(${inScope.length} configurations; slowest ${fmt(Math.max(...inScope.map((r) => r.countColdMs)))} ms${slow.length ? `; too slow: ${slow.map((r) => r.configuration).join(', ')}` : ''})`
	);
	const band = rows.filter((r) => r.enumerationMs !== null && r.microstates >= SPEEDUP_BAND[0] && r.microstates <= SPEEDUP_BAND[1]);
	for (const r of band) {
		const speedup = (r.enumerationMs as number) / r.countColdMs;
		console.log(
			`Target 2, counting ≥ ${TARGET_SPEEDUP}× faster than enumeration at ~10⁶ microstates (${r.configuration}, ${r.microstates.toLocaleString('en-US')}): ` +
				`${speedup >= TARGET_SPEEDUP ? 'MET' : 'NOT MET'} (${Math.round(speedup)}× cold, ${Math.round((r.enumerationMs as number) / r.countWarmMs)}× warm)`
		);
	}
	const mem = process.memoryUsage();
	console.log(
		`Heap used at the end: ${(mem.heapUsed / 2 ** 20).toFixed(1)} MB (total heap ${(mem.heapTotal / 2 ** 20).toFixed(1)} MB, RSS ${(mem.rss / 2 ** 20).toFixed(1)} MB)`
	);
	return rows;
}

/** For the summary of `npm run bench`: prints the detail above and returns one row per configuration. */
export async function run(): Promise<SummaryRow[]> {
	return main().map((r) => ({
		bench: 'LS term counting (cold)',
		case: r.configuration,
		medianMs: r.countColdMs,
		naive: { method: 'enumerate and peel', medianMs: r.enumerationMs },
		...(r.openSubshells <= 6 && r.maxL <= 6 ? { target: { text: `< ${TARGET_COUNT_MS} ms`, met: r.countColdMs < TARGET_COUNT_MS } } : {})
	}));
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) main();
