/**
 * How every form shows what its action refused. A failed action returns `{ message, field?, form? }`
 * (`forAction` in $lib/server/http); the message goes next to the field it names when this form has
 * that field, and above the form's button otherwise, so nothing the server said is lost.
 * `form` tells apart the forms of a page with several actions: each such action echoes its name.
 */

export interface FormErrors {
	/** The message for this field (or a part of it: "tags" also takes "tags.2"), or null. */
	of(name: string): string | null;
	/** The id of the field's message, for aria-describedby. */
	idOf(name: string): string;
	/** Attributes to spread on the field: aria-invalid and aria-describedby while it has a message. */
	input(name: string): { 'aria-invalid'?: 'true'; 'aria-describedby'?: string };
	/** The message when it names no field of this form (or names none). */
	general: string | null;
}

const text = (v: unknown) => (typeof v === 'string' && v !== '' ? v : null);

/**
 * The errors of one form. `id` makes the message ids unique on the page (`$props.id()`), `fields`
 * are the names of the form's fields, `form` the action's name when the page has several.
 */
export function formErrors(failure: unknown, options: { id: string; fields: readonly string[]; form?: string }): FormErrors {
	const f = (failure ?? {}) as { message?: unknown; field?: unknown; form?: unknown };
	const mine = (f.form ?? undefined) === options.form;
	const message = mine ? text(f.message) : null;
	const field = text(f.field);
	const owner = field ? options.fields.find((name) => field === name || field.startsWith(`${name}.`)) : undefined;
	const of = (name: string) => (message && owner === name ? message : null);
	const idOf = (name: string) => `${options.id}-${name}-error`;
	return {
		of,
		idOf,
		input: (name) => (of(name) ? { 'aria-invalid': 'true', 'aria-describedby': idOf(name) } : {}),
		general: message && owner === undefined ? message : null
	};
}
