import type { RequestHandler } from './$types';
import { matchLines, MATCH_CAUTION } from '$lib/physics/matcher';
import { api, readJson, reply } from '$lib/server/http';
import { MAX_MATCH_BODY_BYTES, parseMatchBody } from '$lib/server/lines-validation';

/**
 * Line matcher on posted data: `{ levels: [{ energy, J, parity, label?, term?, uncertainty? }], lines: [{ wavelength,
 * unit, medium, uncertainty? }], tolerance?, toleranceUnit?, coverage?, types?, maxCandidates? }`. Indices in the
 * answer point into the posted arrays. Without `tolerance` the combined uncertainty × coverage (default 2) is used.
 */
export const POST: RequestHandler = api(async (event) => {
	const input = parseMatchBody(await readJson(event, MAX_MATCH_BODY_BYTES));
	const result = matchLines(input.levels, input.lines, {
		types: input.types,
		tolerance: input.tolerance,
		maxCandidates: input.maxCandidates
	});
	return reply('POST /api/v1/match', { ...result, tolerance: input.tolerance, types: input.types, caution: MATCH_CAUTION });
});
