/**
 * Rough timings of the exact Wigner symbols at the API size limits and of jj level listing.
 * Run with `npx tsx scripts/bench-wigner.ts`. Not a test: numbers depend on the machine.
 */
import { MAX_J_9J, MAX_J_SYMBOL } from '../src/lib/physics/wigner';
import { evaluateSymbol } from '../src/lib/server/compute/symbol-args';
import { jjLevelCountsByJ, jjLevels } from '../src/lib/physics/jj';
import { parseConfiguration } from '../src/lib/physics/parse';

function time(label: string, run: () => unknown): void {
	const start = performance.now();
	run();
	console.log(`${label.padEnd(48)} ${(performance.now() - start).toFixed(1)} ms`);
}

const big = String(MAX_J_SYMBOL);
const big9 = String(MAX_J_9J);
time(`3j (${big} ${big} ${big}; 0 0 0)`, () => evaluateSymbol('3j', [big, big, big, '0', '0', '0']));
time(`6j {${big} … ${big}}`, () => evaluateSymbol('6j', Array(6).fill(big)));
time(`cg ⟨${big} 0 ${big} 0 | ${big} 0⟩`, () => evaluateSymbol('cg', [big, '0', big, '0', big, '0']));
time(`9j {${big9} … ${big9}}`, () => evaluateSymbol('9j', Array(9).fill(big9)));
time('9j {10 … 10}', () => evaluateSymbol('9j', Array(9).fill('10')));
time('jj counts 4f7 5d4 6p3', () => jjLevelCountsByJ(parseConfiguration('4f7 5d4 6p3')));
time('jj levels 4f7 5d 6p (18131 levels)', () => jjLevels(parseConfiguration('4f7 5d 6p')));
