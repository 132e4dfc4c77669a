/**
 * Reads the upload form of the Lists page: which kind of list, its name, and the CSV text — from the file
 * field, or (on "Save" after a preview) from the hidden field that carries the previewed text back.
 */
import type { FormFields } from './forms';
import { ServiceError } from './errors';
import { MAX_UPLOAD_BYTES, UPLOAD_LIMITS_TEXT } from '../lines/uploads';
import type { ListKind } from './services/lists';

export interface UploadForm {
	kind: ListKind;
	name: string;
	csv: string;
	fileName: string;
}

export async function readUploadForm(form: FormFields): Promise<UploadForm> {
	const kind: ListKind = form.text('kind') === 'lines' ? 'lines' : 'levels';
	const carried = form.text('csv');
	const file = form.file('file');
	if (!carried && (!file || file.size === 0))
		throw new ServiceError(400, `Choose a CSV file to upload (${UPLOAD_LIMITS_TEXT})`, { field: 'file' });
	if (!carried && file && file.size > MAX_UPLOAD_BYTES)
		throw new ServiceError(413, `The file is ${(file.size / 1024 / 1024).toFixed(1)} MB; an upload may be ${UPLOAD_LIMITS_TEXT}`, {
			field: 'file'
		});
	const fileName = file?.name || form.text('fileName');
	const name = form.text('name').trim() || fileName.replace(/\.[^.]*$/, '');
	return { kind, name, csv: carried || (await file!.text()), fileName };
}
