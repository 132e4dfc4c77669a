import type { RequestHandler } from './$types';
import { groundConfiguration, parseSpecies, speciesLabel } from '$lib/physics/elements';
import { api, queryParam, reply } from '$lib/server/http';

/** Ground configuration of an atom or ion: `?name=Fe II` (or Fe+, Nd3+). */
export const GET: RequestHandler = api((event) => {
	const species = parseSpecies(queryParam(event, 'name', 20));
	const g = groundConfiguration(species);
	return reply('GET /api/v1/species', {
		species: { ...species, label: speciesLabel(species) },
		notation: g.notation,
		source: g.source,
		caution: g.caution
	});
});
