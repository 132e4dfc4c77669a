import { getLevelList } from '$lib/server/services/lists';
import { savedListRoute } from '$lib/server/saved-list-route';

const route = savedListRoute('GET /api/v1/projects/:projectId/level-lists/:levelListId', 'levels', 'levelListId', getLevelList);

/** The list with its levels. */
export const GET = route.GET;
/** Deletes the list, its levels and the identifications that use them. */
export const DELETE = route.DELETE;
