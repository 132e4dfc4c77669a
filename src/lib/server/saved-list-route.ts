/**
 * The handlers of one saved list's API route (/level-lists/:levelListId and /line-lists/:lineListId), alike
 * but for the kind of list: GET reads the list with its rows, DELETE removes it.
 */
import type { RequestEvent } from '@sveltejs/kit';
import type { Actor } from './access';
import { api, apiActor, reply } from './http';
import { deleteList, type ListKind } from './services/lists';
import type { ApiResponses, RouteKey, Sendable } from '../api/types';

export function savedListRoute<K extends RouteKey>(
	getRoute: K,
	kind: ListKind,
	/** The route's parameter that holds the list id. */
	listParam: 'levelListId' | 'lineListId',
	read: (actor: Actor, projectId: string, listId: string) => Sendable<ApiResponses[K]>
) {
	const listId = (event: RequestEvent) => event.params[listParam] ?? '';
	const projectId = (event: RequestEvent) => event.params.projectId ?? '';
	return {
		GET: api((event: RequestEvent) => reply(getRoute, read(apiActor(event), projectId(event), listId(event)))),
		/** Deletes the list, its rows and the identifications that use them. */
		DELETE: api((event: RequestEvent) => {
			deleteList(apiActor(event), projectId(event), kind, listId(event));
			return new Response(null, { status: 204 });
		})
	};
}
