import type { RequestEvent } from '@sveltejs/kit';

/** An export as a response; `?download` adds the attachment header with the file's name. */
export function fileResponse(event: RequestEvent, file: { body: string; type: string; filename: string }): Response {
	const download = event.url.searchParams.get('download') !== null;
	return new Response(file.body, {
		headers: { 'content-type': file.type, ...(download ? { 'content-disposition': `attachment; filename="${file.filename}"` } : {}) }
	});
}
