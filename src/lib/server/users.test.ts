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

	it('wrong passwords from one address do not lock out the right password from another', async () => {
		await signUp({ name: 'Locked', email: 'locked@example.org', password: 'right-password-1' });
		for (let i = 0; i < 8; i++)
			await expect(checkPassword({ email: 'locked@example.org', password: 'nope-nope' }, '10.0.0.3')).rejects.toThrow(
				i < 5 ? SIGN_IN_FAILED : /Too many failed sign-ins from this address/
			);
		// The attacker's pair waits, even with the right password …
		await expect(checkPassword({ email: 'locked@example.org', password: 'right-password-1' }, '10.0.0.3')).rejects.toThrow(
			/try again in 30 seconds/
		);
		// … while the owner, from their own address, signs in at once.
		await expect(checkPassword({ email: 'locked@example.org', password: 'right-password-1' }, '192.0.2.7')).resolves.toMatchObject({
			email: 'locked@example.org'
		});
	});

	it('parallel guesses from one pair cannot all slip past the backoff', async () => {
		await signUp({ name: 'Parallel', email: 'parallel@example.org', password: 'right-password-2' });
		const guesses = Array.from({ length: 12 }, () =>
			checkPassword({ email: 'parallel@example.org', password: 'nope-nope' }, '10.0.0.9').catch((e: Error) => e.message)
		);
		const answers = await Promise.all(guesses);
		expect(answers.filter((m) => m === SIGN_IN_FAILED).length).toBeLessThanOrEqual(5);
	});

	it('refuses short passwords and malformed e-mails with what is allowed', async () => {
		await expect(signUp({ name: 'A', email: 'a@example.org', password: 'short' })).rejects.toThrow(/at least 10 characters/);
		await expect(signUp({ name: 'A', email: 'not-an-email', password: 'long-enough-pw' })).rejects.toThrow(/name@example.org/);
	});
});

describe('backoff limiter', () => {
	// The schedule is ours (common practice, no source): 4 free, then 30 s doubling to 15 min.
	it('waits 30 s, 1 min, 2 min … 15 min after the free failures; a success forgets', async () => {
		const { createBackoffLimiter } = await import('./rate-limit');
		let t = 0;
		const limiter = createBackoffLimiter({ freeFailures: 4, baseMs: 30_000, maxMs: 900_000, forgetMs: 86_400_000 }, () => t);
		const waits = Array.from({ length: 10 }, () => limiter.fail('pair'));
		expect(waits).toEqual([0, 0, 0, 0, 30_000, 60_000, 120_000, 240_000, 480_000, 900_000]);
		expect(limiter.waitMs('pair')).toBe(900_000);
		expect(limiter.waitMs('other pair')).toBe(0);
		t += 900_000;
		expect(limiter.waitMs('pair')).toBe(0);
		expect(limiter.fail('pair')).toBe(900_000);
		limiter.succeed('pair');
		expect(limiter.fail('pair')).toBe(0);
		t += 86_400_000;
		expect(limiter.waitMs('pair')).toBe(0);
	});

	it('a looser per-address cap stops spraying many accounts from one address', async () => {
		const { SIGN_IN_ADDRESS_LIMIT } = await import('./services/users');
		for (let i = 0; i < SIGN_IN_ADDRESS_LIMIT.failures; i++)
			await expect(checkPassword({ email: `spray${i}@example.org`, password: 'nope-nope' }, '198.51.100.1')).rejects.toThrow(
				SIGN_IN_FAILED
			);
		await expect(checkPassword({ email: 'hash@example.org', password: 'correct horse battery' }, '198.51.100.1')).rejects.toThrow(
			/Too many failed sign-ins/
		);
		await expect(checkPassword({ email: 'hash@example.org', password: 'correct horse battery' }, '198.51.100.2')).resolves.toBeTruthy();
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
