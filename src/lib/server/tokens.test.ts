/** Personal API tokens (common practice, no source): shown once, stored hashed, revocable. */
import { describe, expect, it } from 'vitest';
import { signUp } from './services/users';
import { actorForToken, createToken, listTokens, revokeToken } from './services/tokens';
import { db } from './db';
import { apiTokens } from './db/schema';

describe('API tokens', () => {
	it('a new token finds its owner; the database holds only a hash', async () => {
		const me = await signUp({ name: 'Scripter', email: 'script@example.org', password: 'long-enough-pw' });
		const { id, secret } = createToken(me, 'line list loader');
		expect(secret.startsWith('tw_')).toBe(true);
		expect(actorForToken(secret)?.id).toBe(me.id);
		expect(
			db
				.select()
				.from(apiTokens)
				.all()
				.some((t) => t.tokenHash === secret)
		).toBe(false);
		expect(listTokens(me)[0].lastUsedAt).not.toBeNull();
		revokeToken(me, id);
		expect(actorForToken(secret)).toBeNull();
	});

	it('rejects made-up tokens and empty names', async () => {
		expect(actorForToken('tw_not-a-real-token')).toBeNull();
		expect(actorForToken('something else')).toBeNull();
		const me = await signUp({ name: 'Other', email: 'other@example.org', password: 'long-enough-pw' });
		expect(() => createToken(me, '  ')).toThrow(/must not be empty/);
	});
});
