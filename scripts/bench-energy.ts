/**
 * Energy solver timings: all levels of a configuration with LS and jj compositions and g-factors.
 * "cold" builds the configuration's structure (determinant blocks, LS-coupled basis, projected
 * parameter matrices) from scratch; "warm" reuses it, as a sweep or a fit step does.
 * Run with `npx tsx scripts/bench-energy.ts` (also part of `npm run bench`). Not a test: the
 * numbers depend on the machine and on what else runs on it.
 */
import { Matrix, EigenvalueDecomposition } from 'ml-matrix';
import { intermediateLevels } from '../src/lib/physics/levels-ic';
import { clearEnergyCache } from '../src/lib/physics/energy-structure';
import { symmetricEigen } from '../src/lib/physics/symmetric-eigen';
import { checkDeterminantBudget } from '../src/lib/physics/determinants';
import { parseConfiguration } from '../src/lib/physics/parse';
import type { SummaryRow } from './bench-summary';

/**
 * The engine's default block budget (MAX_BLOCK_DETERMINANTS, 1 200) is for direct callers; like the
 * API's levels route (energy-validation.ts, 3 200), the bench raises it to time 4f⁷ 5d (3 106
 * determinants in its M_J = 0 block).
 */
const LIMITS = { maxBlock: 3200 };

/** Targets from the issue (ms, median, cold): d⁵ < 50, f⁷ < 1000, 4f⁷ 5d < 20000. */
const TARGETS: Record<string, number> = { '3d5': 50, '4f3': 1000, '4f7': 1000, '4f7 5d': 20000 };

function median(values: number[]): number {
	const s = [...values].sort((a, b) => a - b);
	return s[Math.floor(s.length / 2)];
}

// Invented but typical magnitudes (cm⁻¹).
const PARAMS: Record<string, Parameters<typeof intermediateLevels>[1]> = {
	'3d5': {
		F: [
			{ k: 2, a: '3d', b: '3d', value: 80000 },
			{ k: 4, a: '3d', b: '3d', value: 50000 }
		],
		zeta: [{ shell: '3d', value: 400 }]
	},
	'4f3': {
		F: [
			{ k: 2, a: '4f', b: '4f', value: 70000 },
			{ k: 4, a: '4f', b: '4f', value: 50000 },
			{ k: 6, a: '4f', b: '4f', value: 36000 }
		],
		zeta: [{ shell: '4f', value: 880 }]
	},
	'4f7': {
		F: [
			{ k: 2, a: '4f', b: '4f', value: 84000 },
			{ k: 4, a: '4f', b: '4f', value: 60000 },
			{ k: 6, a: '4f', b: '4f', value: 43000 }
		],
		zeta: [{ shell: '4f', value: 1500 }]
	},
	'4f7 5d': {
		F: [{ k: 2, a: '4f', b: '4f', value: 84000 }],
		zeta: [
			{ shell: '4f', value: 1500 },
			{ shell: '5d', value: 1000 }
		]
	}
};

/** Prints the detail and returns one summary row per configuration that was run (cold median). */
export function main(): SummaryRow[] {
	const rows: SummaryRow[] = [];
	console.log(
		'Energy solver: all levels with LS and jj compositions and g (medians; heap = largest heapUsed growth seen after a cold run)'
	);
	console.log(`Node ${process.version}\n`);
	console.log('config     dets  block  levels   cold ms   warm ms  target ms  ratio  heap MB');
	for (const cfg of Object.keys(PARAMS)) {
		let budget;
		try {
			budget = checkDeterminantBudget(parseConfiguration(cfg), LIMITS);
		} catch (e) {
			console.log(`${cfg.padEnd(9)}  not run: ${(e as Error).message}`);
			continue;
		}
		const runs = budget.block > 2000 ? 1 : budget.block > 200 ? 3 : 7;
		const cold: number[] = [];
		const warm: number[] = [];
		let peak = 0;
		let levels = 0;
		global.gc?.();
		const base = process.memoryUsage().heapUsed;
		for (let r = 0; r < runs; r++) {
			clearEnergyCache();
			let t = performance.now();
			levels = intermediateLevels(cfg, PARAMS[cfg], { limits: LIMITS }).levels.length;
			cold.push(performance.now() - t);
			peak = Math.max(peak, process.memoryUsage().heapUsed - base);
			t = performance.now();
			intermediateLevels(cfg, PARAMS[cfg], { limits: LIMITS });
			warm.push(performance.now() - t);
		}
		const c = median(cold);
		rows.push({
			bench: 'Energy solver (cold)',
			case: `${cfg}: ${levels} levels`,
			medianMs: c,
			target: { text: `< ${TARGETS[cfg]} ms`, met: c < TARGETS[cfg] }
		});
		console.log(
			`${cfg.padEnd(9)} ${String(budget.total).padStart(5)} ${String(budget.block).padStart(6)} ${String(levels).padStart(7)} ${c.toFixed(1).padStart(9)} ${median(warm).toFixed(1).padStart(9)} ${String(TARGETS[cfg]).padStart(10)} ${(c / TARGETS[cfg]).toFixed(2).padStart(6)} ${(peak / 2 ** 20).toFixed(1).padStart(13)}`
		);
	}
	console.log('\nSymmetric eigensolver, random n×n (this file’s method vs ml-matrix EigenvalueDecomposition):');
	for (const n of [100, 327]) {
		const a = new Float64Array(n * n);
		for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = Math.sin(i * 7.1 + j * 3.3);
		const matrixRows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
		const ours = median(
			[0, 1, 2].map(() => {
				const t = performance.now();
				symmetricEigen(a, n);
				return performance.now() - t;
			})
		);
		const theirs = median(
			[0, 1, 2].map(() => {
				const t = performance.now();
				void new EigenvalueDecomposition(new Matrix(matrixRows), { assumeSymmetric: true }).eigenvectorMatrix;
				return performance.now() - t;
			})
		);
		rows.push({
			bench: 'symmetric eigensolver',
			case: `random ${n}×${n}`,
			medianMs: ours,
			naive: { method: 'ml-matrix EigenvalueDecomposition', medianMs: theirs }
		});
		console.log(
			`n = ${String(n).padStart(4)}: ${ours.toFixed(1).padStart(8)} ms vs ml-matrix ${theirs.toFixed(1).padStart(8)} ms (ratio ${(theirs / ours).toFixed(1)}×)`
		);
	}
	return rows;
}

/** For the summary of `npm run bench`. */
export async function run(): Promise<SummaryRow[]> {
	return main();
}

if (import.meta.url === `file://${process.argv[1]}`) main();
