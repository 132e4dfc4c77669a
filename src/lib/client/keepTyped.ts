import type { SubmitFunction } from '@sveltejs/kit';

/**
 * A form's `use:enhance` that keeps what was typed once the answer is in (SvelteKit empties an enhanced form
 * by default): page data and form errors update, the fields stay, so a refused value can be corrected where
 * it stands. `onSuccess` runs after the page updated, when the action succeeded.
 */
export function keepTyped(onSuccess?: () => void): SubmitFunction {
	return () =>
		async ({ result, update }) => {
			await update({ reset: false });
			if (result.type === 'success') onSuccess?.();
		};
}
