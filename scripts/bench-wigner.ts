/**
 * Timings of the exact Wigner symbols at the API size limits, of jj level counting and listing,
 * and of Term sheets near the budget limits (src/lib/physics/budget.ts). Medians of a few runs.
 * Run with `npx tsx scripts/bench-wigner.ts`. Not a test: numbers depend on the machine.
 */
import { pathToFileURL } from 'node:url';
import { MAX_J_9J, MAX_J_SYMBOL } from '../src/lib/physics/wigner';
import { evaluateSymbol } from '../src/lib/server/compute/symbol-args';
import { jjLevelCountsByJ, jjLevels } from '../src/lib/physics/jj';
import { parseConfiguration } from '../src/lib/physics/parse';
import { termSheet } from '../src/lib/physics/report';
import { medianMs, type SummaryRow } from './bench-summary';

/** Prints each timing and returns them as summary rows (no naive method to compare with). */
export async function run(): Promise<SummaryRow[]> {
	const rows: SummaryRow[] = [];
	const time = (bench: string, label: string, work: () => unknown, runs = 5) => {
		const m = medianMs(work, runs);
		console.log(`${label.padEnd(52)} ${m.toFixed(1)} ms`);
		rows.push({ bench, case: label, medianMs: m });
	};
	const big = String(MAX_J_SYMBOL);
	const big9 = String(MAX_J_9J);
	time('exact Wigner symbol', `3j (${big} ${big} ${big}; 0 0 0)`, () => evaluateSymbol('3j', [big, big, big, '0', '0', '0']));
	time('exact Wigner symbol', `6j {${big} … ${big}}`, () => evaluateSymbol('6j', Array(6).fill(big)));
	time('exact Wigner symbol', `cg ⟨${big} 0 ${big} 0 | ${big} 0⟩`, () => evaluateSymbol('cg', [big, '0', big, '0', big, '0']));
	time('exact Wigner symbol', `9j {${big9} … ${big9}}`, () => evaluateSymbol('9j', Array(9).fill(big9)), 3);
	time('exact Wigner symbol', '9j {10 … 10}', () => evaluateSymbol('9j', Array(9).fill('10')));
	time('jj coupling', 'jj counts 4f7 5d4 6p3', () => jjLevelCountsByJ(parseConfiguration('4f7 5d4 6p3')));
	time('jj coupling', 'jj levels 4f7 5d 6p (18131 levels)', () => jjLevels(parseConfiguration('4f7 5d 6p')), 3);
	// Near the Term sheet budget: what the worker pool takes off the request thread.
	time('Term sheet (warm cache)', 'termSheet 10m19 (9 625-row bound)', () => termSheet(parseConfiguration('10m19')), 3);
	time('Term sheet (warm cache)', 'termSheet 4f7 5g5 6h5 7i3 6d3 7p', () => termSheet(parseConfiguration('4f7 5g5 6h5 7i3 6d3 7p')), 3);
	return rows;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) await run();
