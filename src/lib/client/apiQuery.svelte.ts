/**
 * The pages' one way to read /api/v1: TanStack Query (its cache, abort and stale handling) with one
 * debounce and one error type. A component calls `apiQuery(() => ({ route, params, enabled }))` during
 * its set-up and reads `.data`, `.error`, `.busy`; typing stops a request from leaving until the
 * input has been still for DEBOUNCE_MS, and a newer input aborts the older request. The compute POSTs
 * (Energy solver, fit, Line matcher) are read the same way with `body` instead of `params`: their answer
 * depends only on the body, which is part of the cache key. Paged lists use `apiPages`.
 */
import { browser } from '$app/environment';
import { createInfiniteQuery, createQuery, keepPreviousData, QueryClient, useQueryClient } from '@tanstack/svelte-query';
import { ApiError, apiGet, apiPost, apiUrl, type GetKey, type Params, type PostKey } from '$lib/api/client';
import type { ApiRequests, ApiResponses } from '$lib/api/types';

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

type QueryRoute = GetKey | PostKey;

interface QueryOptions {
	/** false: ask nothing (no input yet). Default true. */
	enabled?: boolean;
	/** Wait DEBOUNCE_MS after a change before asking (for typed input). Default true. */
	debounce?: boolean;
	/** Project data changes under the user's feet: refetch when opened again. Default false (compute routes). */
	live?: boolean;
}

/** What to ask: a GET route with its params, or a compute POST with its JSON body. */
export type ApiQueryInput<K extends QueryRoute> = QueryOptions & { route: K } & (K extends PostKey
		? { body: ApiRequests[K]; params?: undefined }
		: { params: Params; body?: undefined });

export interface ApiQuery<K extends QueryRoute> {
	/** The last answer received (kept while a newer one is computed). */
	readonly data: ApiResponses[K] | undefined;
	/** The params of the answer in `data` (GET routes). */
	readonly dataParams: Params | undefined;
	/** The body of the answer in `data` (POST routes). */
	readonly dataBody: (K extends PostKey ? ApiRequests[K] : never) | undefined;
	/** The refusal or failure of the latest request, with the server's message; null when it succeeded. */
	readonly error: ApiError | null;
	/** True from a change until its answer arrives (debounce included). */
	readonly busy: boolean;
	/** Stops the pending or running request; the last answer stays. */
	cancel(): void;
	/** Asks again when the last attempt failed (a network failure; the same input is answered from the cache otherwise). */
	retry(): void;
}

