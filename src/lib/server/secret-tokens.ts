/**
 * Secrets that travel to one person (a reset or invitation link, an API token) and are stored only
 * as their SHA-256: a copy of the database opens nothing. 32 random bytes (256 bits) make
 * guessing hopeless, so a fast hash is enough (common practice, no source; unlike passwords,
 * these secrets are not chosen by people and need no slow hash).
 */
import { createHash, randomBytes } from 'node:crypto';

/** The hex SHA-256 of a secret, as the database keeps it. */
export const hashSecret = (secret: string): string => createHash('sha256').update(secret).digest('hex');

/** A new URL-safe secret (base64url of `bytes` random bytes) and the hash to store. */
export function newSecret(bytes = 32, prefix = ''): { secret: string; hash: string } {
	const secret = prefix + randomBytes(bytes).toString('base64url');
	return { secret, hash: hashSecret(secret) };
}
