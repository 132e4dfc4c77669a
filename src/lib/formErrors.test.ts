/**
 * How a refused form action's message is placed (common practice, no source: WAI-ARIA
 * aria-invalid + aria-describedby for a field's error; a message for no field goes to the form).
 */
import { describe, expect, it } from 'vitest';
import { render } from 'svelte/server';
import { formErrors } from './formErrors';
import ShelfForm from './components/ShelfForm.svelte';

const fields = ['title', 'tags'];

describe('formErrors', () => {
	it('puts a message that names a field of the form on that field only', () => {
		const e = formErrors({ message: 'Title must not be empty', field: 'title' }, { id: 'f', fields });
		expect(e.of('title')).toBe('Title must not be empty');
		expect(e.of('tags')).toBeNull();
		expect(e.input('title')).toEqual({ 'aria-invalid': 'true', 'aria-describedby': 'f-title-error' });
		expect(e.input('tags')).toEqual({});
		expect(e.general).toBeNull();
	});

	it('gives a part of a field (zod path "tags.2") to the field', () => {
		const e = formErrors({ message: 'A tag must not be empty', field: 'tags.2' }, { id: 'f', fields });
		expect(e.of('tags')).toBe('A tag must not be empty');
		expect(e.general).toBeNull();
	});

	it('shows a message for no field, or for a field the form does not have, for the whole form', () => {
		expect(formErrors({ message: 'Too many sign-ins' }, { id: 'f', fields }).general).toBe('Too many sign-ins');
		const stale = formErrors({ message: 'Someone changed it', field: 'version' }, { id: 'f', fields });
		expect(stale.general).toBe('Someone changed it');
		expect(stale.of('title')).toBeNull();
	});

	it('takes the failure only when it is this form’s (a page with several actions names them)', () => {
		const failure = { message: 'The current password is not right', field: 'current', form: 'password' };
		expect(formErrors(failure, { id: 'a', fields: ['current'], form: 'password' }).of('current')).toBe(failure.message);
		expect(formErrors(failure, { id: 'b', fields: ['name'] }).general).toBeNull();
		expect(formErrors({ message: 'No such token' }, { id: 'c', fields: ['current'], form: 'password' }).general).toBeNull();
	});

	it('has nothing to show for a success or no answer', () => {
		for (const answer of [null, undefined, { saved: true }]) {
			const e = formErrors(answer, { id: 'f', fields });
			expect([e.general, e.of('title')]).toEqual([null, null]);
		}
	});
});

describe('a form using it (the Shelf form, rendered)', () => {
	const values = { title: '', species: '', notation: '3d2', notes: '', tags: 'a;b' };
	const html = (failure: Record<string, unknown> | null) =>
		render(ShelfForm, { props: { values, failure, action: '', submitLabel: 'Save' } }).body;

	it('shows the message right under the field at fault, which points to it', () => {
		const body = html({ message: 'A tag may hold letters, digits, spaces and . _ + - /', field: 'tags.0' });
		const input = body.match(/<input[^>]*name="tags"[^>]*>/)![0];
		const describedBy = input.match(/aria-describedby="([^"]+)"/)![1];
		expect(input).toContain('aria-invalid="true"');
		// The next element after the field is its message, with the id the field names.
		const after = body.slice(body.indexOf(input) + input.length);
		expect(after).toMatch(new RegExp(`^\\s*(<!--[^>]*-->\\s*)*<span id="${describedBy}"[^>]*role="alert"[^>]*>A tag may hold`));
		// Only the field at fault is marked; nothing is repeated above the button.
		expect(body.match(/aria-invalid="true"/g)).toHaveLength(1);
		expect(body).not.toContain('data-testid="form-error"');
	});

	it('shows a message for no field above the button', () => {
		const body = html({ message: 'This entry was changed by someone else' });
		expect(body).not.toContain('aria-invalid');
		expect(body).toMatch(/data-testid="form-error"[^>]*>This entry was changed by someone else<\/p>/);
	});
});
