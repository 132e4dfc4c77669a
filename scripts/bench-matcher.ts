/**
 * Benchmark of the Line matcher: 10⁵ observed lines against 2 000 invented levels, the sorted table with a
 * binary search per line (`matchLines`) against the brute-force scan of every level pair per line
 * (`matchLinesBruteForce`, timed on a sample of lines and scaled to the full list).
 * Run with `npx tsx scripts/bench-matcher.ts`; `main()` can also be called from a combined script.
 * Not a test: the numbers depend on the machine. Timings are medians.
 *
 * Target: the whole match (table build, sort, search, predictions) well under TARGET_MATCH_MS.
 */
import { pathToFileURL } from 'node:url';
import { matchLines, matchLinesBruteForce, transitionTable, type MatchLevel, type ObservedLine } from '../src/lib/physics/matcher';
import { vacuumToAir } from '../src/lib/physics/airvac';
import type { TransitionType } from '../src/lib/physics/transitions';
import type { SummaryRow } from './bench-summary';

/** The full match of 10⁵ lines against 2 000 levels must take less than this (ms, median). */
export const TARGET_MATCH_MS = 2000;
const LEVELS = 2000;
const LINES = 100_000;
/** Lines timed with the brute-force method (then scaled to LINES). */
const BRUTE_SAMPLE = 20;
const TYPES: TransitionType[] = ['E1', 'M1', 'E2'];

/** A small deterministic generator (mulberry32), so every run sees the same invented data. */
function random(seed: number): () => number {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

/** Invented levels: J = 0 … 5, both parities, triplet terms with L = J (L = 1 for J = 0), 0–100 000 cm⁻¹. */
function inventLevels(rand: () => number): MatchLevel[] {
	return Array.from({ length: LEVELS }, (_, i) => {
		const J = Math.floor(rand() * 6);
		return {
			twoJ: 2 * J,
			parity: i % 2 ? 'odd' : 'even',
			term: { twoS: 2, L: J === 0 ? 1 : J },
			energy: rand() * 100_000,
			uncertainty: 0.01 + 0.04 * rand()
		};
	});
}

/** 90 % of the lines from random allowed pairs (with noise), 10 % at random wavenumbers. */
function inventLines(levels: MatchLevel[], rand: () => number): ObservedLine[] {
	const table = transitionTable(levels, TYPES);
	return Array.from({ length: LINES }, () => {
		const sigma = rand() < 0.9 ? table.sigma[Math.floor(rand() * table.length)] + 0.02 * (rand() - 0.5) : 500 + rand() * 99_000;
		const vac = 1e8 / sigma;
		const medium = vac >= 2000 ? 'air' : 'vacuum';
		return { wavelength: medium === 'air' ? vacuumToAir(vac) : vac, unit: 'A', medium, uncertainty: (vac * vac * 0.01) / 1e8 };
	});
}

function median(values: number[]): number {
	const s = values.slice().sort((a, b) => a - b);
	const m = s.length >> 1;
	return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Median wall-clock and CPU time (user + system, this process) in ms of `run` over `runs` runs. */
function timeMedian(run: () => unknown, runs: number): { wall: number; cpu: number } {
	const wall: number[] = [];
	const cpu: number[] = [];
	for (let i = 0; i < runs; i++) {
		const c0 = process.cpuUsage();
		const t0 = performance.now();
		run();
		wall.push(performance.now() - t0);
		const c = process.cpuUsage(c0);
		cpu.push((c.user + c.system) / 1000);
	}
	return { wall: median(wall), cpu: median(cpu) };
}

/** Runs the benchmark, prints the figures and the verdict, and returns the summary rows (CPU medians). */
export function main(): SummaryRow[] {
	const rand = random(20260412);
	const levels = inventLevels(rand);
	const lines = inventLines(levels, rand);
	console.log(
		`Line matcher: ${LINES.toLocaleString('en-US')} lines against ${LEVELS.toLocaleString('en-US')} levels, types ${TYPES.join('+')}, tolerance 2 × combined uncertainty`
	);
	console.log(`Node ${process.version}; medians; invented data (seeded).\n`);

	let transitions = 0;
	const table = timeMedian(() => (transitions = transitionTable(levels, TYPES).length), 3);
	let explained = 0;
	let unobserved = 0;
	const match = timeMedian(() => {
		const r = matchLines(levels, lines, { types: TYPES });
		explained = LINES - r.unexplained.length;
		unobserved = r.unobservedCount;
	}, 5);
	const sample = lines.slice(0, BRUTE_SAMPLE);
	const brute = timeMedian(() => matchLinesBruteForce(levels, sample, { types: TYPES }), 3);
	const scaled = (ms: number) => (ms * LINES) / BRUTE_SAMPLE;
	const n = (x: number) => x.toLocaleString('en-US');

	console.log(['method', 'lines', 'wall ms', 'CPU ms', 'note'].join(' | '));
	console.log(
		['build + sort table', '—', table.wall.toFixed(0), table.cpu.toFixed(0), `${n(transitions)} allowed transitions`].join(' | ')
	);
	console.log(
		[
			'sorted + binary search (matchLines)',
			n(LINES),
			match.wall.toFixed(0),
			match.cpu.toFixed(0),
			`includes the table; ${n(explained)} lines explained, ${n(unobserved)} strong unobserved predictions`
		].join(' | ')
	);
	console.log(
		[
			'brute force (every pair per line)',
			n(BRUTE_SAMPLE),
			brute.wall.toFixed(0),
			brute.cpu.toFixed(0),
			`scaled to ${n(LINES)} lines: ${(scaled(brute.wall) / 1000).toFixed(0)} s wall, ${(scaled(brute.cpu) / 1000).toFixed(0)} s CPU`
		].join(' | ')
	);
	console.log(`\nRatio brute force / sorted search (full list, CPU): ${n(Math.round(scaled(brute.cpu) / match.cpu))}×`);
	console.log(
		`Target, the full match under ${TARGET_MATCH_MS} ms: ${match.cpu < TARGET_MATCH_MS ? 'MET' : 'NOT MET'} on CPU time (${match.cpu.toFixed(0)} ms); wall ${match.wall.toFixed(0)} ms` +
			' (wall time grows when other processes share the cores)'
	);
	const mem = process.memoryUsage();
	console.log(`Heap used at the end: ${(mem.heapUsed / 2 ** 20).toFixed(1)} MB (RSS ${(mem.rss / 2 ** 20).toFixed(1)} MB)`);
	return [
		{
			bench: 'Line matcher (CPU)',
			case: `${n(LINES)} lines × ${n(LEVELS)} levels`,
			medianMs: match.cpu,
			naive: { method: 'brute force, scaled from a sample', medianMs: scaled(brute.cpu) },
			target: { text: `< ${TARGET_MATCH_MS} ms`, met: match.cpu < TARGET_MATCH_MS }
		}
	];
}

/** For the summary of `npm run bench`. */
export async function run(): Promise<SummaryRow[]> {
	return main();
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) main();
