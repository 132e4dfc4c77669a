// `npm run bench`: every benchmark's detail, then one summary table (medians, ratios against the
// naive methods). Not tests: the figures depend on the machine and on what else runs on it.
// A benchmark registers by exporting `run(): Promise<SummaryRow[]>` (see ./bench-summary.ts) and
// being listed here; a module with only `main()` is run for its detail and adds no summary rows.
import { printSummary, type SummaryRow } from './bench-summary';

const BENCHES: { title: string; load: () => Promise<{ run?: () => Promise<SummaryRow[]>; main?: () => unknown }> }[] = [
	{ title: 'Term engine: generating-function counting against explicit enumeration', load: () => import('./bench-terms') },
	{ title: 'Exact Wigner symbols at the API limits, jj levels, Term sheets near the budget', load: () => import('./bench-wigner') },
	{ title: 'Energy solver: intermediate-coupling levels', load: () => import('./bench-energy') },
	{ title: 'Energy solver: 4f7 5d through the API task in a compute worker', load: () => import('./bench-energy-worker') },
	{ title: 'Line matcher: sorted transitions and binary search against brute force', load: () => import('./bench-matcher') }
];

const rows: SummaryRow[] = [];
for (const [i, b] of BENCHES.entries()) {
	console.log(`${i ? '\n' : ''}== ${b.title} ==`);
	const mod = await b.load();
	if (mod.run) rows.push(...(await mod.run()));
	else await mod.main?.();
}
console.log(`\n== Summary (Node ${process.version}; medians in ms; ratio = naive ÷ ours) ==`);
printSummary(rows);
// Peak resident memory of the whole run (ru_maxrss is in kB on Linux).
const mem = process.memoryUsage();
console.log(
	`\nMemory: peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB; at the end heap ${(mem.heapUsed / 2 ** 20).toFixed(0)} MB, RSS ${(mem.rss / 2 ** 20).toFixed(0)} MB`
);
