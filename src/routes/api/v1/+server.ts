import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';

/** A small index so scripts can discover the API. */
export const GET: RequestHandler = () =>
	json({
		name: 'Termwright API',
		version: 1,
		endpoints: [
			'GET /api/v1/terms?config=',
			'GET /api/v1/jj?config=',
			'GET /api/v1/wigner?symbol=3j|6j|9j|cg&args=',
			'GET|POST /api/v1/projects',
			'GET|PATCH|DELETE /api/v1/projects/:projectId',
			'GET|POST /api/v1/projects/:projectId/members',
			'GET|DELETE /api/v1/projects/:projectId/membership',
			'GET|POST /api/v1/projects/:projectId/shelf',
			'GET|PATCH|DELETE /api/v1/projects/:projectId/shelf/:entryId'
		]
	});
