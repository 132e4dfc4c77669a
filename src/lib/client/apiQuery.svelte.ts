/**
 * The pages' one way to read /api/v1: TanStack Query (its cache, abort and stale handling) with one
 * debounce and one error type. A component calls `apiQuery(() => ({ route, params, enabled }))` during
 * its set-up and reads `.data`, `.error`, `.busy`; typing stops a request from leaving until the
 * input has been still for DEBOUNCE_MS, and a newer input aborts the older request.
 */
import { browser } from '$app/environment';
import { createQuery, keepPreviousData, QueryClient, useQueryClient } from '@tanstack/svelte-query';
import { ApiError, apiGet, apiUrl } from '$lib/api/client';
import type { ApiResponses, RouteKey } from '$lib/api/types';

/** Wait after the last change (keystroke, chip, toggle) before asking the server, in milliseconds. */
export const DEBOUNCE_MS = 150;

/** The app's one query client: compute answers depend only on their URL, so they never go stale. */
export function createAppQueryClient(): QueryClient {
	return new QueryClient({
		defaultOptions: {
			queries: { retry: false, refetchOnWindowFocus: false, staleTime: Infinity, gcTime: 10 * 60_000, enabled: browser }
		}
	});
}

type GetKey = Extract<RouteKey, `GET ${string}`>;
type Params = Parameters<typeof apiUrl>[1];

export interface ApiQueryInput<K extends GetKey> {
	route: K;
	params: Params;
	/** false: ask nothing (no input yet). Default true. */
	enabled?: boolean;
	/** Wait DEBOUNCE_MS after a change before asking (for typed input). Default true. */
	debounce?: boolean;
	/** Project data changes under the user's feet: refetch when opened again. Default false (compute routes). */
	live?: boolean;
}

export interface ApiQuery<K extends GetKey> {
	/** The last answer received (kept while a newer one is computed). */
	readonly data: ApiResponses[K] | undefined;
	/** The params of the answer in `data`. */
	readonly dataParams: Params | undefined;
	/** The refusal or failure of the latest request, with the server's message; null when it succeeded. */
	readonly error: ApiError | null;
	/** True from a change until its answer arrives (debounce included). */
	readonly busy: boolean;
	/** Stops the pending or running request; the last answer stays. */
	cancel(): void;
}

/** Debounced copy of a value: follows `read()` once it has been still for `ms`. */
class Settled<T> {
	current = $state() as T;
	pending = $state(false);
	constructor(read: () => { value: T; key: string; wait: boolean }, ms: number) {
		const first = read();
		this.current = first.value;
		let key = first.key;
		$effect(() => {
			const next = read();
			if (next.key === key) return;
			if (!next.wait) {
				key = next.key;
				this.current = next.value;
				this.pending = false;
				return;
			}
			this.pending = true;
			const timer = setTimeout(() => {
				key = next.key;
				this.current = next.value;
				this.pending = false;
			}, ms);
			return () => clearTimeout(timer);
		});
	}
}

/**
 * A typed, debounced, cached, abortable GET of one /api/v1 route. Call during component set-up.
 * @example const sheet = apiQuery(() => ({ route: 'GET /api/v1/terms', params: { config }, enabled: config !== '' }));
 */
export function apiQuery<K extends GetKey>(input: () => ApiQueryInput<K>): ApiQuery<K> {
	const client = useQueryClient();
	const settled = new Settled(() => {
		const i = input();
		const enabled = i.enabled ?? true;
		const url = enabled ? apiUrl(i.route, i.params) : '';
		return { value: { ...i, enabled, url }, key: url, wait: enabled && (i.debounce ?? true) };
	}, DEBOUNCE_MS);
	let cancelled = $state('');

	const query = createQuery(() => {
		const { route, params, enabled, url, live } = settled.current;
		return {
			queryKey: ['api', url],
			queryFn: async ({ signal }: { signal: AbortSignal }) => ({ body: await apiGet(route, params, signal), params }),
			enabled: browser && enabled && cancelled !== url,
			placeholderData: keepPreviousData,
			...(live ? { staleTime: 0, refetchOnMount: 'always' as const } : {})
		};
	});

	return {
		get data() {
			return query.data?.body;
		},
		get dataParams() {
			return query.data?.params;
		},
		get error() {
			const e = query.error;
			if (!e) return null;
			return e instanceof ApiError ? e : new ApiError(0, e.message);
		},
		get busy() {
			return settled.pending || query.isFetching;
		},
		cancel() {
			cancelled = settled.current.url;
			void client.cancelQueries({ queryKey: ['api', settled.current.url] });
		}
	};
}
