/**
 * Entry of the compute worker threads (piscina): runs one task of ./tasks.ts and returns its
 * answer. Bundled to build/compute-worker.js by scripts/build-worker.js; in development and
 * tests it is loaded from source through tsx (see ./pool.ts).
 */
import { runTask, type TaskArgs, type TaskName, type TaskResult } from './tasks';

export default function work<N extends TaskName>({ name, args }: { name: N; args: TaskArgs<N> }): TaskResult {
	return runTask(name, args);
}
