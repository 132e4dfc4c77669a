/**
 * Password hashing with argon2id (OWASP's recommended parameters: 19 MiB, 2 iterations, 1 lane).
 */
import { hash, verify } from '@node-rs/argon2';

const ARGON2_OPTIONS = { memoryCost: 19456, timeCost: 2, outputLen: 32, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
	return hash(password, ARGON2_OPTIONS);
}

export function verifyPassword(hashed: string, password: string): Promise<boolean> {
	return verify(hashed, password, ARGON2_OPTIONS);
}
