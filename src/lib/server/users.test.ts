/**
 * Sign-up and sign-in rules (common practice, no source): generic failure messages,
 * argon2id hashes, and a rate limit on failed attempts.
 */
import { describe, expect, it } from 'vitest';
import { checkPassword, signUp, SIGN_IN_FAILED } from './services/users';
import { createLimiter } from './rate-limit';
import { db } from './db';
import { users } from './db/schema';
import { eq } from 'drizzle-orm';

describe('accounts', () => {
	it('stores an argon2id hash, never the password', async () => {
		await signUp({ name: 'Hash Check', email: 'Hash@Example.org', password: 'correct horse battery' });
		const row = db.select().from(users).where(eq(users.email, 'hash@example.org')).get()!;
		expect(row.passwordHash.startsWith('$argon2id$')).toBe(true);
		expect(row.passwordHash).not.toContain('correct horse');
	});

	it('signs in with the right password, e-mail case ignored', async () => {
		const actor = await checkPassword({ email: 'HASH@example.org', password: 'correct horse battery' }, '10.0.0.1');
		expect(actor.email).toBe('hash@example.org');
	});

	it('says the same thing for an unknown e-mail and a wrong password', async () => {
		await expect(checkPassword({ email: 'hash@example.org', password: 'wrong password' }, '10.0.0.2')).rejects.toThrow(SIGN_IN_FAILED);
		await expect(checkPassword({ email: 'nobody@example.org', password: 'wrong password' }, '10.0.0.2')).rejects.toThrow(SIGN_IN_FAILED);
	});

	it('locks an account out after five failures in a row', async () => {
		await signUp({ name: 'Locked', email: 'locked@example.org', password: 'right-password-1' });
		for (let i = 0; i < 5; i++)
			await expect(checkPassword({ email: 'locked@example.org', password: 'nope-nope' }, '10.0.0.3')).rejects.toThrow(SIGN_IN_FAILED);
		await expect(checkPassword({ email: 'locked@example.org', password: 'right-password-1' }, '10.0.0.3')).rejects.toThrow(
			/Too many sign-in attempts/
		);
	});

	it('refuses short passwords and malformed e-mails with what is allowed', async () => {
		await expect(signUp({ name: 'A', email: 'a@example.org', password: 'short' })).rejects.toThrow(/at least 10 characters/);
		await expect(signUp({ name: 'A', email: 'not-an-email', password: 'long-enough-pw' })).rejects.toThrow(/name@example.org/);
	});
});

describe('rate limiter', () => {
	it('allows N hits per window and frees the key when the window ends', () => {
		let t = 0;
		const limiter = createLimiter(3, 1000, () => t);
		for (let i = 0; i < 3; i++) {
			expect(limiter.check('k')).toBe(0);
			limiter.hit('k');
		}
		expect(limiter.check('k')).toBe(1);
		t = 1000;
		expect(limiter.check('k')).toBe(0);
	});
});

describe('site roles', () => {
	it('only an admin lists users and changes site roles; the last admin stays admin', async () => {
		const { listUsers, setSiteRole } = await import('./services/users');
		const { ServiceError } = await import('./errors');
		const admin = db.select().from(users).where(eq(users.siteRole, 'admin')).get()!;
		const adminActor = { id: admin.id, email: admin.email, name: admin.name, siteRole: admin.siteRole };
		const member = await signUp({ name: 'Plain Member', email: 'plain@example.org', password: 'long-enough-pw' });
		expect(() => listUsers(member)).toThrow(ServiceError);
		expect(() => setSiteRole(adminActor, admin.id, 'member')).toThrow(/at least one admin/);
		setSiteRole(adminActor, member.id, 'admin');
		expect(listUsers(adminActor).find((u) => u.id === member.id)?.siteRole).toBe('admin');
		expect(() => setSiteRole(adminActor, member.id, 'superuser')).toThrow(/admin, member/);
	});
});