/** Debounced copy of a value: follows `read()` once it has been still for `ms`. */
class Settled<T> {
	// raw: the settled input is handed on as it was given (a body keeps its identity, big lists are not proxied).
	current = $state.raw() as T;
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

type Loose = QueryOptions & { route: QueryRoute; params?: Params; body?: unknown };

/** The input once it has settled, with the one string that names it (the cache key). */
function settle(input: () => Loose) {
	return new Settled(() => {
		const i = input();
		const enabled = i.enabled ?? true;
		const url = enabled ? apiUrl(i.route, i.params) : '';
		const key = enabled && i.body !== undefined ? `${url} ${JSON.stringify(i.body)}` : url;
		return { value: { ...i, enabled, key }, key, wait: enabled && (i.debounce ?? true) };
	}, DEBOUNCE_MS);
}

/** Any failure as an ApiError (the server's words when it answered). */
const apiError = (e: Error | null) => (e ? (e instanceof ApiError ? e : new ApiError(0, e.message)) : null);

const liveOptions = { staleTime: 0, refetchOnMount: 'always' as const };

/**
 * A typed, debounced, cached, abortable read of one /api/v1 route. Call during component set-up
 * (the query client comes from the layout's provider; tests pass their own).
 * @example const sheet = apiQuery(() => ({ route: 'GET /api/v1/terms', params: { config }, enabled: config !== '' }));
 * @example const levels = apiQuery(() => ({ route: 'POST /api/v1/energies', body: { config, parameters } }));
 */
export function apiQuery<K extends QueryRoute>(input: () => ApiQueryInput<K>, queryClient?: QueryClient): ApiQuery<K> {
	const client = useQueryClient(queryClient);
	const settled = settle(input as () => Loose);
	let cancelled = $state('');

	const query = createQuery(
		() => {
			const { route, params, body, enabled, key, live } = settled.current;
			return {
				queryKey: ['api', key],
				queryFn: async ({ signal }: { signal: AbortSignal }) => ({
					answer: (body === undefined
						? await apiGet(route as GetKey, params, signal)
						: await apiPost(route as PostKey, body as ApiRequests[PostKey], signal)) as ApiResponses[K],
					params,
					body
				}),
				enabled: browser && enabled && cancelled !== key,
				placeholderData: keepPreviousData,
				...(live ? liveOptions : {})
			};
		},
		() => client
	);

	return {
		get data() {
			return query.data?.answer;
		},
		get dataParams() {
			return query.data?.params;
		},
		get dataBody() {
			return query.data?.body as ApiQuery<K>['dataBody'];
		},
		get error() {
			return apiError(query.error);
		},
		get busy() {
			return settled.pending || query.isFetching;
		},
		cancel() {
			cancelled = settled.current.key;
			void client.cancelQueries({ queryKey: ['api', settled.current.key] });
		},
		retry() {
			if (query.isError) void query.refetch();
		}
	};
}

/** GET routes that answer a page of a list and the cursor of the next one. */
type PagedKey = { [K in GetKey]: ApiResponses[K] extends { nextCursor: string | null } ? K : never }[GetKey];

export interface ApiPages<K extends PagedKey> {
	/** The pages read so far, in order (the last list is kept while a new filter is asked). */
	readonly pages: ApiResponses[K][] | undefined;
	readonly error: ApiError | null;
	/** True from a change of the params until the first page answers (debounce included). */
	readonly busy: boolean;
	/** True while the next page is on its way. */
	readonly loadingMore: boolean;
	/** The server said there is more. */
	readonly hasMore: boolean;
	/** Asks for the next page. */
	more(): void;
}

/**
 * A paged list (`?cursor=` from the previous page's `nextCursor`), with the same debounce, cache and
 * errors as `apiQuery`; a change of params starts again from the first page.
 * @example const shelf = apiPages(() => ({ route: 'GET /api/v1/projects/:projectId/shelf', params: { projectId, q } }));
 */
export function apiPages<K extends PagedKey>(
	input: () => QueryOptions & { route: K; params: Params },
	queryClient?: QueryClient
): ApiPages<K> {
	const client = useQueryClient(queryClient);
	const settled = settle(input);
	const query = createInfiniteQuery(
		() => {
			const { route, params, enabled, key, live } = settled.current;
			return {
				queryKey: ['api-pages', key],
				queryFn: ({ signal, pageParam }: { signal: AbortSignal; pageParam: string | null }) =>
					apiGet(route as K, { ...params, cursor: pageParam ?? undefined }, signal) as Promise<ApiResponses[K]>,
				initialPageParam: null as string | null,
				getNextPageParam: (last: ApiResponses[K]) => (last as { nextCursor: string | null }).nextCursor ?? undefined,
				enabled: browser && enabled,
				placeholderData: keepPreviousData,
				...(live ? liveOptions : {})
			};
		},
		() => client
	);
	return {
		get pages() {
			return query.data?.pages;
		},
		get error() {
			return apiError(query.error);
		},
		get busy() {
			return settled.pending || (query.isFetching && !query.isFetchingNextPage);
		},
		get loadingMore() {
			return query.isFetchingNextPage;
		},
		get hasMore() {
			return query.hasNextPage;
		},
		more() {
			void query.fetchNextPage();
		}
	};
}
