/** Reads the Shelf entry fields from a submitted form. */
import { splitTags } from './validation';

export function shelfFieldsFrom(form: FormData) {
	return {
		title: String(form.get('title') ?? ''),
		species: String(form.get('species') ?? ''),
		notation: String(form.get('notation') ?? ''),
		notes: String(form.get('notes') ?? ''),
		tags: splitTags(String(form.get('tags') ?? ''))
	};
}
