import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { createToken, listTokens, revokeToken } from '$lib/server/services/tokens';
import { changePassword, signOutEverywhere } from '$lib/server/services/account';
import { startSession } from '$lib/server/session';
import { forAction, requireUser } from '$lib/server/http';
import { readForm } from '$lib/server/forms';

/** What the page says after a password change, reset or "sign out everywhere" (read from the redirect). */
function endedNotice(url: URL) {
	const ended = url.searchParams.get('ended');
	if (ended !== 'reset' && ended !== 'change' && ended !== 'everywhere') return null;
	const tokens = Math.max(0, Number(url.searchParams.get('tokens')) || 0);
	return { ended, tokens };
}

export const load: PageServerLoad = (event) => {
	const user = requireUser(event);
	return { tokens: listTokens(user), notice: endedNotice(event.url) };
};

export const actions: Actions = {
	create: async (event) => {
		const user = requireUser(event);
		const name = (await readForm(event.request)).text('name');
		const result = await forAction(() => createToken(user, name));
		return result.ok ? { secret: result.value.secret } : result.failure;
	},
	revoke: async (event) => {
		const user = requireUser(event);
		const id = (await readForm(event.request)).text('id');
		const result = await forAction(() => revokeToken(user, id));
		return result.ok ? { revoked: true } : result.failure;
	},
	/** Ends every session (this one too) and revokes every token; this browser gets a fresh session. */
	password: async (event) => {
		const user = requireUser(event);
		const form = await readForm(event.request);
		const input = { current: form.text('current'), password: form.text('password') };
		const result = await forAction(() => changePassword(user, input), { form: 'password' });
		if (!result.ok) return result.failure;
		await startSession(event.cookies, user.id);
		redirect(303, `/account?ended=change&tokens=${result.value.tokens}`);
	},
	/**
	 * Ends every session of the account and, when ticked, every API token. This browser gets a
	 * fresh session (a new id), so the person who pressed the button stays signed in here only.
	 */
	everywhere: async (event) => {
		const user = requireUser(event);
		const revokeTokens = (await readForm(event.request)).checked('tokens');
		const ended = signOutEverywhere(user, revokeTokens);
		await startSession(event.cookies, user.id);
		redirect(303, `/account?ended=everywhere&tokens=${ended.tokens}`);
	}
};
