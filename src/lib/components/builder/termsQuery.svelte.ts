/**
 * The Term sheet of the current configuration, fetched from `GET /api/v1/terms`.
 * Requests wait DEBOUNCE_MS after the last change; a newer request aborts the one in flight.
 */
import type { TermSheet } from '$lib/physics/report';
import type { NotationProblem } from './builder.svelte';

/** Wait after the last keystroke or Rail change before asking the engine, in milliseconds. */
export const DEBOUNCE_MS = 200;

export type GsChoice = 'exact' | 'free';

export class TermsQuery {
	/** The last Term sheet received (kept while a new one is computed). */
	sheet = $state<TermSheet | null>(null);
	/** The engine's answer to a bad request, shown beside the notation field. */
	problem = $state<NotationProblem | null>(null);
	/** True from the moment a change is seen until its answer arrives. */
	busy = $state(false);
	/** The configuration and g_s of the sheet on screen. */
	shownConfig = $state('');

	#timer: ReturnType<typeof setTimeout> | null = null;
	#controller: AbortController | null = null;
	#wanted = '';

	/** Ask for the sheet of `config` (null: nothing to compute). `onSent` runs when the request leaves. */
	request(config: string | null, gs: GsChoice, onSent?: (config: string) => void) {
		const key = config === null ? '' : `${config}\u0000${gs}`;
		if (key === this.#wanted) return;
		this.#wanted = key;
		this.cancel();
		if (config === null) {
			this.problem = null;
			return;
		}
		this.busy = true;
		this.#timer = setTimeout(() => {
			this.#timer = null;
			onSent?.(config);
			void this.#fetch(config, gs);
		}, DEBOUNCE_MS);
	}

	/** Stops the pending or running request. */
	cancel() {
		if (this.#timer) clearTimeout(this.#timer);
		this.#timer = null;
		this.#controller?.abort();
		this.#controller = null;
		this.busy = false;
	}

	/** Forget the request key so the same configuration can be asked again (after `cancel`). */
	reset() {
		this.#wanted = '';
	}

	async #fetch(config: string, gs: GsChoice) {
		const controller = new AbortController();
		this.#controller = controller;
		const params = new URLSearchParams({ config });
		if (gs === 'free') params.set('gs', 'free');
		try {
			const res = await fetch(`/api/v1/terms?${params}`, { signal: controller.signal });
			const body = await res.json();
			if (controller.signal.aborted) return;
			if (res.ok) {
				this.sheet = body as TermSheet;
				this.shownConfig = config;
				this.problem = null;
			} else {
				this.problem = { message: body?.error?.message ?? `The engine answered ${res.status}`, token: body?.error?.token ?? '' };
			}
		} catch (e) {
			if (controller.signal.aborted) return;
			this.problem = { message: `Could not reach the engine: ${(e as Error).message}`, token: '' };
		} finally {
			if (this.#controller === controller) {
				this.#controller = null;
				this.busy = false;
			}
		}
	}
}
