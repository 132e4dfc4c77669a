// `npm run bench`: every benchmark's detail, then one summary table (medians, ratios against the
// naive methods). Not tests: the figures depend on the machine and on what else runs on it.
// A benchmark registers by exporting `run(): Promise<SummaryRow[]>` (see ./bench-summary.ts) and
// being listed here; a module with only `main()` is run for its detail and adds no summary rows.
// Each one runs in its own child process (`--section N`), so none inherits another's heap.
import { fork } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { printSummary, type SummaryRow } from './bench-summary';

const BENCHES: { title: string; load: () => Promise<{ run?: () => Promise<SummaryRow[]>; main?: () => unknown }> }[] = [
	{ title: 'Term engine: generating-function counting against explicit enumeration', load: () => import('./bench-terms') },
	{ title: 'Exact Wigner symbols at the API limits, jj levels, Term sheets near the budget', load: () => import('./bench-wigner') },
	{ title: 'Energy solver: intermediate-coupling levels', load: () => import('./bench-energy') },
	{ title: 'Energy solver: 4f7 5d through the API task in a compute worker', load: () => import('./bench-energy-worker') },
	{ title: 'Line matcher: sorted transitions and binary search against brute force', load: () => import('./bench-matcher') }
];

/** What a section's child process sends back: its summary rows and its own peak resident memory (kB). */
interface SectionResult {
	rows: SummaryRow[];
	maxRSS: number;
}

const section = process.argv.indexOf('--section');
if (section >= 0) {
	// A child: run one benchmark and send its rows to the parent.
	const b = BENCHES[Number(process.argv[section + 1])];
	const mod = await b.load();
	const rows = mod.run ? await mod.run() : (await mod.main?.(), []);
	process.send!({ rows, maxRSS: process.resourceUsage().maxRSS } satisfies SectionResult);
} else {
	// Each benchmark runs in a fresh process: an earlier one's heap (the term engine's enumerations, its
	// caches) would otherwise slow the next one's garbage collection and skew its timings.
	const rows: SummaryRow[] = [];
	const peaks: { title: string; mb: number }[] = [];
	for (const [i, b] of BENCHES.entries()) {
		console.log(`${i ? '\n' : ''}== ${b.title} ==`);
		const result = await new Promise<SectionResult>((resolve, reject) => {
			const child = fork(fileURLToPath(import.meta.url), ['--section', String(i)], { stdio: 'inherit' });
			let got: SectionResult | null = null;
			child.on('message', (m) => (got = m as SectionResult));
			child.on('error', reject);
			child.on('exit', (code) => (code === 0 && got ? resolve(got) : reject(new Error(`${b.title}: the benchmark exited with ${code}`))));
		});
		rows.push(...result.rows);
		peaks.push({ title: b.title, mb: result.maxRSS / 1024 });
	}
	console.log(`\n== Summary (Node ${process.version}; medians in ms; ratio = naive ÷ ours) ==`);
	printSummary(rows);
	// Peak resident memory of each benchmark's process (ru_maxrss is in kB on Linux).
	console.log('\nMemory, peak RSS per benchmark process:');
	for (const p of peaks) console.log(`  ${p.mb.toFixed(0).padStart(5)} MB  ${p.title}`);
}
