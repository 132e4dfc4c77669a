/**
 * A bounded map of recent results of pure computations (the engine's answers never go stale):
 * a hit moves to the newest place, and past `capacity` the oldest entry is dropped.
 */
export class RecentMap<V> {
	readonly #entries = new Map<string, V>();
	constructor(readonly capacity: number) {}

	get(key: string): V | undefined {
		const hit = this.#entries.get(key);
		if (hit !== undefined) {
			this.#entries.delete(key);
			this.#entries.set(key, hit);
		}
		return hit;
	}

	set(key: string, value: V): void {
		this.#entries.delete(key);
		this.#entries.set(key, value);
		if (this.#entries.size > this.capacity) this.#entries.delete(this.#entries.keys().next().value!);
	}
}
