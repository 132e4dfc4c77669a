import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';
import { groundConfiguration, parseSpecies, speciesLabel } from '$lib/physics/elements';
import { api, queryParam } from '$lib/server/http';

/** Ground configuration of an atom or ion: `?name=Fe II` (or Fe+, Nd3+). */
export const GET: RequestHandler = api((event) => {
	const species = parseSpecies(queryParam(event, 'name', 20));
	const g = groundConfiguration(species);
	return json({ species: { ...species, label: speciesLabel(species) }, notation: g.notation, source: g.source, caution: g.caution });
});
