/**
 * Reading the inputs of the saved-list routes and pages: an upload's JSON body and the matcher's choices
 * from a query string or form (types as "E1,M1" or repeated fields).
 */
import { MAX_UPLOAD_BYTES } from '../lines/uploads';

/** JSON escaping can double a file's size; the service checks the file itself against MAX_UPLOAD_BYTES. */
export const UPLOAD_BODY_BYTES = 2 * MAX_UPLOAD_BYTES + 4096;

export function uploadBody(json: unknown) {
	const body = json as Record<string, unknown>; // readJson answers objects only
	return { input: { name: body.name, csv: body.csv }, preview: body.preview === true };
}

/** The matcher's options from URL parameters (absent ones take the defaults of savedMatchSchema). */
export function matchQuery(params: URLSearchParams) {
	const types = params
		.getAll('types')
		.flatMap((t) => t.split(','))
		.map((t) => t.trim().toUpperCase())
		.filter(Boolean);
	const optional = (name: string) => (params.get(name) === null || params.get(name) === '' ? undefined : params.get(name));
	return {
		levelListId: params.get('levelListId') ?? '',
		lineListId: params.get('lineListId') ?? '',
		types: types.length ? types : undefined,
		toleranceUnit: optional('toleranceUnit'),
		tolerance: optional('tolerance'),
		coverage: optional('coverage')
	};
}
