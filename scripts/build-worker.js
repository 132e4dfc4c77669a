// Bundles the compute worker (src/lib/server/compute/worker.ts and the engine it imports) into
// build/compute-worker.js, beside the SvelteKit server that starts it. Run after `vite build`.
import { build } from 'esbuild';

await build({
	entryPoints: ['src/lib/server/compute/worker.ts'],
	outfile: 'build/compute-worker.js',
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	logLevel: 'warning'
});
console.log('compute worker: build/compute-worker.js');
