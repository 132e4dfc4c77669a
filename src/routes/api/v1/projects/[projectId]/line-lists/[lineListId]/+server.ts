import { getLineList } from '$lib/server/services/lists';
import { savedListRoute } from '$lib/server/saved-list-route';

const route = savedListRoute('GET /api/v1/projects/:projectId/line-lists/:lineListId', 'lines', 'lineListId', getLineList);

/** The list with its lines. */
export const GET = route.GET;
/** Deletes the list, its lines and their identifications. */
export const DELETE = route.DELETE;
