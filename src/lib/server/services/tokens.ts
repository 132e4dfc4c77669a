/**
 * Personal API tokens. The token is shown once at creation; the database keeps its SHA-256.
 * A token acts with its owner's roles, exactly like a signed-in session.
 */
import { and, desc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { apiTokens, users } from '../db/schema';
import type { Actor } from '../access';
import { notFound } from '../errors';
import { newId } from '../ids';
import { parseInput } from '../validation';
import { hashSecret, newSecret } from '../secret-tokens';

const TOKEN_PREFIX = 'tw_';
const nameSchema = z.string().trim().min(1, 'Token name must not be empty').max(60, 'Token name must be at most 60 characters');

export function listTokens(actor: Actor) {
	return db
		.select({ id: apiTokens.id, name: apiTokens.name, createdAt: apiTokens.createdAt, lastUsedAt: apiTokens.lastUsedAt })
		.from(apiTokens)
		.where(eq(apiTokens.userId, actor.id))
		.orderBy(desc(apiTokens.createdAt))
		.all();
}

/** Creates a token and returns its secret, which is not stored and cannot be shown again. */
export function createToken(actor: Actor, name: unknown): { id: string; secret: string } {
	const cleanName = parseInput(nameSchema, name);
	const { secret, hash } = newSecret(24, TOKEN_PREFIX);
	const id = newId();
	db.insert(apiTokens).values({ id, userId: actor.id, name: cleanName, tokenHash: hash }).run();
	return { id, secret };
}

export function revokeToken(actor: Actor, tokenId: string) {
	const result = db
		.delete(apiTokens)
		.where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, actor.id)))
		.run();
	if (result.changes === 0) throw notFound('No such token');
}

/** The account behind a bearer token, or null. */
export function actorForToken(secret: string): Actor | null {
	if (!secret.startsWith(TOKEN_PREFIX) || secret.length > 100) return null;
	const row = db
		.select({ tokenId: apiTokens.id, id: users.id, email: users.email, name: users.name, siteRole: users.siteRole })
		.from(apiTokens)
		.innerJoin(users, eq(users.id, apiTokens.userId))
		.where(eq(apiTokens.tokenHash, hashSecret(secret)))
		.get();
	if (!row) return null;
	db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.tokenId)).run();
	return { id: row.id, email: row.email, name: row.name, siteRole: row.siteRole };
}
