import type { RequestHandler } from './$types';
import { backupFileName, exportProject } from '$lib/server/services/backup';
import { api, apiActor } from '$lib/server/http';

/** The whole project as one versioned JSON file (owners only), sent as a download. */
export const GET: RequestHandler = api((event) => {
	const backup = exportProject(apiActor(event), event.params.projectId);
	return new Response(JSON.stringify(backup, null, 1), {
		headers: {
			'content-type': 'application/json; charset=utf-8',
			'content-disposition': `attachment; filename="${backupFileName(backup.project.name)}"`,
			'cache-control': 'no-store'
		}
	});
});
