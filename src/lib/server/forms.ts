/**
 * Reading submitted forms in one typed way: every form action calls `readForm(request)` and asks for
 * its fields by name. A missing field or an uploaded file where text was expected reads as '' (the
 * zod schemas in ./validation then say what is required); nothing is coerced silently.
 */
import { splitTags } from './validation';

export interface FormFields {
	/** The field as typed, '' when absent (or when it holds a file). */
	text(name: string): string;
	/** A checkbox: true when sent as "on" (or any value but "off"/""). */
	checked(name: string): boolean;
	/** An uploaded file, or null. */
	file(name: string): File | null;
	/** Every text value sent under `name` (checkbox groups), in form order. */
	all(name: string): string[];
}

/** The submitted fields of a form action's request. */
export async function readForm(request: Request): Promise<FormFields> {
	const form = await request.formData();
	return fieldsOf(form);
}

/** The same reading for a FormData already in hand. */
export function fieldsOf(form: FormData): FormFields {
	return {
		text: (name) => {
			const v = form.get(name);
			return typeof v === 'string' ? v : '';
		},
		checked: (name) => {
			const v = form.get(name);
			return typeof v === 'string' && v !== '' && v !== 'off';
		},
		file: (name) => {
			const v = form.get(name);
			return v instanceof File ? v : null;
		},
		all: (name) => form.getAll(name).filter((v): v is string => typeof v === 'string')
	};
}

/** Reads the Shelf entry fields from a submitted form. */
export function shelfFieldsFrom(f: FormFields) {
	return {
		title: f.text('title'),
		species: f.text('species'),
		notation: f.text('notation'),
		notes: f.text('notes'),
		tags: splitTags(f.text('tags'))
	};
}
