import type { RequestHandler } from './$types';
import { createParameterSet, listParameterSets } from '$lib/server/services/parameter-sets';
import { api, apiActor, readJson, reply } from '$lib/server/http';

export const GET: RequestHandler = api((event) =>
	reply('GET /api/v1/projects/:projectId/shelf/:entryId/parameters', {
		parameterSets: listParameterSets(apiActor(event), event.params.projectId, event.params.entryId)
	})
);

/** Body: { name, parameters: { Eav, F, G, zeta }, comment? }; parameters that cannot occur in the entry's configuration get 400. */
export const POST: RequestHandler = api(async (event) => {
	const actor = apiActor(event);
	const parameterSet = createParameterSet(actor, event.params.projectId, event.params.entryId, await readJson(event));
	return reply('POST /api/v1/projects/:projectId/shelf/:entryId/parameters', { parameterSet }, { status: 201 });
});
