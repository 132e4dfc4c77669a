import type { SubmitFunction } from '@sveltejs/kit';
import { invalidateAll } from '$app/navigation';

/**
 * A form's `use:enhance` that keeps what was typed once the answer is in (SvelteKit empties an enhanced form
 * by default): page data and form errors update, the fields stay, so a refused value can be corrected where
 * it stands. `onSuccess` runs after the page updated, when the action succeeded. With `reloadOnConflict`,
 * a 409 (someone else changed the record) also reloads the page data, as a page without JavaScript does,
 * so the form shows their values and carries their version beside what was typed; so does a 404 (someone
 * deleted it), so the record leaves the page.
 */
export function keepTyped(onSuccess?: () => void, options: { reloadOnConflict?: boolean } = {}): SubmitFunction {
	return () =>
		async ({ result, update }) => {
			await update({ reset: false });
			if (result.type === 'success') onSuccess?.();
			else if (options.reloadOnConflict && result.type === 'failure' && (result.status === 409 || result.status === 404))
				await invalidateAll();
		};
}
