/**
 * Account safety: changing the password, and ending every way in (sessions and personal API
 * tokens). A password change or reset means "someone else may know the old one", so it ends
 * every session and revokes every API token of the account in the same transaction as the new
 * hash; the route then opens one fresh session for the person who just proved who they are.
 */
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { apiTokens, sessions, users } from '../db/schema';
import type { Actor } from '../access';
import { badRequest } from '../errors';
import { hashPassword, verifyPassword } from '../password';
import { parseInput, passwordSchema } from '../validation';

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** What ending every way into an account removed. */
export interface AccessEnded {
	sessions: number;
	tokens: number;
}

/** Deletes every session and every personal API token of `userId` (inside the caller's transaction). */
export function endAllAccess(tx: Tx, userId: string): AccessEnded {
	const s = tx.delete(sessions).where(eq(sessions.userId, userId)).run();
	const t = tx.delete(apiTokens).where(eq(apiTokens.userId, userId)).run();
	return { sessions: s.changes, tokens: t.changes };
}

/** Sets a new password hash and ends all access, in one transaction. */
export function replacePassword(userId: string, passwordHash: string, extra?: (tx: Tx) => void): AccessEnded {
	return db.transaction((tx) => {
		tx.update(users).set({ passwordHash }).where(eq(users.id, userId)).run();
		extra?.(tx);
		return endAllAccess(tx, userId);
	});
}

const changeSchema = z.object({
	current: z
		.string({ error: 'Current password must be text' })
		.min(1, 'Type your current password')
		.max(200, 'Password must be at most 200 characters'),
	password: passwordSchema
});

/**
 * Changes the password of the signed-in account after checking the current one. Every session
 * (this one too) ends and every API token is revoked; the caller starts a new session.
 * Throws 400 (field `current`) when the current password is wrong, 400 (field `password`) when
 * the new one breaks the rules or equals the old one.
 */
export async function changePassword(actor: Actor, input: unknown): Promise<AccessEnded> {
	const data = parseInput(changeSchema, input);
	const user = db.select().from(users).where(eq(users.id, actor.id)).get();
	if (!user || !(await verifyPassword(user.passwordHash, data.current)))
		throw badRequest('The current password is not right', { field: 'current' });
	if (data.current === data.password) throw badRequest('The new password must differ from the current one', { field: 'password' });
	return replacePassword(actor.id, await hashPassword(data.password));
}

/**
 * "Sign out everywhere": ends every session of the account (this one too), and with
 * `revokeTokens` every personal API token as well, in one transaction.
 */
export function signOutEverywhere(actor: Actor, revokeTokens = false): AccessEnded {
	return db.transaction((tx) => {
		if (revokeTokens) return endAllAccess(tx, actor.id);
		return { sessions: tx.delete(sessions).where(eq(sessions.userId, actor.id)).run().changes, tokens: 0 };
	});
}
