/**
 * A positive number from the environment, or the fallback when it is unset or not a positive
 * number. Dependency-free, so both the pool and the worker's tasks may use it.
 * @example numberFromEnv('COMPUTE_QUEUE', 64) // 64 unless COMPUTE_QUEUE is set
 */
export function numberFromEnv(name: string, fallback: number): number {
	const v = Number(process.env[name]);
	return Number.isFinite(v) && v > 0 ? v : fallback;
}
