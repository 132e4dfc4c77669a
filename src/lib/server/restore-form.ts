/**
 * Reads the backup file of a restore form (multipart, field "file") and imports it as a new project.
 */
import type { Actor } from './access';
import { ServiceError } from './errors';
import { BACKUP_MAX_BYTES, importProject } from './services/backup';
import type { ImportReport } from '../api/types';
import type { FormFields } from './forms';

export type RestoreOutcome = { ok: true; report: ImportReport } | { ok: false; status: number; message: string };

export async function restoreFromForm(actor: Actor, form: FormFields): Promise<RestoreOutcome> {
	const file = form.file('file');
	if (!file || file.size === 0)
		return { ok: false, status: 400, message: 'Choose a backup file (a .json file made by “Download backup”) to restore' };
	if (file.size > BACKUP_MAX_BYTES)
		return { ok: false, status: 413, message: `The file is over ${BACKUP_MAX_BYTES / 1024 / 1024} MB; a project backup must be smaller` };
	try {
		return { ok: true, report: importProject(actor, await file.text()) };
	} catch (e) {
		if (e instanceof ServiceError) return { ok: false, status: e.status, message: e.message };
		throw e;
	}
}
